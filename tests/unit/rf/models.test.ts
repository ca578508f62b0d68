// Component models (shared/rf/models.ts) against ngspice AC analysis (Debian's ngspice 39): each
// model's parasitic circuit is written out as a netlist — an inductor as L in series with its ESR
// and Cp = 1/((2π·srf)²·L) across both, a capacitor as C, ESL and ESR in series, pads as capacitors
// to ground — and driven by a 1 A AC source so V(in) = Zin. The ESR at each frequency comes from
// the Q table evaluated here independently, as the power law Q = Q_k·(f/f_k)^s between table
// points (the same log-log line, written another way) and held at the ends; every frequency is
// its own netlist, since ngspice has no frequency-dependent resistor in plain AC analysis.
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  dragElement, dragLocus, elementImpedance, elementStress, gammaOf, ladderSParameters, lossesAt, partQAt, returnLossDb,
  runMonteCarlo, selfResonanceHz, sweep, trace,
  validateElements, type Complex, type Element, type PartModel,
} from '../../../shared/rf/index'
import { REL_TOL, complexError } from './reference'

const SOURCE = 'ngspice 39 AC analysis of the model\'s parasitic circuit'
const FREQUENCIES = [50e6, 300e6, 1e9, 2.2e9, 4.5e9, 8e9]
const Q_L: PartModel['q'] = [[1e8, 28], [1e9, 62], [3e9, 41]]
const Q_C: PartModel['q'] = [[2e8, 900], [1e9, 380], [6e9, 70]]

type Lumped = Extract<Element, { kind: 'L' | 'C' }>
type Circuit = { name: string; load: { r: number; l: number }; elements: Element[] }

const circuits: Circuit[] = [
  { name: 'series L: Q table, srf, pads', load: { r: 30, l: 4e-9 }, elements: [{ kind: 'L', placement: 'series', value: 12e-9, model: { q: Q_L, srf: 3.6e9, padC: 0.25e-12 } }] },
  { name: 'shunt L: Q table, srf, pad', load: { r: 120, l: 2e-9 }, elements: [{ kind: 'L', placement: 'shunt', value: 6.8e-9, model: { q: Q_L, srf: 5.1e9, padC: 0.2e-12 } }] },
  { name: 'series C: Q table, ESL, pads', load: { r: 18, l: 1e-9 }, elements: [{ kind: 'C', placement: 'series', value: 2.2e-12, model: { q: Q_C, esl: 0.45e-9, padC: 0.15e-12 } }] },
  { name: 'shunt C: Q table, ESL, pad', load: { r: 75, l: 6e-9 }, elements: [{ kind: 'C', placement: 'shunt', value: 3.3e-12, model: { q: Q_C, esl: 0.6e-9, padC: 0.1e-12 } }] },
  { name: 'series L: srf only, the element\'s own q', load: { r: 50, l: 3e-9 }, elements: [{ kind: 'L', placement: 'series', value: 22e-9, q: 35, model: { srf: 2.5e9 } }] },
  { name: 'series C: pads only, lossless', load: { r: 40, l: 5e-9 }, elements: [{ kind: 'C', placement: 'series', value: 1.5e-12, model: { padC: 0.3e-12 } }] },
  {
    name: 'ladder: modelled and ideal parts together',
    load: { r: 12, l: 1.5e-9 },
    elements: [
      { kind: 'C', placement: 'shunt', value: 4.7e-12, model: { q: Q_C, esl: 0.35e-9, padC: 0.12e-12 } },
      { kind: 'L', placement: 'series', value: 3.9e-9, model: { q: Q_L, srf: 6.2e9, padC: 0.18e-12 } },
      { kind: 'C', placement: 'shunt', value: 1.2e-12, q: 250 },
      { kind: 'L', placement: 'series', value: 8.2e-9, q: 45, model: { srf: 4.1e9 } },
      { kind: 'R', placement: 'series', value: 2.2 },
    ],
  },
]

/** Q at f from a table, written independently of the product: a power law between points. */
function tableQ(table: NonNullable<PartModel['q']>, f: number): number {
  if (f <= table[0]![0]) return table[0]![1]
  if (f >= table[table.length - 1]![0]) return table[table.length - 1]![1]
  const k = table.findIndex((row, i) => f >= row[0] && f < table[i + 1]![0])
  const [f0, q0] = table[k]!, [f1, q1] = table[k + 1]!
  return q0 * (f / f0) ** (Math.log(q1 / q0) / Math.log(f1 / f0))
}

function qOf(e: Lumped, f: number): number | undefined {
  return e.model?.q ? tableQ(e.model.q, f) : e.q
}

const num = (v: number) => v.toPrecision(17)

/** SPICE lines of one part between `top` (source side or the node) and `bottom` (load side or ground). */
function partLines(e: Element, f: number, tag: string, top: string, bottom: string): string[] {
  const w = 2 * Math.PI * f
  if (e.kind === 'R') return [`R${tag} ${top} ${bottom} ${num(e.value)}`]
  if (e.kind !== 'L' && e.kind !== 'C') throw new Error('only L, C and R here')
  const q = qOf(e, f)
  const lines: string[] = []
  if (e.kind === 'L') {
    const esr = q === undefined ? 0 : (w * e.value) / q
    lines.push(`L${tag} ${top} ${esr > 0 ? `m${tag}` : bottom} ${num(e.value)}`)
    if (esr > 0) lines.push(`RQ${tag} m${tag} ${bottom} ${num(esr)}`)
    if (e.model?.srf) lines.push(`CP${tag} ${top} ${bottom} ${num(1 / ((2 * Math.PI * e.model.srf) ** 2 * e.value))}`)
  } else {
    const esr = q === undefined ? 0 : 1 / (w * e.value * q)
    const esl = e.model?.esl ?? 0
    let node = top
    const next = (name: string, last: boolean) => (last ? bottom : name)
    lines.push(`C${tag} ${node} ${(node = next(`c${tag}`, esl === 0 && esr === 0))} ${num(e.value)}`)
    if (esl > 0) lines.push(`LS${tag} ${node} ${(node = next(`s${tag}`, esr === 0))} ${num(esl)}`)
    if (esr > 0) lines.push(`RQ${tag} ${node} ${bottom} ${num(esr)}`)
  }
  return lines
}

function padLines(e: Element, tag: string, nodes: string[]): string[] {
  const padC = e.kind === 'L' || e.kind === 'C' ? e.model?.padC : undefined
  return padC ? nodes.map((n, i) => `CPAD${tag}_${i} ${n} 0 ${num(padC)}`) : []
}

/** One circuit's lines at f; returns the input node and the ammeter names of each element. */
function circuitLines(c: Circuit, k: number, f: number): { lines: string[]; input: string } {
  const lines = [`* ${c.name}`, `RL${k} n${k}_0 l${k} ${num(c.load.r)}`, `LL${k} l${k} 0 ${num(c.load.l)}`]
  let node = `n${k}_0`
  c.elements.forEach((e, i) => {
    const tag = `${k}_${i}`
    if (e.kind !== 'L' && e.kind !== 'C' && e.kind !== 'R') throw new Error('lumped parts only')
    if (e.placement === 'series') {
      const next = `n${k}_${i + 1}`
      // The ammeter sits between the source-side pad and the part: it reads the part's own current.
      lines.push(`VA${tag} ${next} a${tag} DC 0`, ...partLines(e, f, tag, `a${tag}`, node), ...padLines(e, tag, [node, next]))
      node = next
    } else {
      lines.push(`VA${tag} ${node} a${tag} DC 0`, ...partLines(e, f, tag, `a${tag}`, '0'), ...padLines(e, tag, [node]))
    }
  })
  lines.push(`I${k} 0 ${node} AC 1`)
  return { lines, input: node }
}

let workDir = ''
/** ngspice results by circuit and frequency: Zin and every ammeter's current (1 A injected). */
const spice = new Map<string, { zin: Complex; currents: Complex[] }>()

function runAt(f: number, j: number): void {
  const body: string[] = []
  const probes: string[] = []
  circuits.forEach((c, k) => {
    const { lines, input } = circuitLines(c, k, f)
    body.push(...lines)
    probes.push(`v(${input})`, ...c.elements.map((_, i) => `i(VA${k}_${i})`))
  })
  const out = path.join(workDir, `f${j}.txt`)
  const netlist = [
    `gammaboard part models at ${f} Hz`, '.option rshunt=1e18 noopac', ...body,
    '.control', 'set numdgt=16', `ac lin 1 ${num(f)} ${num(f)}`,
    `wrdata ${out} ${probes.map(p => `real(${p}) imag(${p})`).join(' ')}`, 'quit', '.endc', '.end', '',
  ].join('\n')
  const file = path.join(workDir, `f${j}.cir`)
  writeFileSync(file, netlist)
  const run = spawnSync('ngspice', ['-b', file], { encoding: 'utf8', timeout: 60_000 })
  if (!existsSync(out)) throw new Error(`ngspice wrote nothing at ${f} Hz:\n${(run.stdout ?? '') + (run.stderr ?? '')}`.slice(-2000))
  const values = readFileSync(out, 'utf8').trim().split(/\s+/).map(Number).filter((_, i) => i % 2 === 1)
  if (values.length !== 2 * probes.length) throw new Error(`ngspice gave ${values.length} values for ${probes.length} probes at ${f} Hz`)
  let p = 0
  const next = (): Complex => ({ re: values[2 * p]!, im: values[2 * p++ + 1]! })
  circuits.forEach((c, k) => spice.set(`${k}@${f}`, { zin: next(), currents: c.elements.map(() => next()) }))
}

beforeAll(() => {
  const found = spawnSync('sh', ['-c', 'command -v ngspice'], { encoding: 'utf8' })
  if (found.status !== 0) throw new Error('ngspice is not on PATH: run `bash scripts/ensure-system-deps.sh` as root')
  workDir = mkdtempSync(path.join(tmpdir(), 'gammaboard-models-'))
  FREQUENCIES.forEach(runAt)
}, 60_000)

afterAll(() => {
  if (workDir) rmSync(workDir, { recursive: true, force: true })
})

const loadAt = (c: Circuit, f: number): Complex => ({ re: c.load.r, im: 2 * Math.PI * f * c.load.l })

describe(`part models against ${SOURCE}`, () => {
  it.each(circuits.map((c, k) => [c.name, k] as const))('%s: sweep and trace agree with ngspice to 1e-6 at every frequency', (_name, k) => {
    const c = circuits[k]!
    const zs = sweep({ z0: 50, frequencies: FREQUENCIES, load: FREQUENCIES.map(f => loadAt(c, f)), elements: c.elements })
    FREQUENCIES.forEach((f, j) => {
      const ref = spice.get(`${k}@${f}`)!.zin
      expect(complexError(zs[j]!, ref, 1e-9), `${SOURCE} at ${f} Hz: ours ${JSON.stringify(zs[j])}, ngspice ${JSON.stringify(ref)}`).toBeLessThanOrEqual(REL_TOL)
      const traced = trace({ z0: 50, frequency: f, load: loadAt(c, f), elements: c.elements })
      expect(complexError(traced[traced.length - 1]!, ref, 1e-9), `${SOURCE}, trace at ${f} Hz`).toBeLessThanOrEqual(REL_TOL)
    })
  })

  it('stress: the current through each modelled part (pads excluded) matches the ngspice ammeter, relative to the input current', () => {
    const c = circuits[6]!
    const k = 6
    for (const f of [1e9, 2.2e9]) {
      const load = loadAt(c, f)
      const zin = spice.get(`${k}@${f}`)!.zin
      const result = elementStress({ frequency: f, load, source: { re: 50, im: 0 }, powerW: 1, elements: c.elements })
      // |I_in| from the power into the network: P_in = |I_in|²·Re Zin.
      const inputCurrent = Math.sqrt(result.inputPowerW / zin.re)
      c.elements.forEach((_, i) => {
        const ammeter = spice.get(`${k}@${f}`)!.currents[i]!
        const ref = Math.hypot(ammeter.re, ammeter.im) // per 1 A in
        expect(Math.abs(result.elements[i]!.currentRms / inputCurrent - ref) / ref, `${SOURCE}: element ${i} at ${f} Hz`).toBeLessThan(1e-6)
      })
    }
  })
})

describe('part models: self-resonance and loss', () => {
  const inductor = { kind: 'L', placement: 'shunt', value: 15e-9, model: { q: [[1e9, 50]], srf: 2.7e9 } } as const

  it('an inductor with srf resonates at 1/(2π√(L·Cp)), Cp = 1/((2π·srf)²·L), within 0.1 %', () => {
    const cp = 1 / ((2 * Math.PI * inductor.model.srf) ** 2 * inductor.value)
    const expected = 1 / (2 * Math.PI * Math.sqrt(inductor.value * cp)) // parallel resonance of L and Cp
    // Where the reactance of the part changes sign, found by bisection.
    let lo = expected / 2
    let hi = expected * 2
    expect(elementImpedance(inductor, lo).im).toBeGreaterThan(0)
    expect(elementImpedance(inductor, hi).im).toBeLessThan(0)
    for (let i = 0; i < 80; i++) {
      const mid = Math.sqrt(lo * hi)
      if (elementImpedance(inductor, mid).im > 0) lo = mid
      else hi = mid
    }
    expect(Math.abs(lo - expected) / expected).toBeLessThan(1e-3)
    expect(selfResonanceHz(inductor)).toBe(inductor.model.srf)
  })

  it('a capacitor with ESL reports its series resonance 1/(2π√(ESL·C)) and turns inductive above it', () => {
    const cap = { kind: 'C', placement: 'series', value: 10e-12, model: { esl: 0.5e-9 } } as const
    const fr = selfResonanceHz(cap)!
    expect(Math.abs(fr - 1 / (2 * Math.PI * Math.sqrt(0.5e-9 * 10e-12))) / fr).toBeLessThan(1e-12)
    expect(elementImpedance(cap, fr * 0.9).im).toBeLessThan(0)
    expect(elementImpedance(cap, fr * 1.1).im).toBeGreaterThan(0)
  })

  it('Q follows the table in log f and log Q, held at the ends, and falls back to the element\'s q', () => {
    const e = { q: 33, model: { q: Q_L } }
    for (const f of [1e7, 1e8, 3.1e8, 1e9, 2e9, 3e9, 9e9]) {
      expect(Math.abs(partQAt(e, f)! - tableQ(Q_L!, f)) / tableQ(Q_L!, f)).toBeLessThan(1e-12)
    }
    expect(partQAt({ q: 33, model: { srf: 1e9 } }, 5e8)).toBe(33)
    expect(partQAt({ model: {} }, 5e8)).toBeUndefined()
  })

  it('a lossless model (pads and srf, no Q) loses no power; a lossy one does', () => {
    const lossless = [{ kind: 'L', placement: 'series', value: 10e-9, model: { srf: 3e9, padC: 0.3e-12 } }] as Element[]
    expect(lossesAt({ frequency: 1e9, load: { re: 20, im: 5 }, source: { re: 50, im: 0 }, elements: lossless }).efficiency).toBeCloseTo(1, 12)
    const lossy = [{ kind: 'L', placement: 'series', value: 10e-9, model: { q: Q_L, srf: 3e9, padC: 0.3e-12 } }] as Element[]
    expect(lossesAt({ frequency: 1e9, load: { re: 20, im: 5 }, source: { re: 50, im: 0 }, elements: lossy }).efficiency).toBeLessThan(0.99)
  })

  it('refuses bad models naming the field', () => {
    const bad: [unknown, string][] = [
      [{ q: [[1e9, 40], [5e8, 30]] }, 'elements[0].model.q[1][0]'],
      [{ q: [[1e9, -4]] }, 'elements[0].model.q[0][1]'],
      [{ esl: 1e-9 }, 'elements[0].model.esl'],
      [{ srf: 0 }, 'elements[0].model.srf'],
      [{ padC: Number.NaN }, 'elements[0].model.padC'],
      [{ colour: 'red' }, 'elements[0].model.colour'],
    ]
    for (const [model, argument] of bad) {
      expect(() => validateElements([{ kind: 'L', placement: 'series', value: 1e-9, model }]), argument).toThrow(expect.objectContaining({ argument }))
    }
    expect(() => validateElements([{ kind: 'R', placement: 'series', value: 1, model: {} }])).toThrow(expect.objectContaining({ argument: 'elements[0].model' }))
  })
})

describe('dragging a modelled part', () => {
  const cases: Lumped[] = [
    { kind: 'L', placement: 'series', value: 9e-9, model: { q: Q_L, srf: 3.2e9, padC: 0.3e-12 } },
    { kind: 'L', placement: 'shunt', value: 5e-9, model: { q: Q_L, srf: 4e9, padC: 0.2e-12 } },
    { kind: 'C', placement: 'series', value: 2.7e-12, model: { q: Q_C, esl: 0.5e-9, padC: 0.2e-12 } },
    { kind: 'C', placement: 'shunt', value: 1.8e-12, model: { q: Q_C, esl: 0.7e-9, padC: 0.1e-12 } },
  ]
  const zPrev = { re: 22, im: -14 }
  it.each(cases.map(c => [`${c.placement} ${c.kind}`, c] as const))('%s: dragging to the point of a value gives that nominal value back, on the locus', (_n, part) => {
    const f = 1.9e9
    for (const factor of [0.4, 1, 2.5]) {
      const value = part.value * factor
      const target = gammaOf(trace({ z0: 50, frequency: f, load: zPrev, elements: [{ ...part, value }] })[1]!, 50)
      const result = dragElement({ element: part, zPrev, pointer: target, z0: 50, frequencyHz: f })
      expect(Math.abs(result.value - value) / value).toBeLessThan(1e-8)
      const locus = dragLocus(part, zPrev, 50, f)!
      expect(locus.kind).toBe('circle')
      if (locus.kind === 'circle') expect(Math.abs(Math.hypot(target.re - locus.cx, target.im - locus.cy) - locus.radius)).toBeLessThan(1e-9)
    }
  })
})

describe('modelled parts in the two-port export and Monte Carlo', () => {
  const ladder = circuits[6]!
  it('the ladder\'s S-parameters with the load on port 2 give the same input impedance as sweep', () => {
    const f = [0.7e9, 1.9e9, 3.3e9]
    const loads = f.map(x => loadAt(ladder, x))
    const zs = sweep({ z0: 50, frequencies: f, load: loads, elements: ladder.elements })
    const s = ladderSParameters({ z0: 50, frequencies: f, elements: ladder.elements })
    f.forEach((_, k) => {
      const gl = gammaOf(loads[k]!, 50)
      const [[s11, s12], [s21, s22]] = s[k]! as Complex[][]
      // Γin = S11 + S12·S21·ΓL/(1 − S22·ΓL)
      const num = cmul(cmul(s12!, s21!), gl)
      const den = { re: 1 - cmul(s22!, gl).re, im: -cmul(s22!, gl).im }
      const q = cdiv(num, den)
      const gin = { re: s11!.re + q.re, im: s11!.im + q.im }
      expect(Math.hypot(gin.re - gammaOf(zs[k]!, 50).re, gin.im - gammaOf(zs[k]!, 50).im)).toBeLessThan(1e-9)
    })
  })

  it('Monte Carlo without tolerances scores the modelled ladder as its sweep does', () => {
    const f = Array.from({ length: 21 }, (_, i) => 0.8e9 + i * 0.05e9)
    const loads = f.map(x => loadAt(ladder, x))
    const r = runMonteCarlo({
      frequencies: f, load: loads, reference: 50, design: { frequencyHz: 1e9, load: loads[4]!, reference: 50 },
      elements: ladder.elements, spec: { minReturnLossDb: 10, f1Hz: 0.8e9, f2Hz: 1.8e9 }, trials: 3, seed: 'models',
    })
    const worst = Math.min(...sweep({ z0: 50, frequencies: f, load: loads, elements: ladder.elements }).map(z => returnLossDb(gammaOf(z, 50))))
    expect(Math.abs(r.nominalWorstReturnLossDb - worst)).toBeLessThan(1e-9)
    expect(Array.from(r.worstReturnLossDb).every(x => Math.abs(x - worst) < 1e-9)).toBe(true)
  })
})

const cmul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re })
function cdiv(a: Complex, b: Complex): Complex {
  const m = b.re * b.re + b.im * b.im
  return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m }
}
