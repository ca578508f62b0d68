// Independent check of the RF core against ngspice AC analysis: random ladders (fixed seed) of
// L, C and R in series and shunt (some with finite Q, the ESR added as a resistor in series with
// the part, valued at the analysis frequency), lossless lines and stubs as SPICE T elements
// (TD = deg/(360·fRef)) and ideal transformers (E + F sources), on random loads, each ladder written
// by the product's own export (spiceNetlist) as one subcircuit. The circuits go
// into two netlists (R-L-C ladders, and ladders with lines, stubs and transformers), each holding
// its circuits as independent networks driven by their own 1 A AC current source so that
// V(in_k) = Zin_k, with one `ac` run per analysis frequency: ngspice start-up is what costs time.
import { beforeAll, describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import { inputImpedance, spiceNetlist, type Complex, type Element } from '../../../shared/rf/index'
import { acLin, requireNgspice, runAc } from './ngspice-run'
import { REL_TOL, complexError } from './reference'
import { randomLadder } from './random-ladders'

const SOURCE = 'ngspice AC analysis'
const FREQUENCIES = [1e6, 13.56e6, 100e6, 433.92e6, 915e6, 2.45e9]
const PER_FREQUENCY = 40 // 240 circuits

type Batch = 'lumped' | 'distributed'
type Circuit = {
  id: number
  batch: Batch
  frequency: number
  load: { r: number; l?: number; c?: number }
  elements: Element[]
  inputNode?: string
}

/**
 * A distributed ladder made solvable at DC, which ngspice needs before an AC run when the circuit
 * holds T, E or F elements (its NOOPAC option only applies to R-L-C circuits): every inductor has
 * a finite Q (its ESR breaks loops of inductors, lines and shorted stubs), and no series capacitor
 * or series open stub cuts a node off from ground. The RF core is checked on the same ladder.
 */
function dcSafe(e: Element, rng: () => number): Element {
  if (e.kind === 'L' && e.q === undefined) return { ...e, q: 20 + rng() * 200 }
  if (e.kind === 'C' && e.placement === 'series') return { ...e, placement: 'shunt' }
  if (e.kind === 'stub' && e.placement === 'series' && e.end === 'open') return { ...e, end: 'short' }
  return e
}

function makeCircuits(): Circuit[] {
  const rng = seedrandom('gammaboard-ngspice-ladders')
  const out: Circuit[] = []
  for (const f of FREQUENCIES) {
    for (let k = 0; k < PER_FREQUENCY; k++) {
      const w = 2 * Math.PI * f
      const batch: Batch = k % 2 === 0 ? 'lumped' : 'distributed'
      const r = 10 ** (rng() * 2.7)
      const x = (rng() - 0.5) * 600
      // Distributed circuits get an R + L load so that the load end has a DC path.
      const load = x > 0 || batch === 'distributed' ? { r, l: Math.abs(x) / w + 1e-12 } : { r, c: -1 / (w * x) }
      const length = 1 + Math.floor(rng() * 8)
      const elements = batch === 'lumped'
        ? randomLadder(rng, f, { length, kinds: ['L', 'C', 'R'] })
        : randomLadder(rng, f, { length, kinds: ['L', 'C', 'R', 'line', 'line', 'stub', 'stub', 'xfmr'] }).map((e) => dcSafe(e, rng))
      out.push({ id: out.length, batch, frequency: f, load, elements })
    }
  }
  return out
}

const num = (v: number) => v.toPrecision(17)

/** The circuit's lines: its ladder as the product exports it, instanced on its load, driven by 1 A into `in<k>`. */
function deckOf(c: Circuit): string[] {
  const k = c.id
  const load = c.load.l !== undefined ? `LL${k} l${k} 0 ${num(c.load.l)}` : `CL${k} l${k} 0 ${num(c.load.c!)}`
  c.inputNode = `in${k}`
  return [
    `* circuit ${k} at ${c.frequency} Hz`,
    spiceNetlist(c.elements, { name: `c${k}`, frequency: c.frequency }),
    `X${k} in${k} ld${k} c${k}`,
    `RL${k} ld${k} l${k} ${num(c.load.r)}`, load,
    `I${k} 0 in${k} AC 1`,
  ]
}

const circuits = makeCircuits()
const results = new Map<number, Complex>()

function runBatch(batch: Batch): void {
  const members = circuits.filter((c) => c.batch === batch)
  const body = members.flatMap(deckOf)
  const groups = FREQUENCIES.map(f => members.filter((c) => c.frequency === f))
  // rshunt (1e-18 S at every node) gives capacitor-only nodes a DC path; noopac skips the DC
  // operating point of the R-L-C batch, which a linear AC run does not need.
  const options = batch === 'lumped' ? ['.option rshunt=1e18 noopac'] : ['.option rshunt=1e18']
  const runs = runAc(`gammaboard ${batch} ladders`, options, body, FREQUENCIES.map((f, j) => ({
    analysis: acLin(1, f),
    vectors: groups[j]!.map((c) => `v(${c.inputNode})`),
  })))
  runs.forEach((rows, j) => groups[j]!.forEach((c, i) => results.set(c.id, rows[0]!.values[i]!)))
}

beforeAll(() => {
  requireNgspice()
  runBatch('lumped')
  runBatch('distributed')
}, 60_000)

describe(`trace against ${SOURCE} (${circuits.length} random ladders, two netlists)`, () => {
  it('covers at least 200 ladders, with finite-Q parts, lines, stubs and transformers among them', () => {
    expect(circuits.length).toBeGreaterThanOrEqual(200)
    const all = circuits.flatMap((c) => c.elements)
    expect(all.filter((e) => 'q' in e && e.q !== undefined).length).toBeGreaterThan(50)
    for (const kind of ['line', 'stub', 'xfmr', 'R'] as const) expect(all.some((e) => e.kind === kind)).toBe(true)
  })

  it('agrees on every ladder to 1e-6 relative, worst case included', () => {
    let worst = 0
    for (const c of circuits) {
      const w = 2 * Math.PI * c.frequency
      const load = { re: c.load.r, im: c.load.l !== undefined ? w * c.load.l : -1 / (w * c.load.c!) }
      worst = Math.max(worst, complexError(inputImpedance({ z0: 50, frequency: c.frequency, load, elements: c.elements }), results.get(c.id)!, 1e-9))
    }
    if (process.env.RF_REPORT) console.log(`worst relative difference against ngspice: ${worst.toExponential(2)}`)
    expect(worst, `source: ${SOURCE}`).toBeLessThanOrEqual(REL_TOL)
  })

  it.each(circuits.map((c) => [c.id, c.frequency, c.elements.map((e) => e.kind).join(' '), c] as const))(
    'ladder %i at %d Hz: %s',
    (_id, f, _kinds, c) => {
      const w = 2 * Math.PI * f
      const load = { re: c.load.r, im: c.load.l !== undefined ? w * c.load.l : -1 / (w * c.load.c!) }
      const ours = inputImpedance({ z0: 50, frequency: f, load, elements: c.elements })
      const spice = results.get(c.id)!
      expect(complexError(ours, spice, 1e-9), `source: ${SOURCE}; ours ${ours.re}${ours.im >= 0 ? '+' : ''}${ours.im}j, ngspice ${spice.re}${spice.im >= 0 ? '+' : ''}${spice.im}j`).toBeLessThanOrEqual(REL_TOL)
    },
  )
})
