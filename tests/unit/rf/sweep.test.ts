import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import { RfInputError, gammaOf, inputImpedance, returnLossDb, sweep, sweepFlat, vswr, type Element } from '../../../shared/rf/index'
import { REFERENCE_SOURCE, casesWhere, expectComplexClose, expectRealClose, refComplex, refStart } from './reference'
import { randomLadder, randomPassiveLoad } from './random-ladders'
import { applyElementToPoints, createPoints } from '../../../shared/rf/points'

const sweepCases = casesWhere((c) => c.op === 'sweep')

describe(`sweep against ${REFERENCE_SOURCE}`, () => {
  it('has the three band sweeps', () => expect(sweepCases).toHaveLength(3))

  it.each(sweepCases.map((c) => [c.id, c] as const))('%s', (_id, c) => {
    const freqs = c.input.freqs as number[]
    const loads = c.input.loads
      ? (c.input.loads as [number, number][]).map(refComplex)
      : freqs.map((f) => refStart(c.input, f))
    const out = sweep({ z0: c.input.z0, frequencies: freqs, load: loads, elements: c.input.elements as Element[] })
    expect(out).toHaveLength(freqs.length)
    c.expected.points.forEach((pt: any, k: number) => {
      const label = `${c.id} at ${pt.f} Hz`
      expectComplexClose(loads[k]!, refComplex(pt.zload), `${label} load`)
      expectComplexClose(out[k]!, refComplex(pt.zin), `${label} zin`)
      const g = gammaOf(out[k]!, c.input.z0)
      expectComplexClose(g, refComplex(pt.gamma), `${label} gamma`, 1e-12)
      if (pt.gammaMag > 1e-9) {
        expectRealClose(vswr(g), pt.vswr, `${label} vswr`)
        expectRealClose(returnLossDb(g), pt.returnLossDb, `${label} return loss`)
      }
    })
  })
})

describe('sweep properties (seeded)', () => {
  it('agrees with trace at each frequency, with one load and with one load per frequency', () => {
    const rng = seedrandom('sweep-vs-trace')
    for (let k = 0; k < 60; k++) {
      const f0 = 1e7 * 10 ** (rng() * 2.5)
      const elements = randomLadder(rng, f0, { length: 1 + Math.floor(rng() * 10) })
      const frequencies = Array.from({ length: 21 }, (_, i) => f0 * (0.7 + (0.6 * i) / 20))
      const single = randomPassiveLoad(rng)
      const perFrequency = frequencies.map(() => randomPassiveLoad(rng))
      const a = sweep({ z0: 50, frequencies, load: single, elements })
      const b = sweep({ z0: 50, frequencies, load: perFrequency, elements })
      frequencies.forEach((f, i) => {
        expectComplexClose(a[i]!, inputImpedance({ z0: 50, frequency: f, load: single, elements }), `single load at ${f}`)
        expectComplexClose(b[i]!, inputImpedance({ z0: 50, frequency: f, load: perFrequency[i]!, elements }), `per-frequency load at ${f}`)
      })
    }
  })

  it('agrees with trace over a 1001-point uniform band and an uneven band (to 1e-12)', () => {
    const rng = seedrandom('sweep-wide-band')
    const f0 = 2.44e9
    const uniform = Array.from({ length: 1001 }, (_, i) => 2.0e9 + (0.9e9 * i) / 1000)
    const uneven = uniform.map((f, i) => f + (i % 7) * 1e3)
    for (let k = 0; k < 5; k++) {
      const elements = randomLadder(rng, f0, { length: 10 })
      const load = randomPassiveLoad(rng)
      for (const frequencies of [uniform, uneven]) {
        const out = sweep({ z0: 50, frequencies, load, elements })
        frequencies.forEach((f, i) => {
          const z = inputImpedance({ z0: 50, frequency: f, load, elements })
          const err = Math.hypot(out[i]!.re - z.re, out[i]!.im - z.im) / Math.hypot(z.re, z.im)
          expect(err, `at ${f} Hz`).toBeLessThan(1e-12)
        })
      }
    }
  })

  it('rescaling every fourth element keeps long ladders of far-off part values finite and equal to trace', () => {
    // The sweep rescales only every fourth element, trace after each one: both must agree and stay
    // finite where the unscaled pair would overflow.
    const rng = seedrandom('sweep-rescale-extremes')
    const frequencies = Array.from({ length: 41 }, (_, i) => 1e6 * 10 ** (i / 10)) // 1 MHz … 10 GHz
    for (let k = 0; k < 20; k++) {
      // Series L and shunt C in turn: each pair of them can multiply the pair's size by ~1e18.
      const elements: Element[] = Array.from({ length: 96 }, (_, i) => (i % 2 === 0
        ? { kind: 'L', placement: 'series', value: 10 ** (-9 + rng() * 9) } // 1 nH … 1 H
        : { kind: 'C', placement: 'shunt', value: 10 ** (-12 + rng() * 9) })) // 1 pF … 1 mF
      const load = randomPassiveLoad(rng)
      const out = sweep({ z0: 50, frequencies, load, elements })
      frequencies.forEach((f, i) => {
        const z = inputImpedance({ z0: 50, frequency: f, load, elements })
        expect(Number.isFinite(out[i]!.re) || !Number.isFinite(z.re), `finite at ${f} Hz`).toBe(true)
        const scale = Math.max(1, Math.hypot(z.re, z.im))
        expect(Math.hypot(out[i]!.re - z.re, out[i]!.im - z.im) / scale, `at ${f} Hz`).toBeLessThan(1e-9)
      })
    }
  })

  it('the point kernel rescales only when asked', () => {
    const big = { re: 1e150, im: 0 }
    for (const rescale of [true, false]) {
      const p = createPoints(1)
      p.aRe[0] = big.re
      p.bRe[0] = 1e140
      applyElementToPoints(p, { kind: 'R', placement: 'series', value: 1 }, Float64Array.of(1e9), { rescale })
      const m = Math.abs(p.aRe[0]!) + Math.abs(p.bRe[0]!)
      expect(m > 1e100, `rescale: ${rescale}`).toBe(!rescale)
      // Either way the point itself is the same: 1e10 Ω + 1 Ω.
      expect((p.aRe[0]! / p.bRe[0]!) / (1e10 + 1)).toBeCloseTo(1, 12)
    }
  })

  it('a quarter-wave line on a short is an exact open at f = fRef inside a swept band', () => {
    const frequencies = Array.from({ length: 101 }, (_, i) => 0.9e9 + 2e6 * i)
    const out = sweep({ z0: 50, frequencies, load: { re: 0, im: 0 }, elements: [{ kind: 'line', z0: 50, deg: 90, fRef: frequencies[50]! }] })
    expect(out[50]).toEqual({ re: Infinity, im: 0 })
    expect(Number.isFinite(out[49]!.im)).toBe(true)
  })

  it('sweepFlat carries the same numbers as sweep and marks an open as Infinity', () => {
    const frequencies = new Float64Array([1e8, 2e8, 3e8])
    const elements: Element[] = [{ kind: 'C', placement: 'series', value: 1e-12 }]
    const flat = sweepFlat({ z0: 50, frequencies, load: { re: Infinity, im: 0 }, elements })
    expect(Array.from(flat.re)).toEqual([Infinity, Infinity, Infinity])
    const objects = sweep({ z0: 50, frequencies, load: { re: 10, im: 0 }, elements })
    const flat2 = sweepFlat({ z0: 50, frequencies, load: { re: 10, im: 0 }, elements })
    objects.forEach((z, i) => expect([z.re, z.im]).toEqual([flat2.re[i], flat2.im[i]]))
  })

  it('rejects bad arguments by name', () => {
    const base = { z0: 50, frequencies: [1e9, 2e9], load: { re: 50, im: 0 }, elements: [] as Element[] }
    const argOf = (patch: Record<string, unknown>) => {
      try {
        sweep({ ...base, ...patch } as never)
      } catch (e) {
        return (e as RfInputError).argument
      }
      return 'no error'
    }
    expect(argOf({ elements: [{ kind: 'line', z0: 50, deg: 30 }] })).toBe('elements[0].fRef')
    expect(argOf({ elements: [{ kind: 'L', placement: 'series', value: 1e-9 }, { kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 30 }] })).toBe('elements[1].fRef')
    expect(argOf({ frequencies: [1e9, -1] })).toBe('frequencies[1]')
    expect(argOf({ frequencies: [] })).toBe('frequencies')
    expect(argOf({ load: [{ re: 1, im: 0 }] })).toBe('load')
    expect(argOf({ load: [{ re: 1, im: 0 }, { re: NaN, im: 0 }] })).toBe('load[1]')
    expect(argOf({ z0: NaN })).toBe('z0')
  })
})
