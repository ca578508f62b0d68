// The SPICE hand-off: ladders with every element kind exported by spiceNetlist, instanced on an
// R-L or R-C load and driven by a 1 A AC current source, so that ngspice's V(in) is the input
// impedance. Checked against sweep to 1e-6 relative: across the band for lossless ladders (the
// export's lines keep their physical length), at the export's frequency where a part has finite Q
// (its ESR holds there only).
import { beforeAll, describe, expect, it } from 'vitest'
import { RfInputError, rlcImpedance, spiceLadder, spiceNetlist, sweep, type Element } from '../../../shared/rf/index'
import { acLin, requireNgspice, runAc } from './ngspice-run'
import { esrOf } from './real-parts-cases'
import { complexError, REL_TOL } from './reference'

const SOURCE = 'ngspice 39 AC analysis of the exported subcircuit'
const F0 = 900e6

type Load = { r: number, l?: number, c?: number }
type Case = { name: string, load: Load, elements: Element[], band?: [number, number, number] }

const line = (z0: number, deg: number): Element => ({ kind: 'line', z0, deg, fRef: F0 })
const stub = (end: 'open' | 'short', placement: 'series' | 'shunt', z0: number, deg: number): Element =>
  ({ kind: 'stub', end, placement, z0, deg, fRef: F0 })

// Every kind in one ladder, ordered so that ngspice's DC operating point exists (no loop of
// inductors, lines, shorted stubs and the transformer's source without a resistor or capacitor).
const LOSSLESS_EVERY_KIND: Element[] = [
  { kind: 'L', placement: 'series', value: 6.8e-9 },
  stub('open', 'shunt', 50, 35),
  { kind: 'C', placement: 'series', value: 1.5e-12 },
  stub('short', 'shunt', 60, 25),
  line(75, 40),
  stub('open', 'series', 40, 50),
  { kind: 'L', placement: 'shunt', value: 12e-9 },
  stub('short', 'series', 55, 30),
  { kind: 'R', placement: 'series', value: 4.7 },
  { kind: 'xfmr', ratio: 1.4 },
  { kind: 'R', placement: 'shunt', value: 330 },
]

const CASES: Case[] = [
  { name: 'every kind, lossless, 700–1100 MHz', load: { r: 30, c: 2e-12 }, elements: LOSSLESS_EVERY_KIND, band: [41, 700e6, 1100e6] },
  {
    name: 'pi network, lossless, 2.3–2.6 GHz',
    load: { r: 10, l: 1e-9 },
    elements: [
      { kind: 'C', placement: 'shunt', value: 2.7e-12 },
      { kind: 'L', placement: 'series', value: 2.2e-9 },
      { kind: 'C', placement: 'shunt', value: 1.2e-12 },
    ],
    band: [31, 2.3e9, 2.6e9],
  },
  {
    name: 'shunt parts only (the ports are one node), 100–200 MHz',
    load: { r: 75, l: 20e-9 },
    elements: [{ kind: 'C', placement: 'shunt', value: 10e-12 }, { kind: 'R', placement: 'shunt', value: 120 }],
    band: [11, 100e6, 200e6],
  },
  {
    name: 'every kind with finite-Q L and C, lines without fRef, at 900 MHz',
    load: { r: 22, c: 3.3e-12 },
    elements: [
      { kind: 'L', placement: 'series', value: 8.2e-9, q: 40 },
      { kind: 'C', placement: 'shunt', value: 2.2e-12, q: 150 },
      { kind: 'R', placement: 'series', value: 3 },
      { kind: 'line', z0: 50, deg: 28 },
      { kind: 'stub', end: 'short', placement: 'shunt', z0: 70, deg: 33 },
      { kind: 'stub', end: 'open', placement: 'series', z0: 45, deg: 62 },
      { kind: 'L', placement: 'shunt', value: 15e-9, q: 30 },
      { kind: 'stub', end: 'short', placement: 'series', z0: 35, deg: 20 },
      { kind: 'stub', end: 'open', placement: 'shunt', z0: 90, deg: 48 },
      { kind: 'xfmr', ratio: 0.7 },
      { kind: 'C', placement: 'series', value: 4.7e-12, q: 90 },
      { kind: 'R', placement: 'shunt', value: 500 },
    ],
  },
  {
    // Q tables pass through F0, so the ESR there is the table's own Q (checked below).
    name: 'part models: Q tables, self-resonance, ESL and pads, at 900 MHz',
    load: { r: 12, l: 1.5e-9 },
    elements: [
      { kind: 'C', placement: 'shunt', value: 4.7e-12, model: { q: [[2e8, 900], [9e8, 380], [6e9, 70]], esl: 0.35e-9, padC: 0.12e-12 } },
      { kind: 'L', placement: 'series', value: 3.9e-9, model: { q: [[1e8, 28], [9e8, 62], [3e9, 41]], srf: 6.2e9, padC: 0.18e-12 } },
      { kind: 'C', placement: 'series', value: 2.2e-12, q: 250, model: { esl: 0.5e-9 } },
      { kind: 'L', placement: 'shunt', value: 8.2e-9, q: 45, model: { srf: 4.1e9, padC: 0.1e-12 } },
    ],
  },
  {
    name: 'special values: L and line of 0 (wires), C of 0 and an open stub of 0° (opens), at 900 MHz',
    load: { r: 50, c: 4e-12 },
    elements: [
      { kind: 'L', placement: 'series', value: 0, q: 50 },
      { kind: 'C', placement: 'shunt', value: 0 },
      { kind: 'line', z0: 50, deg: 0 },
      { kind: 'R', placement: 'series', value: 10 },
      { kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 0 },
      { kind: 'stub', end: 'short', placement: 'series', z0: 50, deg: 0 },
      { kind: 'C', placement: 'shunt', value: 3e-12, q: 120 },
    ],
  },
]

/** What the board export writes for the case, and ngspice's input impedance at each frequency. */
function simulate(c: Case) {
  const text = spiceNetlist(c.elements, { name: 'match', frequency: F0, title: [`Board: ${c.name}`] })
  const loadPart = c.load.l !== undefined ? `LL lm 0 ${c.load.l}` : `CL lm 0 ${c.load.c}`
  const body = [text, 'X1 in ld match', `RL ld lm ${c.load.r}`, loadPart, 'I1 0 in AC 1']
  const analysis = c.band ? acLin(...c.band) : acLin(1, F0)
  const [rows] = runAc(`spice export: ${c.name}`, ['.option rshunt=1e15'], body, [{ analysis, vectors: ['v(in)'] }])
  return { text, rows: rows! }
}

const runs = new Map<string, ReturnType<typeof simulate>>()

beforeAll(() => {
  requireNgspice()
  for (const c of CASES) runs.set(c.name, simulate(c))
}, 60_000)

describe(`spiceNetlist against ${SOURCE}`, () => {
  it.each(CASES.map(c => [c.name, c] as const))('%s: input impedance against sweep to 1e-6', (_name, c) => {
    const { rows } = runs.get(c.name)!
    expect(rows.length).toBe(c.band ? c.band[0] : 1)
    const frequencies = rows.map(r => r.frequency)
    const load = frequencies.map(f => rlcImpedance({ topology: 'series', ...c.load }, f))
    // A single-frequency case's lines have no fRef: the export took them at F0, as sweep must.
    const elements = c.elements.map(e => (e.kind === 'line' || e.kind === 'stub') && e.fRef === undefined ? { ...e, fRef: F0 } : e)
    const ours = sweep({ z0: 50, frequencies, load, elements })
    let worst = 0
    rows.forEach((r, k) => { worst = Math.max(worst, complexError(ours[k]!, r.values[0]!)) })
    expect(worst, `source: ${SOURCE}`).toBeLessThanOrEqual(REL_TOL)
  })

  it.each([3, 4])('writes each finite-Q ESR as |X|/Q at the given frequency (case %i, checked apart from the RF core)', (index) => {
    const c = CASES[index]!
    const { text } = runs.get(c.name)!
    let checked = 0
    c.elements.forEach((e, k) => {
      if (e.kind !== 'L' && e.kind !== 'C') return
      // A Q table's row at F0 is the Q there.
      const q = e.model?.q?.find(([hz]) => hz === F0)?.[1] ?? e.q
      if (q === undefined) return
      const found = text.match(new RegExp(`^RQ${k + 1} \\S+ \\S+ (\\S+)$`, 'm'))
      expect(found, `ESR resistor of element ${k}`).not.toBeNull()
      const expected = esrOf({ ...e, q, model: undefined }, F0)
      expect(Math.abs(Number(found![1]) - expected) / expected).toBeLessThan(1e-12)
      checked++
    })
    expect(checked).toBeGreaterThanOrEqual(4)
  })

  it('names the subcircuit and its ports, source side first, under a header comment', () => {
    const text = runs.get(CASES[0]!.name)!.text
    const lines = text.trim().split('\n')
    const head = lines.findIndex(l => l.startsWith('.subckt'))
    expect(lines[head]).toBe('.subckt match src ld')
    expect(lines.at(-1)).toBe('.ends match')
    expect(lines.slice(0, head).every(l => l.startsWith('*'))).toBe(true)
    expect(lines[0]).toBe(`* Board: ${CASES[0]!.name}`)
    expect(lines.slice(0, head).join('\n')).toMatch(/src \(source side\), ld \(load side\)/)
    expect(lines.slice(0, head).join('\n')).toMatch(/900000000 Hz/)
  })
})

describe('spiceNetlist input rules', () => {
  it('makes a SPICE identifier of any name', () => {
    expect(spiceNetlist([], { name: 'LNA input #2', frequency: 1e9 })).toMatch(/^\.subckt LNA_input__2 src ld$/m)
    expect(spiceNetlist([], { name: '2nd stage', frequency: 1e9 })).toMatch(/^\.subckt x_2nd_stage src ld$/m)
  })

  it('refuses a measured block, bad elements, a bad frequency and an empty name, naming the argument', () => {
    const bad = (f: () => unknown, argument: string) => {
      expect(f).toThrow(RfInputError)
      try { f() }
      catch (e) { expect((e as RfInputError).argument).toBe(argument) }
    }
    bad(() => spiceNetlist([{ kind: 'L', placement: 'series', value: 1e-9 }, { kind: 'block', uploadId: 'u1' }], { name: 'a', frequency: 1e9 }), 'elements[1]')
    bad(() => spiceNetlist([{ kind: 'C', placement: 'series', value: -1 } as Element], { name: 'a', frequency: 1e9 }), 'elements[0].value')
    bad(() => spiceNetlist([{ kind: 'C', placement: 'shunt', value: 1e-12, measured: { uploadId: 'u2', fixture: 'shunt' } }], { name: 'a', frequency: 1e9 }), 'elements[0].measured')
    bad(() => spiceNetlist([], { name: 'a', frequency: 0 }), 'frequency')
    bad(() => spiceNetlist([], { name: ' ', frequency: 1e9 }), 'name')
  })

  it('lists the node on the load side of each element and the ammeters when probed', () => {
    const l = spiceLadder([{ kind: 'C', placement: 'shunt', value: 1e-12 }, { kind: 'L', placement: 'series', value: 1e-9 }, { kind: 'line', z0: 50, deg: 10 }], { name: 'p', frequency: 1e9, probes: true })
    expect(l.nodes).toEqual(['ld', 'ld', 'n1', 'src'])
    expect(l.ammeters).toEqual(['VA1', 'VA2', 'VA3'])
    expect(l.far).toEqual([null, null, 'VB3'])
  })
})
