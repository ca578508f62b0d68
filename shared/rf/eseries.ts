/**
 * Preferred values of IEC 60063 (E12, E24, E48, E96) and snapping a part value to the nearest.
 *
 * E12 and E24 are the published lists: they are NOT round(10^(i/N)) (E24 has 2.7, 3.0, 3.3, 3.6,
 * 3.9, 4.3, 4.7 and 8.2 where rounding would give other values), so they are written out. E48
 * and E96 equal 10^(i/N) rounded to three figures with no exception (checked against the
 * reference list), so they are computed. Lists recalled from memory and checked by the tests.
 */
import type { ESeriesName } from './types'
import { RfInputError, describe, requirePositive } from './errors'

const E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2] as const
const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
  3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
] as const

function roundedSeries(n: number): number[] {
  return Array.from({ length: n }, (_, i) => Math.round(100 * 10 ** (i / n)) / 100)
}

const TABLES: Record<ESeriesName, readonly number[]> = {
  E12: Object.freeze([...E12]),
  E24: Object.freeze([...E24]),
  E48: Object.freeze(roundedSeries(48)),
  E96: Object.freeze(roundedSeries(96)),
}

/** The names `nearestStandard` accepts. */
export const E_SERIES_NAMES: readonly ESeriesName[] = ['E12', 'E24', 'E48', 'E96']

function table(name: unknown): readonly number[] {
  if (typeof name !== 'string' || !(name in TABLES)) {
    throw new RfInputError('series', `must be one of ${E_SERIES_NAMES.join(', ')}, got ${describe(name)}`)
  }
  return TABLES[name as ESeriesName]
}

/** One decade of an E-series: the mantissas in [1, 10), ascending (e.g. E12: 1.0, 1.2 … 8.2). */
export function eSeries(name: ESeriesName): readonly number[] {
  return table(name)
}

/** m·10^e computed so that e.g. 4.7·10⁻¹² is the double nearest 4.7e-12. */
function scaled(mantissa: number, exponent: number): number {
  return Number(`${mantissa}e${exponent}`)
}

/**
 * The standard value of `series` nearest to `value` (> 0), in any decade, nearest on a
 * logarithmic scale (the geometric mean of two neighbours is the boundary), so the relative
 * error is what is minimised. Ties go to the larger value. e.g. 38.98 nH → 39 nH (E12).
 */
export function nearestStandard(value: number, series: ESeriesName): number {
  const v = requirePositive(value, 'value')
  const list = table(series)
  const exponent = Math.floor(Math.log10(v))
  let best = NaN
  let bestDistance = Infinity
  // Candidates from the decade below to the decade above, to cover rounding of log10 at edges.
  for (let e = exponent - 1; e <= exponent + 1; e++) {
    for (const m of list) {
      const candidate = scaled(m, e)
      const distance = Math.abs(Math.log(candidate / v))
      if (distance < bestDistance - 1e-15 || (Math.abs(distance - bestDistance) <= 1e-15 && candidate > best)) {
        best = candidate
        bestDistance = distance
      }
    }
  }
  return best
}

/** The standard values of `series` just below-or-equal and just above-or-equal to `value`. */
export function standardNeighbours(value: number, series: ESeriesName): { below: number; above: number } {
  const v = requirePositive(value, 'value')
  const list = table(series)
  const exponent = Math.floor(Math.log10(v))
  const candidates: number[] = []
  for (let e = exponent - 1; e <= exponent + 1; e++) for (const m of list) candidates.push(scaled(m, e))
  const below = Math.max(...candidates.filter((c) => c <= v * (1 + 1e-12)))
  const above = Math.min(...candidates.filter((c) => c >= v * (1 - 1e-12)))
  return { below, above }
}

/**
 * Every standard value of `series` from `min` to `max` (both > 0, ends included when they are
 * standard values themselves), ascending; each the double nearest m·10^e.
 */
export function standardValuesBetween(series: ESeriesName, min: number, max: number): number[] {
  const lo = requirePositive(min, 'min')
  const hi = requirePositive(max, 'max')
  const list = table(series)
  const out: number[] = []
  for (let e = Math.floor(Math.log10(lo)) - 1; e <= Math.floor(Math.log10(hi)) + 1; e++) {
    for (const m of list) {
      const v = scaled(m, e)
      if (v >= lo * (1 - 1e-12) && v <= hi * (1 + 1e-12)) out.push(v)
    }
  }
  return out
}
