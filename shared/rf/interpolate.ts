/**
 * Measured data onto other frequencies: piecewise-linear interpolation between the two nearest
 * measured points, never beyond the measured range. A frequency outside [first, last] gets no
 * value (`null`) and is listed in `outsideHz`, so the caller shows it instead of quietly
 * extrapolating.
 *
 * Two modes (both common practice for network-analyser data):
 * - 'reIm' (default): re and im each linear in f. Exact for data that is linear in f between
 *   points; cuts a little inside the circle between widely spaced points of a fast-rotating Γ.
 * - 'magPhase': |x| linear and the phase linear along the shorter way round (|Δφ| ≤ 180°).
 *   Keeps a long delay's rotation on its circle; preferred when the points are far apart in
 *   phase. A zero magnitude at one end takes the other end's phase.
 */
import type { Complex } from './types'
import { RfInputError } from './errors'

export type InterpolationMode = 'reIm' | 'magPhase'

/** Relative slack at the two ends, so a band edge computed in floating point (800e6 + k·step) still counts as inside. */
const EDGE_SLACK = 1e-9

/** The measured range of a strictly increasing frequency list (Hz). */
export type FrequencyRange = { readonly fMinHz: number; readonly fMaxHz: number }

/** The range a measured frequency list covers. Throws for an empty list. */
export function rangeOf(frequenciesHz: ArrayLike<number>): FrequencyRange {
  if (frequenciesHz.length === 0) throw new RfInputError('frequencies', 'must hold at least one measured frequency')
  return { fMinHz: frequenciesHz[0]!, fMaxHz: frequenciesHz[frequenciesHz.length - 1]! }
}

/** True when f lies inside the range (with a relative slack of 1e-9 at each end). */
export function isInRange(range: FrequencyRange, frequencyHz: number): boolean {
  return frequencyHz >= range.fMinHz * (1 - EDGE_SLACK) && frequencyHz <= range.fMaxHz * (1 + EDGE_SLACK)
}

/**
 * Where f falls among the measured points: the index k of the segment [f_k, f_k+1] and the
 * fraction t ∈ [0, 1] along it, or null outside the range. A single measured point covers only
 * its own frequency (t = 0).
 */
export function locate(frequenciesHz: ArrayLike<number>, frequencyHz: number): { k: number; t: number } | null {
  const n = frequenciesHz.length
  if (n === 0 || !isInRange(rangeOf(frequenciesHz), frequencyHz)) return null
  if (n === 1 || frequencyHz <= frequenciesHz[0]!) return { k: 0, t: 0 }
  if (frequencyHz >= frequenciesHz[n - 1]!) return { k: n - 2, t: 1 }
  let lo = 0
  let hi = n - 1
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1
    if (frequenciesHz[mid]! <= frequencyHz) lo = mid
    else hi = mid
  }
  const f0 = frequenciesHz[lo]!
  return { k: lo, t: (frequencyHz - f0) / (frequenciesHz[lo + 1]! - f0) }
}

/** The value a fraction t of the way from x0 to x1, in the given mode. */
export function blend(x0: Complex, x1: Complex, t: number, mode: InterpolationMode = 'reIm'): Complex {
  if (t === 0) return x0
  if (t === 1) return x1
  if (mode === 'reIm') return { re: x0.re + t * (x1.re - x0.re), im: x0.im + t * (x1.im - x0.im) }
  const m0 = Math.hypot(x0.re, x0.im)
  const m1 = Math.hypot(x1.re, x1.im)
  const p0 = m0 === 0 ? Math.atan2(x1.im, x1.re) : Math.atan2(x0.im, x0.re)
  const p1 = m1 === 0 ? p0 : Math.atan2(x1.im, x1.re)
  let dp = p1 - p0
  if (dp > Math.PI) dp -= 2 * Math.PI
  else if (dp < -Math.PI) dp += 2 * Math.PI
  const m = m0 + t * (m1 - m0)
  const p = p0 + t * dp
  return { re: m * Math.cos(p), im: m * Math.sin(p) }
}

/** Values on the target frequencies; `values[i]` is null exactly when targetsHz[i] is in `outsideHz`. */
export type Interpolated<T> = { readonly values: (T | null)[]; readonly outsideHz: number[] }

/**
 * Interpolates complex values measured at `frequenciesHz` (strictly increasing) onto `targetsHz`.
 * Targets outside the measured range get null and are listed in `outsideHz`.
 */
export function interpolateComplex(
  frequenciesHz: ArrayLike<number>, values: readonly Complex[], targetsHz: ArrayLike<number>,
  mode: InterpolationMode = 'reIm',
): Interpolated<Complex> {
  if (values.length !== frequenciesHz.length) {
    throw new RfInputError('values', `has ${values.length} values for ${frequenciesHz.length} frequencies`)
  }
  const out: (Complex | null)[] = new Array(targetsHz.length)
  const outsideHz: number[] = []
  for (let i = 0; i < targetsHz.length; i++) {
    const at = locate(frequenciesHz, targetsHz[i]!)
    if (!at) { out[i] = null; outsideHz.push(targetsHz[i]!); continue }
    out[i] = at.t === 0 ? values[at.k]! : blend(values[at.k]!, values[at.k + 1]!, at.t, mode)
  }
  return { values: out, outsideHz }
}

/**
 * Interpolates whole N×N matrices (`s[k][i][j]` at frequenciesHz[k]) onto `targetsHz`, element by
 * element, with the same outside-range rule as `interpolateComplex`.
 */
export function interpolateMatrices(
  frequenciesHz: ArrayLike<number>, s: readonly (readonly (readonly Complex[])[])[], targetsHz: ArrayLike<number>,
  mode: InterpolationMode = 'reIm',
): Interpolated<Complex[][]> {
  if (s.length !== frequenciesHz.length) {
    throw new RfInputError('s', `has ${s.length} matrices for ${frequenciesHz.length} frequencies`)
  }
  const out: (Complex[][] | null)[] = new Array(targetsHz.length)
  const outsideHz: number[] = []
  for (let n = 0; n < targetsHz.length; n++) {
    const at = locate(frequenciesHz, targetsHz[n]!)
    if (!at) { out[n] = null; outsideHz.push(targetsHz[n]!); continue }
    const m0 = s[at.k]!
    const m1 = at.t === 0 ? m0 : s[at.k + 1]!
    out[n] = m0.map((row, i) => row.map((x, j) => blend(x, m1[i]![j]!, at.t, mode)))
  }
  return { values: out, outsideHz }
}
