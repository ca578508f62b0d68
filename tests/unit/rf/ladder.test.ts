import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  OPEN, RfInputError, elementAdmittance, elementImpedance, gammaOf, inputImpedance, isInfinite,
  mismatchLossDb, reciprocal, returnLossDb, trace, vswr, type Complex, type Element,
} from '../../../shared/rf/index'
import {
  REFERENCE_SOURCE, casesWhere, expectComplexClose, expectRealClose, refComplex, refReal, refStart,
} from './reference'
import { randomLadder, randomPassiveLoad } from './random-ladders'

const traceCases = casesWhere((c) => c.op === 'trace')

describe(`trace against ${REFERENCE_SOURCE}`, () => {
  it('covers every trace case of the reference file', () => {
    expect(traceCases.length).toBe(20)
  })

  it.each(traceCases.map((c) => [c.id, c] as const))('%s', (_id, c) => {
    const { input, expected } = c
    const z0 = input.z0 as number
    const load = refStart(input, input.f)
    const points = trace({ z0, frequency: input.f, load, elements: input.elements as Element[] })
    expect(points).toHaveLength(input.elements.length + 1)
    expected.steps.forEach((step: any, i: number) => {
      const z = points[i]!
      const where = `${c.id} step ${i} (source: ${REFERENCE_SOURCE})`
      if (step.z === null) expect(isInfinite(z), `${where}: open`).toBe(true)
      else expectComplexClose(z, refComplex(step.z), `${where} z`)
      if (step.y === null) expect(isInfinite(reciprocal(z)), `${where}: short`).toBe(true)
      else expectComplexClose(reciprocal(z), refComplex(step.y), `${where} y`, 1e-12)
      expectComplexClose(gammaOf(z, z0), refComplex(step.gamma), `${where} gamma`, 1e-12)
      if (step.elementZ) expectComplexClose(elementImpedance(step.element, input.f), refComplex(step.elementZ), `${where} element Z`)
      if (step.elementY) expectComplexClose(elementAdmittance(step.element, input.f), refComplex(step.elementY), `${where} element Y`, 1e-12)
    })
    const zin = points[points.length - 1]!
    expectComplexClose(zin, refComplex(expected.zin), `${c.id} zin`)
    const g = gammaOf(zin, z0)
    expectComplexClose(g, refComplex(expected.gammaIn), `${c.id} gammaIn`, 1e-12)
    expectRealClose(Math.hypot(g.re, g.im), expected.gammaInMag, `${c.id} |gammaIn|`, 1e-12)
    // |Γ| within 1e-15 of 1 makes VSWR and mismatch loss ill-conditioned: only "huge" is checkable.
    const vswrIn = refReal(expected.vswrIn)
    if (vswrIn > 1e12) expect(vswr(g)).toBeGreaterThan(1e12)
    else expectRealClose(vswr(g), vswrIn, `${c.id} vswr`)
    // Likewise a Γ of rounding size (~1e-16) has a return loss that is only "very large".
    const rl = refReal(expected.returnLossDbIn)
    if (rl > 200) expect(returnLossDb(g)).toBeGreaterThan(200)
    else expectRealClose(returnLossDb(g), rl, `${c.id} return loss`, 1e-9)
    const ml = refReal(expected.mismatchLossDbIn)
    if (ml > 100) expect(mismatchLossDb(g)).toBeGreaterThan(100)
    else expectRealClose(mismatchLossDb(g), ml, `${c.id} mismatch loss`, 1e-9)
  })
})

describe('trace special values (handled on purpose)', () => {
  const f = 915e6
  it('an empty ladder traces to the load, the open included', () => {
    expect(trace({ z0: 50, frequency: f, load: { re: 12, im: -7 }, elements: [] })).toEqual([{ re: 12, im: -7 }])
    expect(trace({ z0: 50, frequency: f, load: OPEN, elements: [] })).toEqual([OPEN])
    // Any infinite part reads as the one point at infinity.
    expect(trace({ z0: 50, frequency: f, load: { re: 3, im: -Infinity }, elements: [] })).toEqual([OPEN])
  })

  it('a series part on an open stays open; a shunt part on an open is the part itself', () => {
    const seriesL: Element = { kind: 'L', placement: 'series', value: 10e-9 }
    expect(isInfinite(inputImpedance({ z0: 50, frequency: f, load: OPEN, elements: [seriesL] }))).toBe(true)
    const shuntC: Element = { kind: 'C', placement: 'shunt', value: 2.2e-12, q: 80 }
    const z = inputImpedance({ z0: 50, frequency: f, load: OPEN, elements: [shuntC] })
    expectComplexClose(z, elementImpedance(shuntC, f), 'shunt C on an open')
  })

  it('a shunt part on a short stays a short; a series part on a short is the part itself', () => {
    const shuntL: Element = { kind: 'L', placement: 'shunt', value: 5e-9 }
    expect(inputImpedance({ z0: 50, frequency: f, load: { re: 0, im: 0 }, elements: [shuntL] })).toEqual({ re: 0, im: 0 })
    const seriesR: Element = { kind: 'R', placement: 'series', value: 3.3 }
    expectComplexClose(inputImpedance({ z0: 50, frequency: f, load: { re: 0, im: 0 }, elements: [seriesR] }), { re: 3.3, im: 0 }, 'series R on a short')
  })

  it('a zero-length line or stub-free 1:1 transformer leaves the point exactly where it was', () => {
    const load = { re: 23.5, im: 41.25 }
    const z = inputImpedance({ z0: 50, frequency: f, load, elements: [{ kind: 'line', z0: 75, deg: 0 }, { kind: 'xfmr', ratio: 1 }] })
    expect(z).toEqual(load)
  })

  it('a quarter-wave line turns a short into an exact open and an open into an exact short', () => {
    const qw: Element = { kind: 'line', z0: 50, deg: 90, fRef: f }
    expect(inputImpedance({ z0: 50, frequency: f, load: { re: 0, im: 0 }, elements: [qw] })).toEqual(OPEN)
    const z = inputImpedance({ z0: 50, frequency: f, load: OPEN, elements: [qw] })
    expect(Math.hypot(z.re, z.im)).toBe(0)
  })

  it('zero-valued parts: series C = 0 opens the path, shunt L = 0 or R = 0 shorts it', () => {
    const run = (e: Element) => inputImpedance({ z0: 50, frequency: f, load: { re: 50, im: 0 }, elements: [e] })
    expect(run({ kind: 'C', placement: 'series', value: 0 })).toEqual(OPEN)
    expect(Math.hypot(run({ kind: 'L', placement: 'shunt', value: 0 }).re, run({ kind: 'L', placement: 'shunt', value: 0 }).im)).toBe(0)
    expect(Math.hypot(run({ kind: 'R', placement: 'shunt', value: 0 }).re, 0)).toBe(0)
    expect(run({ kind: 'C', placement: 'shunt', value: 0 })).toEqual({ re: 50, im: 0 })
  })

  it('open stubs of 0° and 90°: a series 0° open stub opens the path, a shunt 90° open stub shorts it', () => {
    const run = (e: Element) => inputImpedance({ z0: 50, frequency: f, load: { re: 30, im: 10 }, elements: [e] })
    expect(run({ kind: 'stub', end: 'open', placement: 'series', z0: 50, deg: 0 })).toEqual(OPEN)
    const z = run({ kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 90 })
    expect(Math.hypot(z.re, z.im)).toBe(0)
    expect(run({ kind: 'stub', end: 'short', placement: 'series', z0: 50, deg: 0 })).toEqual({ re: 30, im: 10 })
  })
})

describe('trace properties (seeded)', () => {
  it('a lossless ladder on a passive load keeps |Γ| ≤ 1 at every point', () => {
    const rng = seedrandom('gammaboard-lossless-ladders')
    for (let k = 0; k < 300; k++) {
      const f = 1e6 * 10 ** (rng() * 3.5)
      const load = randomPassiveLoad(rng)
      const elements = randomLadder(rng, f, { lossless: true, length: 1 + Math.floor(rng() * 10) })
      for (const z of trace({ z0: 50, frequency: f, load, elements })) {
        const g = gammaOf(z, 50)
        expect(Math.hypot(g.re, g.im)).toBeLessThanOrEqual(1 + 1e-12)
      }
    }
  })

  it('a lossless ladder keeps a purely reactive load reactive and |Γ| = 1', () => {
    const rng = seedrandom('gammaboard-reactive')
    for (let k = 0; k < 100; k++) {
      const f = 1e8 * (1 + rng() * 20)
      const load: Complex = { re: 0, im: (rng() - 0.5) * 400 }
      for (const z of trace({ z0: 50, frequency: f, load, elements: randomLadder(rng, f, { lossless: true, length: 5 }) })) {
        const g = gammaOf(z, 50)
        expect(Math.abs(Math.hypot(g.re, g.im) - 1)).toBeLessThan(1e-9)
      }
    }
  })
})

describe('trace rejects bad arguments, naming them', () => {
  const ok = { z0: 50, frequency: 1e9, load: { re: 50, im: 0 }, elements: [] as Element[] }
  const cases: [string, Record<string, unknown>, string][] = [
    ['NaN frequency', { frequency: NaN }, 'frequency'],
    ['zero frequency', { frequency: 0 }, 'frequency'],
    ['infinite frequency', { frequency: Infinity }, 'frequency'],
    ['negative z0', { z0: -50 }, 'z0'],
    ['NaN load', { load: { re: NaN, im: 0 } }, 'load'],
    ['load not complex', { load: 'fifty' }, 'load'],
    ['negative L', { elements: [{ kind: 'L', placement: 'series', value: -1e-9 }] }, 'elements[0].value'],
    ['negative C', { elements: [{ kind: 'C', placement: 'shunt', value: -1e-12 }] }, 'elements[0].value'],
    ['negative R', { elements: [{ kind: 'R', placement: 'series', value: -5 }] }, 'elements[0].value'],
    ['unknown kind', { elements: [{ kind: 'Q', value: 1 }] }, 'elements[0].kind'],
    ['bad placement', { elements: [{ kind: 'L', placement: 'across', value: 1e-9 }] }, 'elements[0].placement'],
    ['zero Q', { elements: [{ kind: 'L', placement: 'series', value: 1e-9, q: 0 }] }, 'elements[0].q'],
    ['line z0 of 0', { elements: [{ kind: 'line', z0: 0, deg: 10 }] }, 'elements[0].z0'],
    ['NaN line length', { elements: [{ kind: 'line', z0: 50, deg: NaN }] }, 'elements[0].deg'],
    ['bad stub end', { elements: [{ kind: 'stub', end: 'half', placement: 'shunt', z0: 50, deg: 10 }] }, 'elements[0].end'],
    ['zero transformer ratio', { elements: [{ kind: 'xfmr', ratio: 0 }] }, 'elements[0].ratio'],
    ['negative fRef', { elements: [{ kind: 'line', z0: 50, deg: 10, fRef: -1 }] }, 'elements[0].fRef'],
  ]
  it.each(cases)('%s', (_name, patch, argument) => {
    let caught: unknown
    try {
      trace({ ...ok, ...patch } as never)
    } catch (e) {
      caught = e
    }
    expect(caught).toBeInstanceOf(RfInputError)
    expect((caught as RfInputError).argument).toBe(argument)
    expect((caught as RfInputError).message).toContain(argument)
  })
})
