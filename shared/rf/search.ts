/**
 * Broadband match search over ladders of standard parts.
 *
 * The set: every ladder of 1…maxElements (≤ 3) parts, each a series or shunt L or C of the chosen
 * E-series from 0.1 nH to 10 µH and 0.1 pF to 1 µF, at the given Q; the score is the worst return
 * loss against the real z0 over the frequencies. The search returns the best ladders of that set
 * exactly (not an approximation), without scoring most of it:
 *
 * 1. Seeds (search-seeds.ts): closed-form L/pi/T networks at a few band frequencies, refined on
 *    the worst |Γ|, snapped to standard neighbours. They fill the short list, so its threshold g
 *    (the worst |Γ| still kept) is tight from the start.
 * 2. Exact pruning of the last part. A last part of a given kind adds t·d(f) to the impedance
 *    (series) or admittance (shunt) of the point before it (search-set.ts), so at each f the
 *    point moves along a straight line as t varies. |Γ| ≤ g is a disc in both planes: centre
 *    ρ(1 + g²)/(1 − g²), radius 2gρ/(1 − g²), ρ = z0 (impedance) or 1/z0 (admittance), from
 *    |z − z0| = g|z + z0|. A line meets a disc in one interval of t (a quadratic), so the values
 *    that can still enter the list are those in the intersection of the intervals over all f.
 *    Only they are scored (by the point kernel); an empty intersection, usually found at the
 *    first band edge tried, drops that prefix's whole kind at once. This is exact: a value
 *    outside the intersection has |Γ| > g at some frequency.
 * 3. Prefixes (the parts before the last) are enumerated in full, one first part per work unit;
 *    the prefix impedance is t·d(f) added in the right plane (no kernel call per prefix).
 * Neighbouring parts of the same placement commute; only one order of each run is visited
 * (`mayFollow`), but `searched` counts the whole set.
 */
import type { Complex, ESeriesName, LumpedElement } from './types'
import { RfInputError, describe, requirePositive } from './errors'
import { asComplex } from './complex'
import { eSeries } from './eseries'
import { returnLossDb } from './gamma'
import { lossesAcrossBand } from './losses'
import { asFloat64, createPoints, setPoint } from './points'
import {
  canonicalParts, mayFollow, partElement, searchKinds,
  type PartRef, type SearchKind, type SearchQ, type SearchRanges,
} from './search-set'
import { LadderScorer, ShortList } from './search-score'
import { closedFormSeeds, refineSeed, standardNeighbourLadders } from './search-seeds'

/** Arguments of `searchMatches`. */
export type SearchInput = {
  readonly z0: number
  readonly frequencies: ArrayLike<number>
  /** One impedance (Ω) for every frequency, or one per frequency. */
  readonly load: Complex | readonly Complex[]
  readonly series: ESeriesName
  /** The largest ladder searched: 1, 2 or 3 parts. */
  readonly maxElements: number
  /** The parts' Q (ESR = |X|/Q); absent: lossless. */
  readonly q?: SearchQ
  /** How many candidates to return (default 10, at most 100). */
  readonly limit?: number
  /** Narrower value ranges inside the set's own (for reduced searches and tests). */
  readonly ranges?: SearchRanges
}

/** One result: the ladder as board element JSON (from the load out) and its figures. */
export type SearchCandidate = {
  readonly elements: LumpedElement[]
  /** The lowest return loss (dB) against z0 over the frequencies. */
  readonly worstReturnLossDb: number
  /** Power burnt in the parts' ESR at the band-centre frequency (dB; 0 when lossless). */
  readonly centreLossDb: number
}

export type SearchResult = {
  /** Best first: higher worst return loss, ties to fewer parts, then lower centre loss. */
  readonly candidates: SearchCandidate[]
  /** The number of ladders in the set covered (every order, pruned ones included). */
  readonly searched: number
  /** How many of them were scored through the point kernel. */
  readonly scored: number
  /** The frequency at which `centreLossDb` is given: the band point nearest the arithmetic centre. */
  readonly centreFrequencyHz: number
}

/** A search taken in steps (for progress and cancel in a worker): `step` until `isDone`. */
export type MatchSearch = {
  readonly total: number
  readonly completed: number
  readonly isDone: boolean
  step(units?: number): void
  result(): SearchResult
}

type Checked = { z0: number; frequencies: Float64Array; loads: Complex[]; maxElements: number; limit: number }

function check(input: SearchInput): Checked {
  if (input === null || typeof input !== 'object') throw new RfInputError('input', `must be an object, got ${describe(input)}`)
  const z0 = requirePositive(input.z0, 'z0')
  const f = input.frequencies
  if (!(Array.isArray(f) || f instanceof Float64Array) || f.length === 0) {
    throw new RfInputError('frequencies', `must be a non-empty array of Hz, got ${describe(f)}`)
  }
  for (let i = 0; i < f.length; i++) requirePositive(f[i], `frequencies[${i}]`)
  const n = f.length
  const raw = input.load
  if (Array.isArray(raw) && raw.length !== n) throw new RfInputError('load', `has ${raw.length} impedances for ${n} frequencies`)
  const loads = Array.from({ length: n }, (_, i) => {
    const name = Array.isArray(raw) ? `load[${i}]` : 'load'
    const z = asComplex(Array.isArray(raw) ? raw[i] : raw, name)
    if (z.re < 0) throw new RfInputError(name, `must be passive (resistance 0 or more), got ${z.re} Ω`)
    return z
  })
  eSeries(input.series)
  const m = input.maxElements
  if (!(m === 1 || m === 2 || m === 3)) throw new RfInputError('maxElements', `must be 1, 2 or 3, got ${describe(m)}`)
  for (const kind of ['L', 'C'] as const) {
    if (input.q?.[kind] !== undefined) requirePositive(input.q[kind], `q.${kind}`)
    const r = input.ranges?.[kind]
    if (r !== undefined && !(Array.isArray(r) && r.length === 2 && r[0] > 0 && r[1] >= r[0])) {
      throw new RfInputError(`ranges.${kind}`, 'must be [min, max] with 0 < min ≤ max')
    }
  }
  const limit = input.limit ?? 10
  if (!(Number.isInteger(limit) && limit >= 1 && limit <= 100)) throw new RfInputError('limit', `must be an integer from 1 to 100, got ${describe(limit)}`)
  return { z0, frequencies: asFloat64(f).slice(), loads, maxElements: m, limit }
}

/** Bisection order of the band (ends first): the early exit of the pruning meets edges soonest. */
function edgeFirstOrder(n: number): Int32Array {
  const order: number[] = [0]
  if (n > 1) order.push(n - 1)
  const seen = new Set(order)
  for (let parts = 2; order.length < n; parts *= 2) {
    for (let j = 1; j < parts; j += 2) {
      const i = Math.round((j * (n - 1)) / parts)
      if (!seen.has(i)) { seen.add(i); order.push(i) }
    }
  }
  return Int32Array.from(order)
}

/** Starts a search; nothing is computed until `step`. Throws `RfInputError` naming a bad argument. */
export function createMatchSearch(input: SearchInput): MatchSearch {
  const c = check(input)
  const { z0, frequencies, loads, maxElements } = c
  const n = frequencies.length
  const kinds = searchKinds(frequencies, input.series, input.q, input.ranges)
  const choices: PartRef[] = kinds.flatMap((s, k) => Array.from(s.t, (_, i) => ({ k, i })))
  const loadPoints = createPoints(n)
  loads.forEach((z, i) => setPoint(loadPoints, i, z))
  const scorer = new LadderScorer(z0, frequencies, loadPoints)
  const list = new ShortList(c.limit)
  const m = choices.length
  let searched = 0
  for (let d = 1; d <= maxElements; d++) searched += m ** d

  const offer = (parts: PartRef[]) => list.offer(scorer.worstGamma(parts.map((p) => partElement(kinds, p))), parts)

  // The prefix point per frequency at each depth (0: the load), in both planes, filled lazily at
  // depth 2: most prefixes are dropped after one or two frequencies.
  const planes = [0, 1, 2].map(() => ({
    zRe: new Float64Array(n), zIm: new Float64Array(n), yRe: new Float64Array(n), yIm: new Float64Array(n),
    hasZ: new Uint8Array(n), hasY: new Uint8Array(n), part: undefined as PartRef | undefined,
  }))
  type Plane = (typeof planes)[number]
  loads.forEach((z, i) => { planes[0]!.zRe[i] = z.re; planes[0]!.zIm[i] = z.im; planes[0]!.hasZ[i] = 1 })

  /** Fills z (series) or y (shunt) at frequency i of depth d, from depth d − 1 and its part. */
  function fill(d: number, i: number, wantSeries: boolean): void {
    const pl = planes[d]!
    if (wantSeries ? pl.hasZ[i] : pl.hasY[i]) return
    if (!(pl.hasZ[i] || pl.hasY[i])) {
      const s = kinds[pl.part!.k]!
      const t = s.t[pl.part!.i]!
      const isSeries = s.placement === 'series'
      fill(d - 1, i, isSeries)
      const parent = planes[d - 1]!
      if (isSeries) {
        pl.zRe[i] = parent.zRe[i]! + t * s.dRe[i]!; pl.zIm[i] = parent.zIm[i]! + t * s.dIm[i]!; pl.hasZ[i] = 1
      } else {
        pl.yRe[i] = parent.yRe[i]! + t * s.dRe[i]!; pl.yIm[i] = parent.yIm[i]! + t * s.dIm[i]!; pl.hasY[i] = 1
      }
      if (wantSeries ? pl.hasZ[i] : pl.hasY[i]) return
    }
    // The other plane: w' = 1/w.
    const [fr, fi, tr, ti] = wantSeries ? [pl.yRe, pl.yIm, pl.zRe, pl.zIm] : [pl.zRe, pl.zIm, pl.yRe, pl.yIm]
    const m2 = fr[i]! * fr[i]! + fi[i]! * fi[i]!
    tr[i] = fr[i]! / m2
    ti[i] = -fi[i]! / m2
    ;(wantSeries ? pl.hasZ : pl.hasY)[i] = 1
  }

  function setPrefix(d: number, p: PartRef): void {
    const pl = planes[d]!
    pl.part = p
    pl.hasZ.fill(0)
    pl.hasY.fill(0)
  }

  // Per kind, the band order tried; a frequency that rejects moves to the front (prefixes that
  // fail tend to fail at the same frequency).
  const orders = kinds.map(() => edgeFirstOrder(n))

  /** Scores every last part that can still enter the list after `prefix` (point at depth prefix.length). */
  function lastPart(prefix: PartRef[]): void {
    const d = prefix.length
    const pl: Plane = planes[d]!
    const previous = prefix[d - 1]
    for (let k = 0; k < kinds.length; k++) {
      const s = kinds[k]!
      const isSeries = s.placement === 'series'
      if (previous && isSeries === (kinds[previous.k]!.placement === 'series') && k < previous.k) continue
      const g = Math.min(list.threshold(), 1 - 1e-9)
      const rho = isSeries ? z0 : 1 / z0
      const centre = (rho * (1 + g * g)) / (1 - g * g)
      const radius2 = ((2 * g * rho) / (1 - g * g)) ** 2
      const wRe = isSeries ? pl.zRe : pl.yRe
      const wIm = isSeries ? pl.zIm : pl.yIm
      const order = orders[k]!
      let lo = 0
      let hi = Infinity
      for (let j = 0; j < n; j++) {
        const i = order[j]!
        fill(d, i, isSeries)
        const wr = wRe[i]! - centre, wi = wIm[i]!
        const dr = s.dRe[i]!, di = s.dIm[i]!
        const a = dr * dr + di * di
        const b = wr * dr + wi * di
        const disc = b * b - a * (wr * wr + wi * wi - radius2)
        if (disc >= 0) {
          const root = Math.sqrt(disc)
          lo = Math.max(lo, (-b - root) / a)
          hi = Math.min(hi, (-b + root) / a)
          if (lo <= hi) continue
        }
        lo = Infinity
        if (j > 0) { order[j] = order[0]!; order[0] = i }
        break
      }
      if (!(lo <= hi)) continue
      // Rounding slack at the ends; every value inside is scored exactly anyway.
      const from = lowerBound(s.t, lo * (1 - 1e-9))
      for (let idx = from; idx < s.t.length && s.t[idx]! <= hi * (1 + 1e-9); idx++) {
        const p = { k, i: idx }
        if (mayFollow(kinds, previous, p)) offer([...prefix, p])
      }
    }
  }

  let completed = 0
  const total = maxElements === 1 ? 1 : 1 + m

  function seedAndShallow(): void {
    for (const seed of closedFormSeeds(z0, frequencies, loads, maxElements)) {
      const refined = refineSeed(seed, scorer, input.ranges ?? {})
      for (const parts of standardNeighbourLadders(refined, kinds)) offer(canonicalParts(kinds, parts))
    }
    lastPart([])
  }

  function firstPart(p: PartRef): void {
    setPrefix(1, p)
    lastPart([p])
    if (maxElements < 3) return
    for (const q of choices) {
      if (!mayFollow(kinds, p, q)) continue
      setPrefix(2, q)
      lastPart([p, q])
    }
  }

  return {
    total,
    get completed() { return completed },
    get isDone() { return completed >= total },
    step(units = Infinity) {
      for (let u = 0; u < units && completed < total; u++) {
        if (completed === 0) seedAndShallow()
        else firstPart(choices[completed - 1]!)
        completed++
      }
    },
    result() {
      if (completed < total) throw new RfInputError('search', 'is not finished: call step() until isDone')
      return finish(list.entries.map((e) => ({ gamma: e.gamma, elements: e.parts.map((p) => partElement(kinds, p)) })), c, searched, scorer.scored)
    },
  }
}

function lowerBound(sorted: Float64Array, x: number): number {
  let lo = 0
  let hi = sorted.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (sorted[mid]! < x) lo = mid + 1
    else hi = mid
  }
  return lo
}

function finish(found: { gamma: number; elements: LumpedElement[] }[], c: Checked, searched: number, scored: number): SearchResult {
  const { frequencies, loads, z0 } = c
  const fMid = (frequencies[0]! + frequencies[frequencies.length - 1]!) / 2
  let centre = 0
  frequencies.forEach((f, i) => { if (Math.abs(f - fMid) < Math.abs(frequencies[centre]! - fMid)) centre = i })
  const candidates = found.map((e) => ({
    elements: e.elements,
    worstReturnLossDb: returnLossDb(e.gamma),
    centreLossDb: lossesAcrossBand({ frequencies: [frequencies[centre]!], load: loads[centre]!, source: { re: z0, im: 0 }, elements: e.elements })
      .dissipativeLossDb[0]!,
  }))
  candidates.sort((a, b) => {
    const byRl = b.worstReturnLossDb - a.worstReturnLossDb
    if (Math.abs(byRl) > 1e-9) return byRl
    return a.elements.length - b.elements.length || a.centreLossDb - b.centreLossDb
  })
  return { candidates, searched, scored, centreFrequencyHz: frequencies[centre]! }
}

/**
 * The best ladders of the search set for the load across the frequencies (see the file comment),
 * best first, each with its element JSON, worst return loss and band-centre loss. Throws
 * `RfInputError` naming a bad argument (`z0`, `frequencies[3]`, `load[2]`, `series`,
 * `maxElements`, `q.L`, `limit`).
 */
export function searchMatches(input: SearchInput): SearchResult {
  const search = createMatchSearch(input)
  search.step()
  return search.result()
}
