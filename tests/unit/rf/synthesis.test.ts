import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  RfInputError, inputImpedance, nodeQ, quarterWave, reactiveElement, solveL, solvePi, solveT, trace,
  type Complex, type Element,
} from '../../../shared/rf/index'
import { REFERENCE_SOURCE, WORKED_SOURCE, casesWhere, complexError, expectComplexClose, expectRealClose, refComplex } from './reference'

function sameLadder(actual: readonly Element[], expected: readonly Element[]): boolean {
  return actual.length === expected.length && actual.every((e, i) => {
    const x = expected[i] as Element & { value: number; placement: string }
    return e.kind === x.kind && 'value' in e && e.placement === x.placement &&
      Math.abs(e.value - x.value) <= 1e-6 * Math.abs(x.value)
  })
}

function endsAt(from: Complex, elements: Element[], f: number): Complex {
  return inputImpedance({ z0: 50, frequency: f, load: from, elements })
}

const lCases = casesWhere((c) => c.op === 'lsolve')

describe('solveL against the reference cases', () => {
  it('has the twelve L-network cases and the worked example', () => expect(lCases).toHaveLength(13))

  it.each(lCases.map((c) => [c.id, c] as const))('%s', (_id, c) => {
    const source = c.group === 'worked-example' ? WORKED_SOURCE : REFERENCE_SOURCE
    const from = refComplex(c.input.match ? c.input.match.load : c.input.from)
    const to = c.input.match
      ? { re: refComplex(c.input.match.source).re, im: -refComplex(c.input.match.source).im }
      : refComplex(c.input.to)
    expectComplexClose(from, refComplex(c.expected.from), `${c.id} from`)
    expectComplexClose(to, refComplex(c.expected.to), `${c.id} to`)
    const ours = solveL({ z0: 50, frequency: c.input.f, from, to })
    const wanted = (c.expected.solutions as any[]).filter((s) => s.duplicateOf === undefined)
    expect(ours, `${c.id}: solution count (source: ${source})`).toHaveLength(wanted.length)
    for (const w of wanted) {
      const match = ours.find((l) => sameLadder(l, w.elements))
      expect(match, `${c.id}: ${w.topology} ${w.root} ${JSON.stringify(w.elements)} (source: ${source})`).toBeDefined()
    }
    for (const l of ours) expectComplexClose(endsAt(from, l, c.input.f), to, `${c.id} our ladder ends at to`, 1e-12)
  })

  it('the worked L-section values are what the reference recalls (source: ' + WORKED_SOURCE + ')', () => {
    const [c] = casesWhere((x) => x.id === 'worked-lsection')
    const [first, second] = solveL({ frequency: 500e6, from: { re: 200, im: -100 }, to: 100 })
    expectRealClose((first![0] as { value: number }).value, c!.expected.solutions[0].elements[0].value, 'shunt C ≈ 0.9228 pF')
    expectRealClose((second![0] as { value: number }).value, c!.expected.solutions[1].elements[0].value, 'shunt L ≈ 46.14 nH')
  })
})

describe('solveL properties (seeded)', () => {
  it('every solution traced from `from` ends at `to` within 1e-9, for real and complex ends', () => {
    const rng = seedrandom('solveL-property')
    let solved = 0
    for (let k = 0; k < 1500; k++) {
      const f = 1e6 * 10 ** (rng() * 4)
      const from = { re: 1 + rng() * 300, im: rng() < 0.3 ? 0 : (rng() - 0.5) * 600 }
      const to = { re: 1 + rng() * 300, im: rng() < 0.3 ? 0 : (rng() - 0.5) * 600 }
      const ladders = solveL({ z0: 50, frequency: f, from, to })
      expect(ladders.length).toBeLessThanOrEqual(4)
      for (const l of ladders) {
        expect(complexError(endsAt(from, l, f), to, 1e-300)).toBeLessThanOrEqual(1e-9)
        expect(l.every((e) => e.kind === 'L' || e.kind === 'C')).toBe(true)
        solved++
      }
    }
    expect(solved).toBeGreaterThan(1500) // most pairs have solutions; the check is not vacuous
  })

  it('two real ends always have exactly two solutions (one topology each way round)', () => {
    const rng = seedrandom('solveL-real')
    for (let k = 0; k < 200; k++) {
      const a = 1 + rng() * 500
      const b = a * (1.01 + rng() * 10)
      expect(solveL({ frequency: 1e9, from: a, to: b })).toHaveLength(2)
      expect(solveL({ frequency: 1e9, from: b, to: a })).toHaveLength(2)
    }
  })

  it('rejects bad arguments by name', () => {
    expect(() => solveL({ frequency: -1, from: 10, to: 50 })).toThrow(/frequency/)
    expect(() => solveL({ frequency: 1e9, from: { re: NaN, im: 0 }, to: 50 })).toThrow(/from/)
    expect(() => solveL({ frequency: 1e9, from: 10, to: { re: 1, im: Infinity } })).toThrow(/to/)
    expect(() => reactiveElement('series', 0, 1e9)).toThrow(RfInputError)
  })
})

describe('pi and T networks for a chosen loaded Q (virtual resistance)', () => {
  const maxNodeQ = (from: Complex, ladder: Element[], f: number) =>
    Math.max(...trace({ z0: 50, frequency: f, load: from, elements: ladder }).slice(1).map(nodeQ))

  it('every pi and T ladder ends at `to`, has the right shape, and its highest node Q is q (seeded)', () => {
    const rng = seedrandom('pi-t')
    for (let k = 0; k < 200; k++) {
      const f = 1e7 * 10 ** (rng() * 2)
      const from = { re: 5 + rng() * 200, im: (rng() - 0.5) * 100 }
      const to = { re: 5 + rng() * 200, im: (rng() - 0.5) * 100 }
      const rp = (z: Complex) => (z.re * z.re + z.im * z.im) / z.re
      const qPi = Math.sqrt(Math.max(rp(from), rp(to)) / Math.min(rp(from), rp(to)) - 1) + 0.5 + rng() * 5
      const qT = Math.sqrt(Math.max(from.re, to.re) / Math.min(from.re, to.re) - 1) + 0.5 + rng() * 5
      const pis = solvePi({ frequency: f, from, to, q: qPi })
      const ts = solveT({ frequency: f, from, to, q: qT })
      expect(pis.length).toBeGreaterThan(0)
      expect(ts.length).toBeGreaterThan(0)
      for (const l of pis) {
        expect(complexError(endsAt(from, l, f), to, 1e-300)).toBeLessThanOrEqual(1e-9)
        expect(l.map((e) => (e as { placement: string }).placement)).toEqual(['shunt', 'series', 'shunt'].slice(0, l.length))
      }
      for (const l of ts) expect(complexError(endsAt(from, l, f), to, 1e-300)).toBeLessThanOrEqual(1e-9)
      // For real terminals the virtual node carries exactly the chosen Q.
      const ra = 5 + rng() * 200
      const rb = ra * (1.5 + rng() * 4)
      const q = Math.sqrt(rb / ra - 1) + 1 + rng() * 4
      for (const l of solvePi({ frequency: f, from: ra, to: rb, q })) expect(maxNodeQ({ re: ra, im: 0 }, l, f)).toBeCloseTo(q, 6)
      for (const l of solveT({ frequency: f, from: ra, to: rb, q })) expect(maxNodeQ({ re: ra, im: 0 }, l, f)).toBeCloseTo(q, 6)
    }
  })

  it('a Q below the single-L minimum is refused, naming q', () => {
    // 10 Ω to 50 Ω needs Q ≥ 2 (√(50/10 − 1)).
    expect(() => solvePi({ frequency: 1e8, from: 10, to: 50, q: 1.5 })).toThrow(/^q: must be at least 2/)
    expect(() => solveT({ frequency: 1e8, from: 10, to: 50, q: 1.9 })).toThrow(RfInputError)
    expect(solvePi({ frequency: 1e8, from: 10, to: 50, q: 2 }).length).toBeGreaterThan(0)
    expect(() => solvePi({ frequency: 1e8, from: { re: 0, im: 5 }, to: 50, q: 3 })).toThrow(/from/)
  })
})

describe('quarter-wave transformer', () => {
  it('100 Ω to 50 Ω needs √5000 Ω (source: ' + WORKED_SOURCE + ')', () => {
    const [c] = casesWhere((x) => x.id === 'worked-qwt')
    const zt = quarterWave(c!.input.zl, c!.input.z0)
    expectRealClose(zt, c!.expected.zt, 'Zt')
    const zin = inputImpedance({ z0: 50, frequency: 1e9, load: { re: 100, im: 0 }, elements: [{ kind: 'line', z0: zt, deg: 90, fRef: 1e9 }] })
    expectComplexClose(zin, refComplex(c!.expected.verify.zin), 'quarter-wave input impedance')
  })

  it('rejects non-positive values by name', () => {
    expect(() => quarterWave(0, 50)).toThrow(/rLoad/)
    expect(() => quarterWave(100, NaN)).toThrow(/z0/)
  })
})
