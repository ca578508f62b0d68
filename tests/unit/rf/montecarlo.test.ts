import { describe, expect, it } from 'vitest'
import {
  RfInputError, createMonteCarlo, gammaOf, histogramOf, returnLossDb, runMonteCarlo, sweep, toleranceHalfWidth, trace,
  type MonteCarloInput, type TolerancedElement,
} from '../../../shared/rf/index'
import { expectComplexClose, expectRealClose } from './reference'

const band = Array.from({ length: 41 }, (_, i) => 880e6 + i * 1.75e6)

function antennaInput(overrides: Partial<MonteCarloInput> = {}): MonteCarloInput {
  // An invented 915 MHz antenna match: series L then shunt C on 18 − j32 Ω, both with tolerances.
  const load = { re: 18, im: -32 }
  return {
    frequencies: band,
    load,
    reference: 50,
    design: { frequencyHz: 915e6, load, reference: 50 },
    elements: [
      { kind: 'L', placement: 'series', value: 10e-9, q: 45, tolerance: 0.05 },
      { kind: 'C', placement: 'shunt', value: 3.9e-12, q: 200, tolerance: 0.02, toleranceAbs: 0.1e-12 },
      { kind: 'line', z0: 50, deg: 8, fRef: 915e6 },
    ],
    spec: { minReturnLossDb: 10, f1Hz: 902e6, f2Hz: 928e6 },
    trials: 3000,
    seed: 'brackwater-yield',
    ...overrides,
  }
}

/** |observed − p| within 4σ of a binomial proportion over n trials. */
function expectWithinBinomial(observed: number, p: number, n: number): void {
  const sigma = Math.sqrt((p * (1 - p)) / n)
  expect(Math.abs(observed - p), `yield ${observed} vs ${p} (4σ = ${4 * sigma})`).toBeLessThan(4 * sigma)
}

describe('Monte Carlo: reproducible', () => {
  it('two runs with the same seed give identical arrays, to the last bit', () => {
    const a = runMonteCarlo(antennaInput())
    const b = runMonteCarlo(antennaInput())
    expect(a.worstReturnLossDb.length).toBe(3000)
    // Bit-for-bit: Float64Array equality element by element is the point of this check.
    expect(Array.from(b.worstReturnLossDb)).toEqual(Array.from(a.worstReturnLossDb))
    expect(Array.from(b.cloudRe)).toEqual(Array.from(a.cloudRe))
    expect(Array.from(b.cloudIm)).toEqual(Array.from(a.cloudIm))
    expect(b.passes).toBe(a.passes)
  })

  it('a run taken in uneven steps equals the run taken at once', () => {
    const whole = runMonteCarlo(antennaInput({ distribution: 'gaussian' }))
    const run = createMonteCarlo(antennaInput({ distribution: 'gaussian' }))
    const steps = [1, 136, 999, 7, 2000]
    for (const s of steps) run.step(s)
    expect(run.completed).toBe(3000)
    const stepped = run.result()
    expect(Array.from(stepped.worstReturnLossDb)).toEqual(Array.from(whole.worstReturnLossDb))
    expect(Array.from(stepped.cloudRe)).toEqual(Array.from(whole.cloudRe))
  })

  it('another seed gives other draws, and the trials differ from each other', () => {
    const a = runMonteCarlo(antennaInput())
    const b = runMonteCarlo(antennaInput({ seed: 'another' }))
    expect(Array.from(b.worstReturnLossDb)).not.toEqual(Array.from(a.worstReturnLossDb))
    expect(new Set(a.worstReturnLossDb).size).toBeGreaterThan(2900)
  })
})

describe('Monte Carlo: analytic yield', () => {
  // A series resistor R on a 50 Ω load, Z0 = 50 Ω: z = 50 + R, so Γ = R/(100 + R) at every
  // frequency, rising with R. The spec RL ≥ 20 dB means |Γ| ≤ 0.1, i.e. R ≤ 100/9 Ω.
  const threshold = 100 / 9
  const n = 20000
  function resistorInput(element: TolerancedElement, distribution: 'uniform' | 'gaussian'): MonteCarloInput {
    const load = { re: 50, im: 0 }
    return {
      frequencies: [1e9, 1.5e9, 2e9, 2.5e9, 3e9],
      load,
      reference: 50,
      design: { frequencyHz: 2e9, load, reference: 50 },
      elements: [element],
      spec: { minReturnLossDb: 20, f1Hz: 1e9, f2Hz: 3e9 },
      trials: n,
      seed: 'analytic',
      distribution,
    }
  }

  it('uniform: R = 10 Ω ± 20 % is uniform on [8, 12] Ω, so P(R ≤ 100/9) = (100/9 − 8)/4 = 7/9', () => {
    const r = runMonteCarlo(resistorInput({ kind: 'R', placement: 'series', value: 10, tolerance: 0.2 }, 'uniform'))
    expectWithinBinomial(r.yield, (threshold - 8) / 4, n)
    // Every trial's worst return loss is that of its own R: within [RL(12 Ω), RL(8 Ω)].
    const rl = (ohms: number) => -20 * Math.log10(ohms / (100 + ohms))
    expect(Math.min(...r.worstReturnLossDb)).toBeGreaterThanOrEqual(rl(12) - 1e-9)
    expect(Math.max(...r.worstReturnLossDb)).toBeLessThanOrEqual(rl(8) + 1e-9)
  })

  it('uniform with an absolute tolerance: ±2 Ω wins over ±5 % and gives the same 7/9', () => {
    const r = runMonteCarlo(resistorInput({ kind: 'R', placement: 'series', value: 10, tolerance: 0.05, toleranceAbs: 2 }, 'uniform'))
    expectWithinBinomial(r.yield, 7 / 9, n)
  })

  it('gaussian: 3σ = 2 Ω truncated at 3σ, so P = (Φ(5/3) − Φ(−3))/(Φ(3) − Φ(−3))', () => {
    const r = runMonteCarlo(resistorInput({ kind: 'R', placement: 'series', value: 10, tolerance: 0.2 }, 'gaussian'))
    // Φ by Simpson's rule on the normal density (no table needed): z = (100/9 − 10)/(2/3) = 5/3.
    const phi = (z: number) => {
      const steps = 4000
      const lo = -8
      const h = (z - lo) / steps
      const pdf = (x: number) => Math.exp(-x * x / 2) / Math.sqrt(2 * Math.PI)
      let sum = pdf(lo) + pdf(z)
      for (let i = 1; i < steps; i++) sum += (i % 2 ? 4 : 2) * pdf(lo + i * h)
      return (sum * h) / 3
    }
    const p = (phi(5 / 3) - phi(-3)) / (phi(3) - phi(-3))
    expectWithinBinomial(r.yield, p, n)
  })
})

describe('Monte Carlo: agrees with the RF core', () => {
  it('the nominal worst return loss is the sweep of the nominal ladder through gammaOf (complex source)', () => {
    const source = { re: 42, im: 9 }
    const input = antennaInput({ reference: source, design: { frequencyHz: 915e6, load: { re: 18, im: -32 }, reference: source }, trials: 10 })
    const r = runMonteCarlo(input)
    const z = sweep({ z0: 50, frequencies: band, load: { re: 18, im: -32 }, elements: input.elements })
    const inSpec = band.map((f, k) => [f, k] as const).filter(([f]) => f >= 902e6 && f <= 928e6)
    const worst = Math.min(...inSpec.map(([, k]) => returnLossDb(gammaOf(z[k]!, source))))
    expectRealClose(r.nominalWorstReturnLossDb, worst, 'nominal worst RL')
  })

  it('with no tolerance every cloud point is the trace end point at the design frequency', () => {
    const elements: TolerancedElement[] = [
      { kind: 'L', placement: 'series', value: 10e-9, q: 45 },
      { kind: 'C', placement: 'shunt', value: 3.9e-12 },
    ]
    const r = runMonteCarlo(antennaInput({ elements, trials: 50, cloudSize: 20 }))
    const points = trace({ z0: 50, frequency: 915e6, load: { re: 18, im: -32 }, elements })
    const end = points[points.length - 1]!
    expect(r.cloudRe.length).toBe(20)
    for (let t = 0; t < 20; t++) expectComplexClose({ re: r.cloudRe[t]!, im: r.cloudIm[t]! }, end, `cloud ${t}`)
    expect(r.yield === 0 || r.yield === 1).toBe(true)
  })

  it('the tolerance half-width is the larger of the relative and absolute forms', () => {
    expectRealClose(toleranceHalfWidth({ kind: 'C', placement: 'shunt', value: 1e-12, tolerance: 0.02, toleranceAbs: 0.1e-12 }), 0.1e-12, 'abs wins', 1e-20)
    expectRealClose(toleranceHalfWidth({ kind: 'C', placement: 'shunt', value: 100e-12, tolerance: 0.02, toleranceAbs: 0.1e-12 }), 2e-12, 'relative wins', 1e-20)
    expect(toleranceHalfWidth({ kind: 'line', z0: 50, deg: 10, fRef: 1e9 })).toBe(0)
  })

  it('refuses a spec that no band point reaches, and bad trial counts', () => {
    expect(() => runMonteCarlo(antennaInput({ spec: { minReturnLossDb: 10, f1Hz: 1e9, f2Hz: 2e9 } }))).toThrow(RfInputError)
    expect(() => runMonteCarlo(antennaInput({ trials: 1.5 }))).toThrow(/trials/)
  })
})

describe('histogramOf', () => {
  it('bins aligned to the width, counts summing to the input, infinities at the ends', () => {
    const h = histogramOf([9.9, 10.0, 10.2, 11.4, Infinity, -Infinity, NaN], 0.5)
    expect(h.edges[0]).toBe(9.5)
    expect(h.edges[h.edges.length - 1]).toBe(11.5)
    expect(h.counts).toEqual([2, 2, 0, 2]) // [9.5,10): 9.9 and −∞; [10,10.5): 10, 10.2; [11,11.5): 11.4 and +∞
    expect(histogramOf([], 1)).toEqual({ edges: [], counts: [] })
  })
})
