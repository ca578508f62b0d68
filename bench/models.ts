// Part models' cost: a 1001-point × 10-element band sweep where every element carries a model
// (a Q table, self-resonance or ESL, pads) against the same ladder with ideal parts (constant Q),
// timed alternately in one run; reports medians, p95 and the ratio modelled/ideal (target ≤ 2).
// A Q table's 1/Q(f) on a band is cached per table (models.ts), as a board sweeps the same band
// frame after frame; the "fresh tables" line gives the cost before that cache holds them.
import { pathToFileURL } from 'node:url'
import { sweep, sweepFlat, type Complex, type Element, type PartModel } from '../shared/rf/index'

const Q_L: PartModel['q'] = [[1e8, 25], [5e8, 48], [1.5e9, 64], [3e9, 52], [6e9, 30]]
const Q_C: PartModel['q'] = [[1e8, 1200], [5e8, 640], [1.5e9, 320], [3e9, 190], [6e9, 90]]

/** 10 L and C parts, series and shunt, each with a model. */
export const MODELLED_LADDER: Element[] = [
  { kind: 'C', placement: 'shunt', value: 1.2e-12, model: { q: Q_C, esl: 0.4e-9, padC: 0.1e-12 } },
  { kind: 'L', placement: 'series', value: 3.3e-9, model: { q: Q_L, srf: 7.5e9, padC: 0.15e-12 } },
  { kind: 'C', placement: 'series', value: 4.7e-12, model: { q: Q_C, esl: 0.5e-9, padC: 0.12e-12 } },
  { kind: 'L', placement: 'shunt', value: 8.2e-9, model: { q: Q_L, srf: 4.4e9, padC: 0.1e-12 } },
  { kind: 'C', placement: 'shunt', value: 0.8e-12, model: { q: Q_C, esl: 0.35e-9, padC: 0.1e-12 } },
  { kind: 'L', placement: 'series', value: 2.2e-9, model: { q: Q_L, srf: 9e9, padC: 0.15e-12 } },
  { kind: 'C', placement: 'series', value: 10e-12, model: { q: Q_C, esl: 0.6e-9, padC: 0.12e-12 } },
  { kind: 'L', placement: 'shunt', value: 12e-9, model: { q: Q_L, srf: 3.8e9, padC: 0.1e-12 } },
  { kind: 'C', placement: 'shunt', value: 2.2e-12, model: { q: Q_C, esl: 0.45e-9, padC: 0.1e-12 } },
  { kind: 'L', placement: 'series', value: 5.6e-9, model: { q: Q_L, srf: 5.8e9, padC: 0.15e-12 } },
]
/** The same parts, ideal: no model, the constant Q of the table's middle row. */
export const IDEAL_LADDER: Element[] = MODELLED_LADDER.map((e) => {
  if (e.kind !== 'L' && e.kind !== 'C') return e
  const { model, ...rest } = e
  return { ...rest, q: model!.q![2]![1] }
})
const LOAD: Complex = { re: 42, im: -18 }
const BAND = Array.from({ length: 1001 }, (_, i) => 2.0e9 + (0.9e9 * i) / 1000)

type Stats = { medianUs: number; p95Us: number }
export type ModelsBenchResult = {
  ideal: Stats; modelled: Stats; idealFlat: Stats; modelledFlat: Stats; cold: Stats
  ratio: number; ratioFlat: number; ratioCold: number
}

function stats(times: number[]): Stats {
  const s = [...times].sort((a, b) => a - b)
  return { medianUs: s[Math.floor(s.length / 2)]!, p95Us: s[Math.floor(s.length * 0.95)]! }
}

function timeOnce(work: () => unknown): number {
  const start = performance.now()
  work()
  return (performance.now() - start) * 1000
}

/** Alternates the two sweeps call by call so that both see the same machine load. */
export function runModelsBench(calls = 2000): ModelsBenchResult {
  const args = (elements: Element[]) => ({ z0: 50, frequencies: BAND, load: LOAD, elements })
  const ideal = args(IDEAL_LADDER)
  const modelled = args(MODELLED_LADDER)
  for (let i = 0; i < 300; i++) { sweep(ideal); sweep(modelled); sweepFlat(ideal); sweepFlat(modelled) }
  const t = { ideal: [] as number[], modelled: [] as number[], idealFlat: [] as number[], modelledFlat: [] as number[], cold: [] as number[] }
  for (let i = 0; i < calls; i++) {
    // Cold: fresh Q tables (as after a document change), so no 1/Q(f) is cached for them yet.
    const fresh = args(structuredClone(MODELLED_LADDER))
    t.cold.push(timeOnce(() => sweep(fresh)))
    t.ideal.push(timeOnce(() => sweep(ideal)))
    t.modelled.push(timeOnce(() => sweep(modelled)))
    t.idealFlat.push(timeOnce(() => sweepFlat(ideal)))
    t.modelledFlat.push(timeOnce(() => sweepFlat(modelled)))
  }
  const r = { ideal: stats(t.ideal), modelled: stats(t.modelled), idealFlat: stats(t.idealFlat), modelledFlat: stats(t.modelledFlat), cold: stats(t.cold) }
  return {
    ...r,
    ratio: r.modelled.medianUs / r.ideal.medianUs,
    ratioFlat: r.modelledFlat.medianUs / r.idealFlat.medianUs,
    ratioCold: r.cold.medianUs / r.ideal.medianUs,
  }
}

export function printModelsBench(r: ModelsBenchResult): void {
  const f = (s: Stats) => `median ${s.medianUs.toFixed(1)} µs, p95 ${s.p95Us.toFixed(1)} µs`
  console.log(`models: sweep 1001 f × 10 ideal parts: ${f(r.ideal)}; all modelled (Q tables, srf/ESL, pads): ${f(r.modelled)}`)
  console.log(`models: sweepFlat ideal: ${f(r.idealFlat)}; modelled: ${f(r.modelledFlat)}`)
  console.log(`models: modelled with fresh Q tables (1/Q(f) not yet cached for the band): ${f(r.cold)}`)
  console.log(`models: ratio modelled/ideal by medians (target ≤ 2): sweep ${r.ratio.toFixed(2)}, sweepFlat ${r.ratioFlat.toFixed(2)}, fresh tables ${r.ratioCold.toFixed(2)}`)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printModelsBench(runModelsBench())
}
