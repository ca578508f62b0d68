/**
 * cos t and sin t of a line's or stub's electrical length across a band, t = deg·f/fRef (in
 * radians), for the kernel in points.ts.
 *
 * Two things on purpose:
 * - Whole multiples of 90° give exactly 0 and ±1, so a quarter-wave line turns a short into an
 *   exact open and a 0° or 90° stub is an exact open or short (only checked when Math.cos or
 *   Math.sin is already tiny, to keep the loop fast).
 * - On a uniform frequency grid (what a board's band is) the angles step by a constant, and the
 *   pair is advanced by a rotation (4 multiplications instead of a cos and a sin), re-seeded
 *   exactly every RESEED points so that rounding cannot build up (error below 1e-14).
 */
const RAD_PER_DEG = Math.PI / 180
const NEAR_ZERO = 1e-12
const RESEED = 32
// A grid counts as uniform when every step equals the first to this fraction of the frequency.
const UNIFORM = 1e-13

function exactCosSin(tDeg: number, i: number, c: number, s: number, cosOut: Float64Array, sinOut: Float64Array): void {
  const quarter = tDeg / 90
  if (Number.isInteger(quarter)) {
    const k = ((quarter % 4) + 4) % 4
    c = k === 0 ? 1 : k === 2 ? -1 : 0
    s = k === 1 ? 1 : k === 3 ? -1 : 0
  }
  cosOut[i] = c
  sinOut[i] = s
}

/** True when f[i] = f[0] + i·(f[1] − f[0]) for every i, within rounding. */
export function isUniformGrid(frequenciesHz: Float64Array): boolean {
  const n = frequenciesHz.length
  if (n < 3) return false
  const f0 = frequenciesHz[0]!
  const step = frequenciesHz[1]! - f0
  if (!(step > 0)) return false
  for (let i = 2; i < n; i++) {
    const f = frequenciesHz[i]!
    if (Math.abs(f - f0 - i * step) > UNIFORM * f) return false
  }
  return true
}

/**
 * Writes cos t and sin t for every frequency, t = deg·f/fRef (t = deg when fRef is undefined),
 * into cosOut and sinOut. `uniform` (from `isUniformGrid`) allows the rotation recurrence.
 */
export function electricalCosSin(
  deg: number, fRef: number | undefined, frequenciesHz: Float64Array, uniform: boolean,
  cosOut: Float64Array, sinOut: Float64Array,
): void {
  const n = frequenciesHz.length
  const radPerHz = fRef === undefined ? 0 : (deg * RAD_PER_DEG) / fRef
  if (fRef === undefined || !uniform) {
    for (let i = 0; i < n; i++) {
      const t = fRef === undefined ? deg * RAD_PER_DEG : radPerHz * frequenciesHz[i]!
      const c = Math.cos(t)
      const s = Math.sin(t)
      if (Math.abs(c) < NEAR_ZERO || Math.abs(s) < NEAR_ZERO) {
        exactCosSin(fRef === undefined ? deg : (deg * frequenciesHz[i]!) / fRef, i, c, s, cosOut, sinOut)
      } else {
        cosOut[i] = c
        sinOut[i] = s
      }
    }
    return
  }
  const f0 = frequenciesHz[0]!
  const dt = radPerHz * (frequenciesHz[1]! - f0)
  const cd = Math.cos(dt)
  const sd = Math.sin(dt)
  let c = 0
  let s = 0
  for (let i = 0; i < n; i++) {
    if (i % RESEED === 0) {
      const t = radPerHz * frequenciesHz[i]!
      c = Math.cos(t)
      s = Math.sin(t)
    } else {
      const next = c * cd - s * sd
      s = s * cd + c * sd
      c = next
    }
    if (Math.abs(c) < NEAR_ZERO || Math.abs(s) < NEAR_ZERO) {
      // deg·f/fRef (not f·(deg/fRef)) so that f = fRef gives exactly deg.
      const f = frequenciesHz[i]!
      exactCosSin((deg * f) / fRef, i, Math.cos(radPerHz * f), Math.sin(radPerHz * f), cosOut, sinOut)
    } else {
      cosOut[i] = c
      sinOut[i] = s
    }
  }
}
