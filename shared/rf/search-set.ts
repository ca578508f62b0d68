/**
 * The set the match search covers, laid out for fast scanning: four part kinds (series L, series
 * C, shunt L, shunt C), each with its standard values and, per frequency, the direction d(f) in
 * which the part moves the point: the part adds t·d(f) to the impedance (series) or the admittance
 * (shunt), with t the value itself or its reciprocal so that d(f) does not depend on the value.
 * The coefficients come from the point kernel (`reactiveCoefficients`), so finite Q is the same
 * ESR = |X|/Q model as everywhere else.
 */
import type { ESeriesName, LumpedElement, Placement } from './types'
import { standardValuesBetween } from './eseries'
import { reactiveCoefficients } from './points'

/** The value ranges of the search set (H and F): 0.1 nH to 10 µH, 0.1 pF to 1 µF. */
export const SEARCH_VALUE_RANGES = { L: [1e-10, 1e-5], C: [1e-13, 1e-6] } as const

export type SearchQ = { readonly L?: number; readonly C?: number }

/** One part kind of the set. `t` ascending; `values[i]` is the part value (H or F) for `t[i]`. */
export type SearchKind = {
  readonly kind: 'L' | 'C'
  readonly placement: Placement
  readonly q: number | undefined
  /** t = value, or 1/value when `isInverse` (series C, shunt L). */
  readonly isInverse: boolean
  readonly t: Float64Array
  readonly values: Float64Array
  /** d(f) per frequency: the added impedance (series) or admittance (shunt) is t·d(f). */
  readonly dRe: Float64Array
  readonly dIm: Float64Array
}

/** The order of kinds in the set; series kinds first (the index is part of a ladder's key). */
const KIND_ORDER: readonly { kind: 'L' | 'C'; placement: Placement }[] = [
  { kind: 'L', placement: 'series' },
  { kind: 'C', placement: 'series' },
  { kind: 'L', placement: 'shunt' },
  { kind: 'C', placement: 'shunt' },
]

export type SearchRanges = { readonly L?: readonly [number, number]; readonly C?: readonly [number, number] }

/** The four kinds for this band, series and Q (ranges default to `SEARCH_VALUE_RANGES`). */
export function searchKinds(frequencies: Float64Array, series: ESeriesName, q: SearchQ | undefined, ranges: SearchRanges = {}): SearchKind[] {
  return KIND_ORDER.map(({ kind, placement }) => {
    const [min, max] = ranges[kind] ?? SEARCH_VALUE_RANGES[kind]
    const ascending = standardValuesBetween(series, min, max)
    const partQ = q?.[kind]
    const unit = reactiveCoefficients(kind, placement, 1, partQ)
    const isInverse = unit.isInverse
    const values = Float64Array.from(isInverse ? ascending.slice().reverse() : ascending)
    const t = values.map((v) => (isInverse ? 1 / v : v))
    const n = frequencies.length
    const dRe = new Float64Array(n)
    const dIm = new Float64Array(n)
    for (let i = 0; i < n; i++) {
      const g = isInverse ? 1 / frequencies[i]! : frequencies[i]!
      dRe[i] = unit.cr * g
      dIm[i] = unit.ci * g
    }
    return { kind, placement, q: partQ, isInverse, t, values, dRe, dIm }
  })
}

/** A part of the set: kind index into `searchKinds`, value index into that kind's `t`. */
export type PartRef = { readonly k: number; readonly i: number }

/** The element JSON of a part (with its Q when the search had one). */
export function partElement(kinds: readonly SearchKind[], p: PartRef): LumpedElement {
  const s = kinds[p.k]!
  const e: LumpedElement = { kind: s.kind, placement: s.placement, value: s.values[p.i]! }
  return s.q === undefined ? e : { ...e, q: s.q }
}

/** The index of `value` in a kind's values (relative match), or -1. */
export function valueIndex(s: SearchKind, value: number): number {
  const target = s.isInverse ? 1 / value : value
  let lo = 0
  let hi = s.t.length - 1
  while (lo <= hi) {
    const mid = (lo + hi) >> 1
    const t = s.t[mid]!
    if (Math.abs(t - target) <= 1e-9 * target) return mid
    if (t < target) lo = mid + 1
    else hi = mid - 1
  }
  return -1
}

/**
 * Neighbouring parts of the same placement commute (series impedances add, shunt admittances
 * add), so of each run only one order is kept: a part may follow one of the same placement only
 * if its (kind, index) is not below the previous one's. This keeps every network once.
 */
export function mayFollow(kinds: readonly SearchKind[], previous: PartRef | undefined, next: PartRef): boolean {
  if (!previous || kinds[previous.k]!.placement !== kinds[next.k]!.placement) return true
  return next.k > previous.k || (next.k === previous.k && next.i >= previous.i)
}

/** Puts each run of same-placement parts in the order `mayFollow` keeps. */
export function canonicalParts(kinds: readonly SearchKind[], parts: readonly PartRef[]): PartRef[] {
  const out: PartRef[] = []
  let run: PartRef[] = []
  const flush = () => {
    run.sort((a, b) => a.k - b.k || a.i - b.i)
    out.push(...run)
    run = []
  }
  for (const p of parts) {
    if (run.length > 0 && kinds[run[0]!.k]!.placement !== kinds[p.k]!.placement) flush()
    run.push(p)
  }
  flush()
  return out
}
