// Match search: the result against a plain exhaustive enumeration of the same set (written here
// with its own scalar arithmetic, not the point kernel), each candidate's figure recomputed through
// sweep, and no lossless candidate ever better than Fano's limit (Fano 1950; Pozar, Microwave
// Engineering, 4th ed., §5.9) on R-C and R-L loads. Seeded random loads throughout.
import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  RfInputError, SEARCH_VALUE_RANGES, bodeFanoLimitDb, createMatchSearch, eSeries, gammaOf, returnLossDb,
  searchMatches, sweep, type Complex, type ESeriesName, type FanoModel, type SearchQ,
} from '../../../shared/rf/index'

type Part = { kind: 'L' | 'C'; isSeries: boolean; value: number; q?: number }

function valuesBetween(series: ESeriesName, [min, max]: readonly [number, number]): number[] {
  const out: number[] = []
  for (let e = -14; e <= -4; e++) {
    for (const m of eSeries(series)) {
      const v = Number(`${m}e${e}`)
      if (v >= min * (1 - 1e-12) && v <= max * (1 + 1e-12)) out.push(v)
    }
  }
  return out
}

/** Every part of the set: series/shunt × L/C × every standard value in range. */
function allParts(series: ESeriesName, q: SearchQ | undefined, ranges = SEARCH_VALUE_RANGES): Part[] {
  const out: Part[] = []
  for (const isSeries of [true, false]) {
    for (const kind of ['L', 'C'] as const) {
      for (const value of valuesBetween(series, ranges[kind])) out.push({ kind, isSeries, value, q: q?.[kind] })
    }
  }
  return out
}

/**
 * The best worst-case |Γ| over all ladders of 1…depth parts, by brute force: each ladder applied
 * part by part to z at each frequency (Z = ESR + jX with ESR = |X|/Q; shunt through 1/Z), Γ =
 * (z − z0)/(z + z0). A ladder is abandoned once one frequency is worse than the best so far,
 * which cannot change the minimum.
 */
function exhaustiveBest(z0: number, freqs: number[], loads: Complex[], parts: Part[], depth: number): number {
  const n = freqs.length
  const zr = Array.from({ length: depth + 1 }, () => new Float64Array(n))
  const zi = Array.from({ length: depth + 1 }, () => new Float64Array(n))
  loads.forEach((z, i) => { zr[0]![i] = z.re; zi[0]![i] = z.im })
  // Each part's impedance at each frequency.
  const pr = parts.map((p) => freqs.map((f) => {
    const w = 2 * Math.PI * f
    const x = p.kind === 'L' ? w * p.value : -1 / (w * p.value)
    return [p.q ? Math.abs(x) / p.q : 0, x] as const
  }))
  let best = Infinity
  const apply = (d: number, j: number) => {
    const p = parts[j]!
    for (let i = 0; i < n; i++) {
      const [r, x] = pr[j]![i]!
      let a = zr[d]![i]!, b = zi[d]![i]!
      if (p.isSeries) { a += r; b += x } else {
        const m = a * a + b * b, zm = r * r + x * x
        const ya = a / m + r / zm, yb = -b / m - x / zm
        const ym = ya * ya + yb * yb
        a = ya / ym; b = -yb / ym
      }
      zr[d + 1]![i] = a; zi[d + 1]![i] = b
    }
  }
  const worst = (d: number) => {
    let g = 0
    for (let i = 0; i < n; i++) {
      const a = zr[d]![i]!, b = zi[d]![i]!
      const gi = Math.hypot(a - z0, b) / Math.hypot(a + z0, b)
      if (gi > g) { g = gi; if (g >= best) return g }
    }
    return g
  }
  const walk = (d: number) => {
    for (let j = 0; j < parts.length; j++) {
      apply(d, j)
      best = Math.min(best, worst(d + 1))
      if (d + 1 < depth) walk(d + 1)
    }
  }
  walk(0)
  return best
}

const band = (f1: number, f2: number, n: number) => Array.from({ length: n }, (_, i) => f1 + ((f2 - f1) * i) / (n - 1))

function randomLoads(rng: () => number, freqs: number[]): Complex[] {
  // Half fixed impedances, half an R-C or R-L model that moves across the band.
  const r = 5 * 10 ** (rng() * 1.6)
  if (rng() < 0.5) return freqs.map(() => ({ re: r, im: (rng() < 0.5 ? -1 : 1) * 10 ** (rng() * 2.2) }))
  const x0 = (rng() - 0.5) * 200
  const fc = freqs[Math.floor(freqs.length / 2)]!
  return freqs.map((f) => ({ re: r, im: x0 > 0 ? (x0 * f) / fc : (x0 * fc) / f }))
}

function expectSweepAgrees(z0: number, freqs: number[], load: Complex[], result: ReturnType<typeof searchMatches>) {
  for (const c of result.candidates) {
    const z = sweep({ z0, frequencies: freqs, load, elements: c.elements })
    const worst = Math.min(...z.map((zz) => returnLossDb(gammaOf(zz, z0))))
    expect(Math.abs(worst - c.worstReturnLossDb)).toBeLessThan(1e-6)
  }
}

describe('searchMatches against exhaustive enumeration', () => {
  const rng = seedrandom('gammaboard-search-exhaustive')
  const cases2 = Array.from({ length: 6 }, (_, i) => ({ i, q: i % 2 === 0 ? undefined : { L: 40, C: 200 } }))

  it.each(cases2)('two parts, full E12 set, case %#', ({ q }) => {
    const freqs = band(0.8e9, 1.0e9, 7)
    const load = randomLoads(rng, freqs)
    const exact = exhaustiveBest(50, freqs, load, allParts('E12', q), 2)
    const result = searchMatches({ z0: 50, frequencies: freqs, load, series: 'E12', maxElements: 2, q })
    expect(result.candidates.length).toBeGreaterThan(0)
    expect(Math.abs(result.candidates[0]!.worstReturnLossDb - returnLossDb(exact))).toBeLessThan(0.1)
    expectSweepAgrees(50, freqs, load, result)
  })

  it('two parts, full E24 set, 21 frequencies', () => {
    const freqs = band(2.3e9, 2.5e9, 21)
    const load = randomLoads(rng, freqs)
    const exact = exhaustiveBest(50, freqs, load, allParts('E24', undefined), 2)
    const result = searchMatches({ z0: 50, frequencies: freqs, load, series: 'E24', maxElements: 2 })
    expect(Math.abs(result.candidates[0]!.worstReturnLossDb - returnLossDb(exact))).toBeLessThan(0.1)
  })

  const ranges = { L: [1e-9, 1e-7], C: [1e-12, 1e-10] } as const
  it.each([0, 1, 2, 3])('three parts, E12 on 1–100 nH and 1–100 pF, case %i', (i) => {
    const q = i % 2 === 0 ? undefined : { L: 40, C: 200 }
    const freqs = band(0.8e9, 1.0e9, 7)
    const load = randomLoads(rng, freqs)
    const exact = exhaustiveBest(50, freqs, load, allParts('E12', q, ranges), 3)
    const result = searchMatches({ z0: 50, frequencies: freqs, load, series: 'E12', maxElements: 3, q, ranges })
    expect(Math.abs(result.candidates[0]!.worstReturnLossDb - returnLossDb(exact))).toBeLessThan(0.1)
    expectSweepAgrees(50, freqs, load, result)
  })
})

describe('searchMatches results', () => {
  it('lists candidates best first, distinct, with element JSON from the set', () => {
    const freqs = band(2.4e9, 2.5e9, 11)
    const result = searchMatches({ z0: 50, frequencies: freqs, load: { re: 12, im: -20 }, series: 'E24', maxElements: 3, q: { L: 40, C: 200 } })
    const rls = result.candidates.map((c) => c.worstReturnLossDb)
    expect(rls).toEqual([...rls].sort((a, b) => b - a))
    const keys = result.candidates.map((c) => JSON.stringify(c.elements))
    expect(new Set(keys).size).toBe(keys.length)
    const e24 = new Set(eSeries('E24').map((m) => m.toFixed(1)))
    for (const c of result.candidates) {
      for (const e of c.elements) {
        expect(['L', 'C']).toContain(e.kind)
        expect(e.q).toBe(e.kind === 'L' ? 40 : 200)
        expect(e24.has((e.value / 10 ** Math.floor(Math.log10(e.value * (1 + 1e-12)))).toFixed(1))).toBe(true)
      }
      expect(c.centreLossDb).toBeGreaterThan(0)
    }
    expect(result.searched).toBe(580 + 580 ** 2 + 580 ** 3)
  })

  it('steps to the same result as one call, with progress counted', () => {
    const input = { z0: 50, frequencies: band(0.9e9, 1e9, 5), load: { re: 30, im: 40 }, series: 'E12' as const, maxElements: 3 }
    const s = createMatchSearch(input)
    let steps = 0
    while (!s.isDone) { s.step(37); steps++ }
    expect(s.completed).toBe(s.total)
    expect(steps).toBe(Math.ceil(s.total / 37))
    expect(s.result().candidates).toEqual(searchMatches(input).candidates)
  })

  it.each([
    [{ z0: 0 }, 'z0'],
    [{ frequencies: [] }, 'frequencies'],
    [{ frequencies: [1e9, -1] }, 'frequencies[1]'],
    [{ load: [{ re: 10, im: 0 }] }, 'load'],
    [{ load: { re: -1, im: 0 } }, 'load'],
    [{ series: 'E6' }, 'series'],
    [{ maxElements: 4 }, 'maxElements'],
    [{ q: { L: 0 } }, 'q.L'],
    [{ limit: 0 }, 'limit'],
  ])('names the bad argument %#', (patch, argument) => {
    const input = { z0: 50, frequencies: [1e9, 1.1e9], load: { re: 10, im: 5 }, series: 'E12', maxElements: 2, ...patch }
    try {
      searchMatches(input as never)
      expect.unreachable()
    } catch (error) {
      expect(error).toBeInstanceOf(RfInputError)
      expect((error as RfInputError).argument).toBe(argument)
    }
  })
})

describe('no lossless candidate beats Fano\'s limit', () => {
  const rng = seedrandom('gammaboard-search-fano')
  const models: FanoModel[] = ['series-RC', 'parallel-RC', 'series-RL', 'parallel-RL']
  it.each(Array.from({ length: 8 }, (_, i) => models[i % 4]!))('%s load', (model) => {
    const f0 = 0.5e9 + rng() * 2e9
    const fractional = 0.05 + rng() * 0.3
    const freqs = band(f0 * (1 - fractional / 2), f0 * (1 + fractional / 2), 15)
    const r = 10 + rng() * 150
    const x = 10 + rng() * 150 // |X| at f0, as a series or parallel part
    const w0 = 2 * Math.PI * f0
    const c = 1 / (w0 * x)
    const l = x / w0
    const load = freqs.map((f) => {
      const w = 2 * Math.PI * f
      const xf = model.endsWith('RC') ? -1 / (w * c) : w * l
      if (model.startsWith('series')) return { re: r, im: xf }
      const d = r * r + xf * xf
      return { re: (r * xf * xf) / d, im: (r * r * xf) / d }
    })
    const limit = bodeFanoLimitDb({ model, r, c, l, fStart: freqs[0]!, fStop: freqs[freqs.length - 1]! })
    const result = searchMatches({ z0: 50, frequencies: freqs, load, series: 'E24', maxElements: 3 })
    expect(result.candidates.length).toBeGreaterThan(0)
    for (const cand of result.candidates) expect(cand.worstReturnLossDb).toBeLessThanOrEqual(limit + 1e-9)
  })
})
