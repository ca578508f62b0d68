/**
 * The computational kernel shared by trace, sweep and applyElement: a batch of impedance points,
 * each at its own frequency, stored in homogeneous form z = a/b on four flat Float64Arrays.
 *
 * Why homogeneous: every element is a bilinear (Möbius) map of z, i.e. a 2×2 chain (ABCD) matrix
 * acting on (a, b). Series Z: (a + Z b, b); shunt Y: (a, Y a + b); line: the line's ABCD matrix;
 * transformer n:1: (n² a, b). An open is (1, 0) and a short is (0, 1), so opens, shorts,
 * zero-length lines, stubs of 0° or 90° and shunt elements on an open are all ordinary finite
 * arithmetic, with no tan() poles and no big-number stand-ins. Only one division per point is
 * done, when the result is read. Source of the element maps: the ABCD parameters of series and
 * shunt impedances and of a lossless line (Pozar, Microwave Engineering, table 4.1, recalled from
 * memory and checked against the reference cases).
 *
 * Hot loop rules: one loop per element kind with the per-element constants hoisted, no object per
 * complex number.
 */
import type { Complex, Element } from './types'
import { divideParts, isInfinite } from './complex'
import { RfInputError } from './errors'

/** n points z[i] = (aRe[i] + j aIm[i]) / (bRe[i] + j bIm[i]). */
export type PointBuffer = {
  readonly n: number
  readonly aRe: Float64Array
  readonly aIm: Float64Array
  readonly bRe: Float64Array
  readonly bIm: Float64Array
}

const RAD_PER_DEG = Math.PI / 180
const TWO_PI = 2 * Math.PI
// Homogeneous coordinates may drift in scale; bring them back well before over- or underflow.
const SCALE_HIGH = 1e100
const SCALE_LOW = 1e-100

/** A buffer of n points, all shorts until set. */
export function createPoints(n: number): PointBuffer {
  const p = { n, aRe: new Float64Array(n), aIm: new Float64Array(n), bRe: new Float64Array(n), bIm: new Float64Array(n) }
  p.bRe.fill(1)
  return p
}

/** Sets point i to impedance z (Ω); `OPEN` (any infinite part) becomes (1, 0). */
export function setPoint(p: PointBuffer, i: number, z: Complex): void {
  if (isInfinite(z)) {
    p.aRe[i] = 1; p.aIm[i] = 0; p.bRe[i] = 0; p.bIm[i] = 0
  } else {
    p.aRe[i] = z.re; p.aIm[i] = z.im; p.bRe[i] = 1; p.bIm[i] = 0
  }
}

/** The impedance a/b at point i (`OPEN` when b = 0). */
export function readImpedance(p: PointBuffer, i: number): Complex {
  return divideParts(p.aRe[i]!, p.aIm[i]!, p.bRe[i]!, p.bIm[i]!)
}

/** The admittance b/a at point i (`OPEN`, i.e. infinite, when a = 0). */
export function readAdmittance(p: PointBuffer, i: number): Complex {
  return divideParts(p.bRe[i]!, p.bIm[i]!, p.aRe[i]!, p.aIm[i]!)
}

// cos and sin of a whole multiple of 90° are exactly 0 or ±1, so that a quarter-wave line turns a
// short into an exact open and a 0° or 90° stub is an exact open or short. Only checked when
// Math.cos or Math.sin is already tiny, to keep the loop fast.
const NEAR_ZERO = 1e-12
const trig = new Float64Array(2)

function exactCosSin(tDeg: number, c: number, s: number): void {
  const quarter = tDeg / 90
  if (Number.isInteger(quarter)) {
    const k = ((quarter % 4) + 4) % 4
    trig[0] = k === 0 ? 1 : k === 2 ? -1 : 0
    trig[1] = k === 1 ? 1 : k === 3 ? -1 : 0
  } else {
    trig[0] = c
    trig[1] = s
  }
}

function setOpen(p: PointBuffer, i: number): void {
  p.aRe[i] = 1; p.aIm[i] = 0; p.bRe[i] = 0; p.bIm[i] = 0
}

function setShort(p: PointBuffer, i: number): void {
  p.aRe[i] = 0; p.aIm[i] = 0; p.bRe[i] = 1; p.bIm[i] = 0
}

/**
 * Applies one (validated) element to every point, point i being at frequenciesHz[i].
 * A line or stub without `fRef` is taken at each point's own frequency (t = deg).
 *
 * Formulas (f the analysis frequency, ω = 2πf, t = deg·f/fRef in radians after conversion):
 * - L: Z = ωL·(1/Q + j); C: Z = (1/Q − j)/(ωC); R: Z = R. Finite Q is the series ESR = |X|/Q.
 *   series: z' = z + Z; shunt: y' = y + 1/Z.
 * - line of Zc: z' = Zc (z + j Zc tan t)/(Zc + j z tan t), done as ABCD [[cos t, j Zc sin t],
 *   [j sin t / Zc, cos t]].
 * - open stub Z = −j Zc cot t, short stub Z = j Zc tan t, each kept as a ratio of cos and sin.
 * - xfmr n:1 (n on the source side): z' = n² z.
 * Exact degenerate parts: series C = 0 or a series stub with an infinite Z gives an open; shunt
 * L = 0, R = 0 or a shunt stub with infinite Y gives a short.
 */
export function applyElementToPoints(p: PointBuffer, element: Element, frequenciesHz: ArrayLike<number>): void {
  const { n, aRe, aIm, bRe, bIm } = p
  switch (element.kind) {
    case 'L':
    case 'C':
    case 'R':
      applyLumped(p, element.kind, element.placement, element.value, element.q, frequenciesHz)
      break
    case 'line': {
      const zc = element.z0
      const radRef = element.deg * RAD_PER_DEG
      for (let i = 0; i < n; i++) {
        const f = frequenciesHz[i]!
        const t = element.fRef === undefined ? radRef : (radRef * f) / element.fRef
        let c = Math.cos(t)
        let s = Math.sin(t)
        if (Math.abs(c) < NEAR_ZERO || Math.abs(s) < NEAR_ZERO) {
          exactCosSin(element.fRef === undefined ? element.deg : (element.deg * f) / element.fRef, c, s)
          c = trig[0]!; s = trig[1]!
        }
        const zs = zc * s
        const ys = s / zc
        const ar = aRe[i]!, ai = aIm[i]!, br = bRe[i]!, bi = bIm[i]!
        aRe[i] = c * ar - zs * bi
        aIm[i] = c * ai + zs * br
        bRe[i] = c * br - ys * ai
        bIm[i] = c * bi + ys * ar
      }
      break
    }
    case 'stub':
      applyStub(p, element.end, element.placement, element.z0, element.deg, element.fRef, frequenciesHz)
      break
    case 'xfmr': {
      const n2 = element.ratio * element.ratio
      for (let i = 0; i < n; i++) {
        aRe[i] = aRe[i]! * n2
        aIm[i] = aIm[i]! * n2
      }
      break
    }
    case 'block':
      // Measured data is not in the element; trace and sweep route blocks through twoport.ts.
      throw new RfInputError('element', 'a measured block is applied through its chain matrices (twoport.ts), not the element kernel')
  }
  rescale(p)
}

function applyLumped(
  p: PointBuffer, kind: 'L' | 'C' | 'R', placement: 'series' | 'shunt', value: number,
  q: number | undefined, frequenciesHz: ArrayLike<number>,
): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const invQ = kind !== 'R' && q !== undefined ? 1 / q : 0
  if (kind === 'R') {
    if (placement === 'series') {
      for (let i = 0; i < n; i++) {
        aRe[i] = aRe[i]! + value * bRe[i]!
        aIm[i] = aIm[i]! + value * bIm[i]!
      }
    } else if (value === 0) {
      for (let i = 0; i < n; i++) setShort(p, i)
    } else {
      const g = 1 / value
      for (let i = 0; i < n; i++) {
        bRe[i] = bRe[i]! + g * aRe[i]!
        bIm[i] = bIm[i]! + g * aIm[i]!
      }
    }
    return
  }
  // zr + j zi is the part's impedance (series) or yr + j yi its admittance (shunt).
  const isSeries = placement === 'series'
  const k = 1 / (1 + invQ * invQ)
  const w = TWO_PI * value
  if ((kind === 'C' && isSeries && value === 0) || (kind === 'L' && !isSeries && value === 0)) {
    for (let i = 0; i < n; i++) (isSeries ? setOpen : setShort)(p, i)
    return
  }
  for (let i = 0; i < n; i++) {
    const x = w * frequenciesHz[i]! // ωL or ωC
    let re: number
    let im: number
    if (kind === 'L') {
      if (isSeries) { re = x * invQ; im = x } else { const u = k / x; re = u * invQ; im = -u }
    } else {
      if (isSeries) { const u = 1 / x; re = u * invQ; im = -u } else { const u = k * x; re = u * invQ; im = u }
    }
    const ar = aRe[i]!, ai = aIm[i]!, br = bRe[i]!, bi = bIm[i]!
    if (isSeries) {
      aRe[i] = ar + re * br - im * bi
      aIm[i] = ai + re * bi + im * br
    } else {
      bRe[i] = br + re * ar - im * ai
      bIm[i] = bi + re * ai + im * ar
    }
  }
}

function applyStub(
  p: PointBuffer, end: 'open' | 'short', placement: 'series' | 'shunt', zc: number, deg: number,
  fRef: number | undefined, frequenciesHz: ArrayLike<number>,
): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const radRef = deg * RAD_PER_DEG
  const isSeries = placement === 'series'
  for (let i = 0; i < n; i++) {
    const t = fRef === undefined ? radRef : (radRef * frequenciesHz[i]!) / fRef
    let c = Math.cos(t)
    let s = Math.sin(t)
    if (Math.abs(c) < NEAR_ZERO || Math.abs(s) < NEAR_ZERO) {
      exactCosSin(fRef === undefined ? deg : (deg * frequenciesHz[i]!) / fRef, c, s)
      c = trig[0]!; s = trig[1]!
    }
    // The part's impedance as num/den with num = j·zc·nu (nu real) and den real.
    const den = end === 'open' ? s : c
    const nu = end === 'open' ? -c : s
    const ar = aRe[i]!, ai = aIm[i]!, br = bRe[i]!, bi = bIm[i]!
    if (isSeries) {
      // (a, b) → (den·a + num·b, den·b)
      if (den === 0) { setOpen(p, i); continue }
      const zn = zc * nu
      aRe[i] = den * ar - zn * bi
      aIm[i] = den * ai + zn * br
      bRe[i] = den * br
      bIm[i] = den * bi
    } else {
      // Y = den/num = −j·den/(zc·nu): (a, b) → (num·a, den·a + num·b) divided by j·zc, i.e.
      // (nu·a, nu·b − j·(den/zc)·a).
      if (nu === 0) { setShort(p, i); continue }
      const yd = den / zc
      aRe[i] = nu * ar
      aIm[i] = nu * ai
      bRe[i] = nu * br + yd * ai
      bIm[i] = nu * bi - yd * ar
    }
  }
}

/** Keeps each point's homogeneous pair in a safe range; the ratio a/b is unchanged. */
export function rescale(p: PointBuffer): void {
  const { n, aRe, aIm, bRe, bIm } = p
  for (let i = 0; i < n; i++) {
    const m = Math.abs(aRe[i]!) + Math.abs(aIm[i]!) + Math.abs(bRe[i]!) + Math.abs(bIm[i]!)
    if (m > SCALE_HIGH || m < SCALE_LOW) {
      const s = 1 / m
      aRe[i] = aRe[i]! * s; aIm[i] = aIm[i]! * s; bRe[i] = bRe[i]! * s; bIm[i] = bIm[i]! * s
    }
  }
}
