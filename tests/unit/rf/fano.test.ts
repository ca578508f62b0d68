// Bode–Fano limit. Checks: (1) the closed forms of Fano's integrals with a rectangular reflection
// (Fano 1950; Pozar, Microwave Engineering, 4th ed., §5.9); (2) the integral bound itself, by
// numeric integration of ln(1/|Γ|) through equal-ripple ladders that meet it with equality (their
// reflection zeros lie on the jω axis), and their in-band return loss staying below the limit.
import { describe, expect, it } from 'vitest'
import {
  FANO_MODELS, RfInputError, bodeFanoLimitDb, fanoIntegralBound, fanoModelImpedance, fanoModelsAt, fittedFanoModel, sweepFlat,
  type FanoModel,
} from '../../../shared/rf/index'
import { chebyshevG, modelLadder, rippleForG1 } from './chebyshev-ladders'

const NEPER_DB = 20 / Math.LN10
const isLowPass = (m: FanoModel) => m === 'parallel-RC' || m === 'series-RL'

describe('bodeFanoLimitDb closed forms', () => {
  // Worked by hand from Pozar §5.9's table: parallel R-C, R = 50 Ω, C = 2 pF, 2.0–2.5 GHz:
  // ln(1/Γm) = π/(RC·Δω) = π/(1e-10 · 2π·0.5e9) = 10 → 86.86 dB; series R-L with R/L = 1/(RC)
  // gives the same; series R-C over 1/ω1 − 1/ω2 and parallel R-L dually.
  const w1 = 2 * Math.PI * 2e9
  const w2 = 2 * Math.PI * 2.5e9
  it.each([
    ['parallel-RC', { r: 50, c: 2e-12 }, Math.PI / (50 * 2e-12 * (w2 - w1))],
    ['series-RL', { r: 50, l: 5e-9 }, (Math.PI * 50) / (5e-9 * (w2 - w1))],
    ['series-RC', { r: 10, c: 3e-12 }, (Math.PI * 10 * 3e-12) / (1 / w1 - 1 / w2)],
    ['parallel-RL', { r: 200, l: 8e-9 }, (Math.PI * 8e-9) / 200 / (1 / w1 - 1 / w2)],
  ] as const)('%s', (model, parts, nepers) => {
    const db = bodeFanoLimitDb({ model, ...parts, fStart: 2e9, fStop: 2.5e9 })
    expect(db).toBeCloseTo(NEPER_DB * nepers, 9)
  })

  it('halves when the band of a parallel R-C load doubles (the integral is spread over twice the width)', () => {
    const a = bodeFanoLimitDb({ model: 'parallel-RC', r: 50, c: 1e-12, fStart: 1e9, fStop: 1.2e9 })
    const b = bodeFanoLimitDb({ model: 'parallel-RC', r: 50, c: 1e-12, fStart: 1e9, fStop: 1.4e9 })
    expect(b).toBeCloseTo(a / 2, 9)
  })

  it.each([
    [{ model: 'RC', r: 50, c: 1e-12, fStart: 1e9, fStop: 2e9 }, 'model'],
    [{ model: 'series-RC', r: 0, c: 1e-12, fStart: 1e9, fStop: 2e9 }, 'r'],
    [{ model: 'series-RC', r: 50, fStart: 1e9, fStop: 2e9 }, 'c'],
    [{ model: 'series-RL', r: 50, c: 1e-12, fStart: 1e9, fStop: 2e9 }, 'l'],
    [{ model: 'series-RL', r: 50, l: 1e-9, fStart: Number.NaN, fStop: 2e9 }, 'fStart'],
    [{ model: 'series-RL', r: 50, l: 1e-9, fStart: 2e9, fStop: 1e9 }, 'fStop'],
  ])('names the bad argument %#', (input, argument) => {
    try {
      bodeFanoLimitDb(input as never)
      expect.unreachable()
    } catch (error) {
      expect(error).toBeInstanceOf(RfInputError)
      expect((error as RfInputError).argument).toBe(argument)
    }
  })
})

describe('Fano integral against equal-ripple ladders', () => {
  const r = 50
  const fc = 1e9
  const N = 40001
  // A log grid from 1e-4 to 1e4 times the cut-off: ∫ h(ω) dω = ∫ h(ω)·ω d(ln ω).
  const u0 = Math.log(2 * Math.PI * fc * 1e-4)
  const du = Math.log(1e8) / (N - 1)
  const w = Array.from({ length: N }, (_, i) => Math.exp(u0 + i * du))
  const f = w.map((x) => x / (2 * Math.PI))

  function measure(model: FanoModel, n: number) {
    const m = modelLadder(model, chebyshevG(n, rippleForG1(n, 2)), fc, r)
    const z = sweepFlat({ z0: r, frequencies: f, load: f.map(m.load), elements: m.elements })
    const isWeighted = !isLowPass(model)
    let integral = 0
    let worstInBandDb = Infinity
    for (let i = 0; i < N; i++) {
      const g2 = ((z.re[i]! - r) ** 2 + z.im[i]! ** 2) / ((z.re[i]! + r) ** 2 + z.im[i]! ** 2)
      const nepers = -0.5 * Math.log(g2)
      integral += (i === 0 || i === N - 1 ? 0.5 : 1) * nepers * w[i]! * (isWeighted ? 1 / (w[i]! * w[i]!) : 1)
      if (isLowPass(model) ? f[i]! <= fc : f[i]! >= fc) worstInBandDb = Math.min(worstInBandDb, NEPER_DB * nepers)
    }
    return { integral: integral * du, worstInBandDb, reactive: m.reactive }
  }

  it.each(FANO_MODELS.flatMap((model) => [3, 7, 11].map((n) => [model, n] as const)))('%s, order %i: the integral equals the bound', (model, n) => {
    const { integral, reactive } = measure(model, n)
    const { bound } = fanoIntegralBound(model, r, reactive)
    expect(Math.abs(integral / bound - 1)).toBeLessThan(5e-3)
  })

  it.each(FANO_MODELS)('%s: in-band return loss rises with the order and stays below the limit', (model) => {
    let previous = -Infinity
    for (const n of [3, 5, 7, 9, 11]) {
      const { worstInBandDb, reactive } = measure(model, n)
      // The band is [0, fc] (low-pass) or [fc, ∞) (high-pass); the far end stands in for 0 or ∞.
      const band = isLowPass(model) ? { fStart: 1e-3, fStop: fc } : { fStart: fc, fStop: fc * 1e12 }
      const limit = bodeFanoLimitDb({ model, r, c: reactive, l: reactive, ...band })
      expect(worstInBandDb).toBeLessThan(limit)
      expect(worstInBandDb).toBeGreaterThan(previous)
      previous = worstInBandDb
    }
  })
})

describe('fanoModelsAt', () => {
  it('fits series and parallel models that equal the impedance at the frequency', () => {
    for (const z of [{ re: 20, im: -35 }, { re: 80, im: 60 }]) {
      const fits = fanoModelsAt(z, 1.5e9, { fStart: 1.4e9, fStop: 1.6e9 })
      expect(fits).toHaveLength(2)
      for (const m of fits) {
        const back = fanoModelImpedance(m, 1.5e9)
        expect(back.re).toBeCloseTo(z.re, 9)
        expect(back.im).toBeCloseTo(z.im, 9)
        expect(m.limitDb).toBeCloseTo(bodeFanoLimitDb(m), 12)
      }
    }
  })

  it('has no model for a resistive or non-passive point', () => {
    expect(fanoModelsAt({ re: 50, im: 0 }, 1e9, { fStart: 1e9, fStop: 2e9 })).toEqual([])
    expect(fanoModelsAt({ re: -5, im: 3 }, 1e9, { fStart: 1e9, fStop: 2e9 })).toEqual([])
  })
})

describe('fittedFanoModel', () => {
  const freqs = Array.from({ length: 11 }, (_, i) => 2e9 + i * 0.05e9)
  it.each(FANO_MODELS)('recovers a %s load from its impedances, with its exact limit', (model) => {
    const m = { model, r: 30, c: 2e-12, l: 4e-9, fStart: 2e9, fStop: 2.5e9 }
    const loads = freqs.map(f => fanoModelImpedance(m, f))
    const fit = fittedFanoModel(freqs, loads, { fStart: 2e9, fStop: 2.5e9 })!
    expect(fit.model).toBe(model)
    expect(fit.limitDb).toBeCloseTo(bodeFanoLimitDb(m), 6)
  })
  it('gives a fixed impedance the higher of its two limits', () => {
    const fit = fittedFanoModel(freqs, freqs.map(() => ({ re: 20, im: -30 })), { fStart: 2e9, fStop: 2.5e9 })!
    const both = fanoModelsAt({ re: 20, im: -30 }, freqs[5]!, { fStart: 2e9, fStop: 2.5e9 })
    expect(fit.limitDb).toBe(Math.max(...both.map(b => b.limitDb)))
  })
})
