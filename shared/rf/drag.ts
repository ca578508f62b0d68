/**
 * Drag constraints: where one element can move the point it acts on, and which value puts the
 * point nearest to a pointer.
 *
 * Every draggable two-terminal part moves the point along a straight ray in the normalised
 * impedance plane (series parts, w = z/Z0) or admittance plane (shunt parts, w = y·Z0):
 *   w(t) = w_prev + t·d,  t ≥ 0 for L, C and R (a part cannot change the sign of what it adds),
 * because its impedance (series) or admittance (shunt) is t times a fixed complex direction d:
 *   series L: d = 1/Q + j, t = ωL/Z0          series C: d = 1/Q − j, t = 1/(ωC·Z0)
 *   shunt L:  d = 1/(1/Q + j), t = Z0/(ωL)    shunt C:  d = 1/(1/Q − j), t = ωC·Z0
 *   series R: d = 1, t = R/Z0                 shunt R:  d = 1, t = Z0/R
 *   stubs: d = j, any real t (a stub reaches every reactance or susceptance)
 * (finite Q is the series ESR = |X|/Q, so a lossy part's Z or Y still scales with t). Lossless,
 * these rays are the constant-resistance and constant-conductance (or, for R, constant-reactance
 * and constant-susceptance) lines. The map Γ = (w − 1)/(w + 1) (series) or Γ = (1 − w)/(1 + w)
 * (shunt) is a Möbius map, so each ray's image is an arc of a circle in the Γ plane: the pole
 * w = −1 goes to infinity, hence the mirror image of −1 in the line goes to the circle's centre
 * (the symmetry principle of Möbius maps).
 *
 * A line of characteristic impedance Zc turns Γc = (z − Zc)/(z + Zc) by e^{−j2θ} (θ the electrical
 * length): a circle about Zc, which in the chart's Γ (against Z0) is the image of |Γc| = ρ under
 * Γ = (k + Γc)/(1 + kΓc), k = (Zc − Z0)/(Zc + Z0) — a circle symmetric about the real axis through
 * (k ± ρ)/(1 ± kρ).
 *
 * A transformer and a measured block have no drag (a ratio is typed, a block is data).
 */
import type { Complex, Element, LumpedElement, LineElement, StubElement } from './types'
import { OPEN, isInfinite } from './complex'
import { RfInputError } from './errors'
import { hasModel } from './models'
import { isMeasuredPart } from './fixture'
import { dragModelled, modelledLocus } from './drag-model'

// ---- loci in the Γ plane ------------------------------------------------------------------

/** A circle in the Γ plane. */
export interface GammaCircle {
  readonly cx: number
  readonly cy: number
  readonly radius: number
}

/** A straight line through (px, py) along the unit vector (dx, dy): the limit of a circle. */
export interface GammaLine {
  readonly px: number
  readonly py: number
  readonly dx: number
  readonly dy: number
}

/** The whole circle (or line) that a dragged element's point is confined to. */
export type GammaLocus = ({ readonly kind: 'circle' } & GammaCircle) | ({ readonly kind: 'line' } & GammaLine)

/**
 * The nearest point of a circle or line to (x, y). At the exact centre of a circle every point is
 * equally near; `fallback` (a point of the circle) is returned then.
 */
export function nearestOnLocus(locus: GammaLocus, x: number, y: number, fallback: Complex): Complex {
  if (locus.kind === 'line') {
    const t = (x - locus.px) * locus.dx + (y - locus.py) * locus.dy
    return { re: locus.px + t * locus.dx, im: locus.py + t * locus.dy }
  }
  const dx = x - locus.cx
  const dy = y - locus.cy
  const d = Math.hypot(dx, dy)
  if (d <= 1e-12 * Math.max(1, locus.radius)) return fallback
  return { re: locus.cx + (locus.radius * dx) / d, im: locus.cy + (locus.radius * dy) / d }
}

/** Distance of (x, y) from a circle or line (0 on it). */
export function distanceFromLocus(locus: GammaLocus, x: number, y: number): number {
  if (locus.kind === 'line') return Math.abs((x - locus.px) * locus.dy - (y - locus.py) * locus.dx)
  return Math.abs(Math.hypot(x - locus.cx, y - locus.cy) - locus.radius)
}

// ---- public API --------------------------------------------------------------------------

/** Which field of the element a drag changes: `value` (H, F, Ω) or `deg` (line and stub length). */
export type DragField = 'value' | 'deg'

export interface DragInput {
  readonly element: Element
  /** The impedance (Ω) just before the element (on its load side) at `frequencyHz`. */
  readonly zPrev: Complex
  /** The pointer position as Γ against `z0`. */
  readonly pointer: Complex
  /** The chart's reference impedance (Ω). */
  readonly z0: number
  /** The design frequency (Hz): the values are those that put the point there at this frequency. */
  readonly frequencyHz: number
}

export interface DragResult {
  /** The new value of `field`: H, F or Ω for L, C, R; electrical degrees at fRef for lines and stubs. */
  readonly value: number
  readonly field: DragField
  /** The impedance (Ω) just after the element with that value. */
  readonly z: Complex
  /** The same point as Γ against z0. */
  readonly gamma: Complex
  /**
   * `'sign'` when the pointer asks for the other sign of reactance, susceptance or resistance than
   * the part can give: the value is held at the nearer end of what it can reach.
   */
  readonly blocked?: 'sign'
}

/** True for the elements that have a handle on the chart (all but the transformer and a measured block). */
export function isDraggable(element: Element): boolean {
  return element.kind !== 'xfmr' && element.kind !== 'block' && !isMeasuredPart(element)
}

/** The field a drag of this element changes. */
export function dragFieldOf(element: Element): DragField {
  return element.kind === 'line' || element.kind === 'stub' ? 'deg' : 'value'
}

/**
 * Limits of the ray parameter t for sign-bound parts. The document wants values above zero and
 * finite, so "no effect" (t → 0) and "the open or short end" (t → ∞) are approached, not reached:
 * at t = 1e-6 the point is within about 1e-6 of z_prev in Γ, at 1e6 within 1e-6 of the end.
 */
export const DRAG_T_MIN = 1e-6
export const DRAG_T_MAX = 1e6

/**
 * The circle (or line) of the Γ plane that dragging `element` keeps the point on, given the
 * impedance before it. `null` when the point cannot move (a series part on an open, a shunt part
 * on a short, a line matched to its own Zc) or the element is a transformer.
 */
export function dragLocus(element: Element, zPrev: Complex, z0: number, frequencyHz: number): GammaLocus | null {
  if (element.kind === 'xfmr' || element.kind === 'block' || isMeasuredPart(element)) return null
  if (element.kind === 'line') return lineLocus(element, zPrev, z0)?.locus ?? null
  if (hasModel(element)) return canMove(element, zPrev) ? modelledLocus(element, zPrev, z0, frequencyHz) : null
  const ray = rayOf(element, zPrev, z0, frequencyHz)
  return ray ? rayLocus(ray) : null
}

/**
 * The element value that puts the point nearest to `pointer` while keeping it on the element's
 * locus (see the file comment): the pointer is projected onto the locus (nearest point in Γ), the
 * value is read from the projected point, and the point is recomputed from that value.
 * Throws for a transformer or a measured block (not draggable).
 */
export function dragElement(input: DragInput): DragResult {
  const { element, zPrev, z0, frequencyHz } = input
  if (element.kind === 'xfmr') throw new RfInputError('element', 'a transformer is not draggable: type its ratio')
  if (element.kind === 'block') throw new RfInputError('element', 'a measured block is not draggable')
  if (isMeasuredPart(element)) throw new RfInputError('element', 'a measured part is its file: it is not draggable')
  if (element.kind === 'line') return dragLine(element, input)
  if (hasModel(element) && canMove(element, zPrev)) return dragModelled(element, input)
  const ray = rayOf(element, zPrev, z0, frequencyHz)
  const field = dragFieldOf(element)
  const current = field === 'deg' ? (element as StubElement).deg : (element as LumpedElement).value
  if (!ray) return { value: current, field, z: zPrev, gamma: zToGammaNorm(zPrev, z0) }

  const locus = rayLocus(ray)
  const start = rayGamma(ray, 0)
  const q = nearestOnLocus(locus, input.pointer.re, input.pointer.im, start)
  let t = rayParameterAt(ray, q)
  let blocked: 'sign' | undefined
  if (ray.isSignBound) {
    if (t < 0) {
      blocked = 'sign'
      // The nearer end of the reachable arc: the start (no effect) or the open/short end.
      const end = rayGamma(ray, Infinity)
      t = dist(q, start) <= dist(q, end) ? DRAG_T_MIN : DRAG_T_MAX
    }
    t = Math.min(DRAG_T_MAX, Math.max(DRAG_T_MIN, t))
  } else {
    t = Math.min(DRAG_T_MAX, Math.max(-DRAG_T_MAX, t))
  }
  const value = element.kind === 'stub'
    ? unwrapLength(stubDegreesAt(element, t, z0, frequencyHz), current, lengthPeriod(element, frequencyHz))
    : lumpedValueOf(element as LumpedElement, t, z0, frequencyHz)
  const w = { re: ray.a.re + t * ray.d.re, im: ray.a.im + t * ray.d.im }
  const gamma = rayGammaOfW(ray, w)
  return { value, field, z: ray.isSeries ? scale(w, z0) : invertTimes(w, z0), gamma, ...(blocked ? { blocked } : {}) }
}

// ---- rays of two-terminal parts ------------------------------------------------------------

/** A series part on an open, or a shunt part on a short, cannot move the point (pads aside). */
function canMove(element: LumpedElement, zPrev: Complex): boolean {
  return element.placement === 'series' ? !isInfinite(zPrev) : !(zPrev.re === 0 && zPrev.im === 0)
}

interface Ray {
  readonly isSeries: boolean
  /** w_prev: normalised impedance (series) or admittance (shunt) before the part. */
  readonly a: Complex
  readonly d: Complex
  readonly isSignBound: boolean
}

function rayOf(element: Element, zPrev: Complex, z0: number, frequencyHz: number): Ray | null {
  if (element.kind === 'line' || element.kind === 'xfmr' || element.kind === 'block') return null
  const isSeries = element.placement === 'series'
  // A series part on an open, or a shunt part on a short, leaves the point where it is.
  if (isSeries && isInfinite(zPrev)) return null
  if (!isSeries && zPrev.re === 0 && zPrev.im === 0) return null
  const a = isSeries ? scale(zPrev, 1 / z0) : invertTimes(zPrev, z0)
  if (element.kind === 'stub') return { isSeries, a, d: { re: 0, im: 1 }, isSignBound: false }
  return { isSeries, a, d: lumpedDirection(element, isSeries), isSignBound: true }
}

function lumpedDirection(element: LumpedElement, isSeries: boolean): Complex {
  if (element.kind === 'R') return { re: 1, im: 0 }
  const invQ = element.q === undefined ? 0 : 1 / element.q
  const sign = element.kind === 'L' ? 1 : -1
  const zDir = { re: invQ, im: sign } // the part's impedance per unit |X|
  if (isSeries) return zDir
  const m = invQ * invQ + 1
  return { re: invQ / m, im: -sign / m } // 1/zDir: its admittance per unit 1/|X|
}

/** The part's value for ray parameter t > 0 (see the table in the file comment). */
function lumpedValueOf(element: LumpedElement, t: number, z0: number, frequencyHz: number): number {
  const w = 2 * Math.PI * frequencyHz
  const isSeries = element.placement === 'series'
  switch (element.kind) {
    case 'L': return isSeries ? (t * z0) / w : z0 / (w * t)
    case 'C': return isSeries ? 1 / (w * t * z0) : t / (w * z0)
    case 'R': return isSeries ? t * z0 : z0 / t
  }
}

/**
 * The stub's electrical length (degrees at fRef, in [0, 180·fRef/f)) that adds normalised
 * reactance (series) or susceptance (shunt) t. Zc the stub's own impedance:
 * series open −Zc cot θ = X, series short Zc tan θ = X, shunt open Yc tan θ = B, shunt short
 * −Yc cot θ = B.
 */
function stubDegreesAt(element: StubElement, t: number, z0: number, frequencyHz: number): number {
  const isSeries = element.placement === 'series'
  // u is X/Zc (series) or B/Yc = B·Zc (shunt)
  const u = isSeries ? (t * z0) / element.z0 : (t / z0) * element.z0
  const cotForm = (isSeries && element.end === 'open') || (!isSeries && element.end === 'short')
  const theta = cotForm ? Math.atan2(1, -u) : mod(Math.atan(u), Math.PI)
  return radToDeg(theta) * refRatio(element, frequencyHz)
}

function rayGammaOfW(ray: Ray, w: Complex): Complex {
  const g = mobius(w)
  return ray.isSeries ? g : { re: -g.re, im: -g.im }
}

/** Γ at ray parameter t (t = ∞: the open end for series parts, the short for shunt parts). */
function rayGamma(ray: Ray, t: number): Complex {
  if (!Number.isFinite(t)) return { re: ray.isSeries ? 1 : -1, im: 0 }
  return rayGammaOfW(ray, { re: ray.a.re + t * ray.d.re, im: ray.a.im + t * ray.d.im })
}

/** t of the point of the ray's line whose Γ is q (q on the locus); ±∞ maps to DRAG_T_MAX's sign of +. */
function rayParameterAt(ray: Ray, q: Complex): number {
  const g = ray.isSeries ? q : { re: -q.re, im: -q.im }
  const w = inverseMobius(g)
  if (w === null) return Infinity
  const dd = ray.d.re * ray.d.re + ray.d.im * ray.d.im
  return ((w.re - ray.a.re) * ray.d.re + (w.im - ray.a.im) * ray.d.im) / dd
}

function rayLocus(ray: Ray): GammaLocus {
  const { a, d } = ray
  const dd = d.re * d.re + d.im * d.im
  // Foot of the perpendicular from the pole w = −1 to the line a + t·d.
  const s = ((-1 - a.re) * d.re + (0 - a.im) * d.im) / dd
  const foot = { re: a.re + s * d.re, im: a.im + s * d.im }
  const gap = Math.hypot(foot.re + 1, foot.im)
  const sign = ray.isSeries ? 1 : -1
  const ga = mobius(a)
  if (gap < 1e-12) {
    // The line passes through the pole: its image is the straight line through Γ(a) and Γ(∞) = 1.
    const dx = 1 - ga.re
    const dy = -ga.im
    const n = Math.hypot(dx, dy) || 1
    return { kind: 'line', px: sign * ga.re, py: sign * ga.im, dx: sign * dx / n, dy: sign * dy / n }
  }
  const mirror = { re: 2 * foot.re + 1, im: 2 * foot.im }
  const c = mobius(mirror)
  // The image passes through Γ(∞) = 1 as well as Γ(a); 1 is never near the centre, so it gives a
  // well-conditioned radius even when a is far out.
  const radius = Math.hypot(1 - c.re, c.im)
  return { kind: 'circle', cx: sign * c.re, cy: sign * c.im, radius }
}

// ---- lines -------------------------------------------------------------------------------

function lineLocus(element: LineElement, zPrev: Complex, z0: number): { locus: GammaLocus; k: number; gcPrev: Complex } | null {
  const zc = element.z0
  const k = (zc - z0) / (zc + z0)
  const gcPrev = isInfinite(zPrev) ? { re: 1, im: 0 } : mobius(scale(zPrev, 1 / zc))
  const rho = Math.hypot(gcPrev.re, gcPrev.im)
  if (rho < 1e-12) return null
  const u1 = (k + rho) / (1 + k * rho)
  const u2 = (k - rho) / (1 - k * rho)
  return { locus: { kind: 'circle', cx: (u1 + u2) / 2, cy: 0, radius: Math.abs(u1 - u2) / 2 }, k, gcPrev }
}

function dragLine(element: LineElement, input: DragInput): DragResult {
  const { zPrev, z0, frequencyHz, pointer } = input
  const geometry = lineLocus(element, zPrev, z0)
  if (!geometry) return { value: element.deg, field: 'deg', z: zPrev, gamma: zToGammaNorm(zPrev, z0) }
  const { locus, k, gcPrev } = geometry
  const startGamma = fromLineGamma(gcPrev, k)
  const q = nearestOnLocus(locus, pointer.re, pointer.im, startGamma)
  // Back to Γc about Zc: Γc = (Γ − k)/(1 − kΓ).
  const gc = divide({ re: q.re - k, im: q.im }, { re: 1 - k * q.re, im: -k * q.im })
  // Toward the generator the point turns clockwise by 2θ.
  const theta = mod((Math.atan2(gcPrev.im, gcPrev.re) - Math.atan2(gc.im, gc.re)) / 2, Math.PI)
  const deg = unwrapLength(radToDeg(theta) * refRatio(element, frequencyHz), element.deg, lengthPeriod(element, frequencyHz))
  const turn = -2 * degToRad(deg / refRatio(element, frequencyHz))
  const c = Math.cos(turn)
  const s = Math.sin(turn)
  const gcNew = { re: gcPrev.re * c - gcPrev.im * s, im: gcPrev.re * s + gcPrev.im * c }
  const gamma = fromLineGamma(gcNew, k)
  const zNorm = inverseMobius(gcNew)
  return { value: deg, field: 'deg', z: zNorm === null ? OPEN : scale(zNorm, element.z0), gamma }
}

/** Γ against Z0 of a point given as Γc against the line's Zc: (k + Γc)/(1 + kΓc). */
function fromLineGamma(gc: Complex, k: number): Complex {
  return divide({ re: k + gc.re, im: gc.im }, { re: 1 + k * gc.re, im: k * gc.im })
}

// ---- lengths -----------------------------------------------------------------------------

/** deg at fRef per degree at the design frequency. */
function refRatio(element: { fRef?: number }, frequencyHz: number): number {
  return element.fRef === undefined ? 1 : element.fRef / frequencyHz
}

/** Lines and stubs repeat every half wavelength: 180° at f, in degrees at fRef. */
function lengthPeriod(element: { fRef?: number }, frequencyHz: number): number {
  return 180 * refRatio(element, frequencyHz)
}

/**
 * Of the lengths base + n·period (n ≥ 0) the one nearest the current length, so that dragging a
 * line past half a wavelength keeps growing it rather than jumping back to zero.
 */
function unwrapLength(base: number, current: number, period: number): number {
  const n = Math.max(0, Math.round((current - base) / period))
  return base + n * period
}

// ---- small plain-float helpers (hot path: no allocation beyond the result objects) ---------

function mobius(w: Complex): Complex {
  return divide({ re: w.re - 1, im: w.im }, { re: w.re + 1, im: w.im })
}

/** w = (1 + Γ)/(1 − Γ); null at Γ = 1 (infinity). */
function inverseMobius(g: Complex): Complex | null {
  const dr = 1 - g.re
  const di = -g.im
  if (Math.abs(dr) + Math.abs(di) < 1e-300) return null
  return divide({ re: 1 + g.re, im: g.im }, { re: dr, im: di })
}

function zToGammaNorm(z: Complex, z0: number): Complex {
  if (isInfinite(z)) return { re: 1, im: 0 }
  return mobius(scale(z, 1 / z0))
}

function divide(a: Complex, b: Complex): Complex {
  const m = b.re * b.re + b.im * b.im
  return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m }
}

function scale(z: Complex, k: number): Complex {
  return { re: z.re * k, im: z.im * k }
}

/** k / z, for admittance ↔ impedance with a scale (0 gives the open). */
function invertTimes(z: Complex, k: number): Complex {
  const m = z.re * z.re + z.im * z.im
  if (m === 0) return OPEN
  if (!Number.isFinite(m)) return { re: 0, im: 0 }
  return { re: (k * z.re) / m, im: (-k * z.im) / m }
}

function dist(a: Complex, b: Complex): number {
  return Math.hypot(a.re - b.re, a.im - b.im)
}

function mod(x: number, m: number): number {
  const r = x % m
  return r < 0 ? r + m : r
}

function radToDeg(x: number): number {
  return (x * 180) / Math.PI
}

function degToRad(x: number): number {
  return (x * Math.PI) / 180
}
