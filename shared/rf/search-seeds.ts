/**
 * Starting points for the match search, as an engineer would pick them: the closed-form L, pi and
 * T networks (synthesis.ts) at a few frequencies of the band, each refined continuously on the
 * worst |Γ| over the band, then snapped to the standard values just below and above each refined
 * value. They only give the exact search a good threshold early; they decide nothing.
 */
import type { Complex, Element, LumpedElement } from './types'
import { solveL, solvePi, solveT } from './synthesis'
import { RfInputError } from './errors'
import { SEARCH_VALUE_RANGES, valueIndex, type PartRef, type SearchKind, type SearchRanges } from './search-set'
import type { LadderScorer } from './search-score'

// Loaded Qs tried for pi and T seeds (each below the network's minimum is skipped).
const SEED_QS = [0.5, 1, 2, 4, 8]

/** The frequencies (indices) at which seeds are solved: band ends, middle and quarter points. */
function seedIndices(n: number): number[] {
  const at = [0, 0.25, 0.5, 0.75, 1].map((x) => Math.round(x * (n - 1)))
  return [...new Set(at)]
}

function isLumpedLc(e: Element): e is LumpedElement {
  return (e.kind === 'L' || e.kind === 'C') && 'value' in e && e.value > 0
}

/** Closed-form ladders of 1…maxElements L and C parts, matching load(f) to z0 at seed frequencies. */
export function closedFormSeeds(z0: number, frequencies: Float64Array, loads: readonly Complex[], maxElements: number): LumpedElement[][] {
  const out: LumpedElement[][] = []
  const to = { re: z0, im: 0 }
  for (const k of seedIndices(frequencies.length)) {
    const f = frequencies[k]!
    const from = loads[k]!
    if (!(from.re > 0)) continue
    const ladders: Element[][] = [...solveL({ z0, frequency: f, from, to })]
    if (maxElements >= 3) {
      for (const q of SEED_QS) {
        for (const solve of [solvePi, solveT]) {
          try {
            ladders.push(...solve({ z0, frequency: f, from, to, q }))
          } catch (error) {
            if (!(error instanceof RfInputError)) throw error // a Q below the network's minimum
          }
        }
      }
    }
    for (const l of ladders) {
      if (l.length >= 1 && l.length <= maxElements && l.every(isLumpedLc)) out.push(l as LumpedElement[])
    }
  }
  return out
}

function clampValue(e: LumpedElement, value: number, ranges: SearchRanges): number {
  const [min, max] = ranges[e.kind as 'L' | 'C'] ?? SEARCH_VALUE_RANGES[e.kind as 'L' | 'C']
  return Math.min(max, Math.max(min, value))
}

/**
 * Pattern search on the log of each value, minimising the worst |Γ| over the band: each step
 * tries every value up and down by a factor, keeps any improvement, and halves the factor when
 * none helps (from ×1.5 down to ×1.002).
 */
export function refineSeed(seed: readonly LumpedElement[], scorer: LadderScorer, ranges: SearchRanges): LumpedElement[] {
  let best = seed.map((e) => ({ ...e, value: clampValue(e, e.value, ranges) }))
  let bestGamma = scorer.worstGamma(best)
  for (let step = Math.log(1.5); step > Math.log(1.002); step /= 2) {
    let improved = true
    while (improved) {
      improved = false
      for (let i = 0; i < best.length; i++) {
        for (const sign of [1, -1]) {
          const e = best[i]!
          const trial = best.slice()
          trial[i] = { ...e, value: clampValue(e, e.value * Math.exp(sign * step), ranges) }
          const g = scorer.worstGamma(trial)
          if (g < bestGamma - 1e-12) {
            best = trial
            bestGamma = g
            improved = true
          }
        }
      }
    }
  }
  return best
}

/**
 * The set's ladders around a refined one: each value replaced by the standard value just below
 * or just above it (2^n combinations), as parts of `kinds`.
 */
export function standardNeighbourLadders(refined: readonly LumpedElement[], kinds: readonly SearchKind[]): PartRef[][] {
  const choices = refined.map((e) => {
    const k = kinds.findIndex((s) => s.kind === e.kind && s.placement === e.placement)
    const s = kinds[k]!
    // Index of the first t at or above the refined t, and the one before it.
    const target = s.isInverse ? 1 / e.value : e.value
    let hi = 0
    while (hi < s.t.length && s.t[hi]! < target * (1 - 1e-12)) hi++
    const exact = valueIndex(s, e.value)
    const idx = exact >= 0 ? [exact] : [hi - 1, hi].filter((i) => i >= 0 && i < s.t.length)
    return idx.map((i) => ({ k, i }))
  })
  let combos: PartRef[][] = [[]]
  for (const c of choices) combos = combos.flatMap((prefix) => c.map((p) => [...prefix, p]))
  return combos.filter((c) => c.length === refined.length)
}
