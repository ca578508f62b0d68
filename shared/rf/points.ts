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
 * shunt impedances and of a lossless line (standard two-port tables, common practice; recalled from
 * memory and checked against the reference cases).
 *
 * Hot loop rules: one loop per element kind with the per-element constants hoisted, no object per
 * complex number.
 */
import type { Complex, Element } from './types'
import { divideParts, isInfinite } from './complex'
import { electricalCosSin } from './angles'
import { hasModel, inverseQOf, type ModelledPart } from './models'

/** How `applyElementToPoints` may work: see `isUniformGrid` (angles.ts) and `rescale`. */
export type StepOptions = {
  /** The frequencies are evenly spaced (allows the rotation recurrence for line angles). */
  readonly uniformGrid?: boolean
  /** Rescale the homogeneous pairs afterwards (default true; a sweep does it every few elements). */
  readonly rescale?: boolean
}

// Scratch arrays for line and stub angles, reused (the kernel is synchronous).
let cosScratch = new Float64Array(0)
let sinScratch = new Float64Array(0)

/** The frequencies as a Float64Array (copied only when given as another array type). */
export function asFloat64(values: ArrayLike<number>): Float64Array {
  return values instanceof Float64Array ? values : Float64Array.from(values)
}

function anglesFor(deg: number, fRef: number | undefined, frequenciesHz: Float64Array, uniform: boolean) {
  const n = frequenciesHz.length
  if (cosScratch.length < n) {
    cosScratch = new Float64Array(n)
    sinScratch = new Float64Array(n)
  }
  electricalCosSin(deg, fRef, frequenciesHz, uniform, cosScratch, sinScratch)
  return { cos: cosScratch, sin: sinScratch }
}
import { RfInputError } from './errors'

/** n points z[i] = (aRe[i] + j aIm[i]) / (bRe[i] + j bIm[i]). */
export type PointBuffer = {
  readonly n: number
  readonly aRe: Float64Array
  readonly aIm: Float64Array
  readonly bRe: Float64Array
  readonly bIm: Float64Array
}

// Homogeneous coordinates may drift in scale; bring them back well before over- or underflow.
const SCALE_HIGH = 1e100
const SCALE_LOW = 1e-100

/** A buffer of n points, all shorts until set (one allocation for the four arrays). */
export function createPoints(n: number): PointBuffer {
  const all = new Float64Array(4 * n)
  const p = { n, aRe: all.subarray(0, n), aIm: all.subarray(n, 2 * n), bRe: all.subarray(2 * n, 3 * n), bIm: all.subarray(3 * n) }
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
export function applyElementToPoints(
  p: PointBuffer, element: Element, frequenciesHz: ArrayLike<number>, options: StepOptions = {},
): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const uniform = options.uniformGrid === true
  // Every loop below reads frequencies from a Float64Array only, so the JIT keeps them monomorphic.
  const frequencies = asFloat64(frequenciesHz)
  switch (element.kind) {
    case 'L':
    case 'C':
    case 'R':
      // A part with a model takes its own loop; ideal parts keep the one below, unchanged.
      if (element.model !== undefined && hasModel(element)) applyModelled(p, element, frequencies)
      else applyLumped(p, element.kind, element.placement, element.value, element.q, frequencies)
      break
    case 'line': {
      const zc = element.z0
      const { cos, sin } = anglesFor(element.deg, element.fRef, frequencies, uniform)
      for (let i = 0; i < n; i++) {
        const c = cos[i]!
        const s = sin[i]!
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
      applyStub(p, element.end, element.placement, element.z0, anglesFor(element.deg, element.fRef, frequencies, uniform))
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
  // Callers that chain many elements may rescale every few steps instead (rescale: false).
  if (options.rescale !== false) rescale(p)
}

function applyLumped(
  p: PointBuffer, kind: 'L' | 'C' | 'R', placement: 'series' | 'shunt', value: number,
  q: number | undefined, frequenciesHz: Float64Array,
): void {
  const isSeries = placement === 'series'
  if ((kind === 'C' && isSeries && value === 0) || (kind !== 'C' && !isSeries && value === 0)) {
    for (let i = 0; i < p.n; i++) (isSeries ? setOpen : setShort)(p, i)
    return
  }
  if (kind === 'R') {
    addConstant(p, isSeries, isSeries ? value : 1 / value)
    return
  }
  const c = reactiveCoefficients(kind, placement, value, q)
  addScaled(p, isSeries, c.cr, c.ci, frequenciesHz, c.isInverse)
}

/**
 * The impedance (series) or admittance (shunt) of an L or C part as (cr + j ci)·g(f), with
 * g(f) = f or, when `isInverse`, 1/f (ω = 2πf):
 * series L: ωL(1/Q + j); shunt L: (1/Q − j)/(ωL(1 + 1/Q²)); series C: (1/Q − j)/(ωC);
 * shunt C: ωC(1/Q + j)/(1 + 1/Q²). Finite Q is the series ESR = |X|/Q; `q` absent: lossless.
 * Exported so that code scanning many part values (the match search) uses these same numbers.
 */
export function reactiveCoefficients(
  kind: 'L' | 'C', placement: 'series' | 'shunt', value: number, q: number | undefined,
): { cr: number; ci: number; isInverse: boolean } {
  const invQ = q !== undefined ? 1 / q : 0
  const w = 2 * Math.PI * value
  const k = 1 / (1 + invQ * invQ)
  if (kind === 'L') {
    return placement === 'series' ? { cr: w * invQ, ci: w, isInverse: false } : { cr: (k * invQ) / w, ci: -k / w, isInverse: true }
  }
  return placement === 'series' ? { cr: invQ / w, ci: -1 / w, isInverse: true } : { cr: k * invQ * w, ci: k * w, isInverse: false }
}

/**
 * A modelled L or C (models.ts), its impedance as a ratio Z = num/den so resonances stay finite:
 * inductor num = ωL(1/Q + j), den = 1 − r² + j·r²/Q (r = f/srf: L with its ESR, Cp across both);
 * capacitor num = 1/Q + j(ω²·C·ESL − 1), den = ωC (C, ESL and ESR in series). Pads B = ωCpad.
 * Chain maps on (a, b): series: pad (a, b + jB·a), part (den·a + num·b, den·b), pad again — a pi
 * of pad, part, pad; shunt: Y = den/num + jB, (a, b) → (num·a, (den + jB·num)·a + num·b).
 * The shunt map is scaled by num (D = num), the series one without pads by den (D = den): abcd.ts
 * divides by D, and composes a series part's pads itself.
 */
function applyModelled(p: PointBuffer, part: ModelledPart, frequenciesHz: Float64Array): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const invQ = inverseQOf(part, frequenciesHz)
  const value = part.value
  const twoPi = 2 * Math.PI
  const padC = part.model.padC ?? 0
  // One loop per kind and placement, constants hoisted (the kernel's rule).
  if (part.kind === 'L') {
    const invSrf2 = part.model.srf !== undefined ? 1 / (part.model.srf * part.model.srf) : 0
    if (part.placement === 'series') {
    for (let i = 0; i < n; i++) {
      const f = frequenciesHz[i]!
      const w = twoPi * f
      const q = invQ[i]!
      const wl = w * value
      const r2 = f * f * invSrf2
      const nr = wl * q, ni = wl, dr = 1 - r2, di = r2 * q
      const pb = w * padC
      const ar = aRe[i]!, ai = aIm[i]!
      const br = bRe[i]! - pb * ai, bi = bIm[i]! + pb * ar
      const ar2 = dr * ar - di * ai + nr * br - ni * bi
      const ai2 = dr * ai + di * ar + nr * bi + ni * br
      aRe[i] = ar2; aIm[i] = ai2
      bRe[i] = dr * br - di * bi - pb * ai2
      bIm[i] = dr * bi + di * br + pb * ar2
    }
    } else {
    for (let i = 0; i < n; i++) {
      const f = frequenciesHz[i]!
      const w = twoPi * f
      const q = invQ[i]!
      const wl = w * value
      const r2 = f * f * invSrf2
      const nr = wl * q, ni = wl, dr = 1 - r2, di = r2 * q
      const pb = w * padC
      const ar = aRe[i]!, ai = aIm[i]!, br = bRe[i]!, bi = bIm[i]!
      const yr = dr - pb * ni, yi = di + pb * nr // den + jB·num
      aRe[i] = nr * ar - ni * ai; aIm[i] = nr * ai + ni * ar
      bRe[i] = yr * ar - yi * ai + nr * br - ni * bi
      bIm[i] = yr * ai + yi * ar + nr * bi + ni * br
    }
    }
  } else {
    const ce = value * (part.model.esl ?? 0) // C·ESL
    if (part.placement === 'series') {
    for (let i = 0; i < n; i++) {
      const f = frequenciesHz[i]!
      const w = twoPi * f
      const q = invQ[i]!
      const nr = q, ni = w * w * ce - 1, dr = w * value, di = 0
      const pb = w * padC
      const ar = aRe[i]!, ai = aIm[i]!
      const br = bRe[i]! - pb * ai, bi = bIm[i]! + pb * ar
      const ar2 = dr * ar - di * ai + nr * br - ni * bi
      const ai2 = dr * ai + di * ar + nr * bi + ni * br
      aRe[i] = ar2; aIm[i] = ai2
      bRe[i] = dr * br - di * bi - pb * ai2
      bIm[i] = dr * bi + di * br + pb * ar2
    }
    } else {
    for (let i = 0; i < n; i++) {
      const f = frequenciesHz[i]!
      const w = twoPi * f
      const q = invQ[i]!
      const nr = q, ni = w * w * ce - 1, dr = w * value, di = 0
      const pb = w * padC
      const ar = aRe[i]!, ai = aIm[i]!, br = bRe[i]!, bi = bIm[i]!
      const yr = dr - pb * ni, yi = di + pb * nr // den + jB·num
      aRe[i] = nr * ar - ni * ai; aIm[i] = nr * ai + ni * ar
      bRe[i] = yr * ar - yi * ai + nr * br - ni * bi
      bIm[i] = yr * ai + yi * ar + nr * bi + ni * br
    }
    }
  }
}

/** series: a += r·b; shunt: b += r·a (a real, frequency-independent part). */
function addConstant(p: PointBuffer, isSeries: boolean, r: number): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const [toRe, toIm, fromRe, fromIm] = isSeries ? [aRe, aIm, bRe, bIm] : [bRe, bIm, aRe, aIm]
  for (let i = 0; i < n; i++) {
    toRe[i] = toRe[i]! + r * fromRe[i]!
    toIm[i] = toIm[i]! + r * fromIm[i]!
  }
}

/**
 * series: a += (cr + j ci)·g·b; shunt: b += (cr + j ci)·g·a, with g = f (inverse false) or 1/f.
 * One loop shape for all four reactive parts, so the JIT keeps it tight.
 */
function addScaled(
  p: PointBuffer, isSeries: boolean, cr: number, ci: number, frequenciesHz: Float64Array, inverse: boolean,
): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const [toRe, toIm, fromRe, fromIm] = isSeries ? [aRe, aIm, bRe, bIm] : [bRe, bIm, aRe, aIm]
  for (let i = 0; i < n; i++) {
    const f = frequenciesHz[i]!
    const g = inverse ? 1 / f : f
    const re = cr * g
    const im = ci * g
    const xr = fromRe[i]!
    const xi = fromIm[i]!
    toRe[i] = toRe[i]! + re * xr - im * xi
    toIm[i] = toIm[i]! + re * xi + im * xr
  }
}

function applyStub(
  p: PointBuffer, end: 'open' | 'short', placement: 'series' | 'shunt', zc: number,
  angles: { cos: Float64Array; sin: Float64Array },
): void {
  const { n, aRe, aIm, bRe, bIm } = p
  const isSeries = placement === 'series'
  for (let i = 0; i < n; i++) {
    const c = angles.cos[i]!
    const s = angles.sin[i]!
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
