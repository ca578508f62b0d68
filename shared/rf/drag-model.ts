/**
 * Dragging a modelled part (models.ts): the value dragged is still the part's nominal L or C, and
 * the point follows what the real part does with it.
 *
 * Why it is still a circle: with the model fixed (Q(f), srf, ESL and pads do not depend on the
 * value), the part's impedance is linear in p = L (inductor: Z = L·g(f), the self-resonance enters
 * as r = f/srf only) or affine in p = 1/C (capacitor: Z = p·(1/Q − j)/ω + jωESL). Every other step
 * (the pads, series or shunt placement, Γ) is a Möbius map, so Γ is a Möbius function of the real
 * parameter p and its locus is a circle through any three of its points. The value for a pointer
 * is read back through the cross-ratio, which a Möbius map keeps:
 *   (Γ − Γ1)(Γ2 − Γ3) / ((Γ − Γ3)(Γ2 − Γ1)) = (p − p1)(p2 − p3) / ((p − p3)(p2 − p1)).
 */
import type { Complex } from './types'
import { applyElement } from './elements'
import { gammaOf } from './gamma'
import type { ModelledPart } from './models'
import { DRAG_T_MAX, DRAG_T_MIN, nearestOnLocus, type DragInput, type DragResult, type GammaLocus } from './drag'

// Parameters of the three points that fix the Möbius map, in units of the part's t = 1 value.
const P1 = 0.3, P2 = 1, P3 = 3

/** The value at which the part's reactance is Z0 (t = 1 of the ideal drag): L = Z0/ω, C = 1/(ωZ0). */
function unitValue(part: ModelledPart, z0: number, frequencyHz: number): number {
  const w = 2 * Math.PI * frequencyHz
  return part.kind === 'L' ? z0 / w : 1 / (w * z0)
}

/** The nominal value for parameter p (L grows with p, C shrinks with it). */
function valueOf(part: ModelledPart, p: number, unit: number): number {
  return part.kind === 'L' ? p * unit : unit / p
}

function pointAt(part: ModelledPart, p: number, unit: number, zPrev: Complex, z0: number, frequencyHz: number) {
  const z = applyElement(zPrev, { ...part, value: valueOf(part, p, unit) }, frequencyHz)
  return { z, gamma: gammaOf(z, z0) }
}

const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im })
const mul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re })
function div(a: Complex, b: Complex): Complex {
  const m = b.re * b.re + b.im * b.im
  return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m }
}

/** The circle (or line) through three Γ points. */
function circleThrough(a: Complex, b: Complex, c: Complex): GammaLocus {
  const d = 2 * (a.re * (b.im - c.im) + b.re * (c.im - a.im) + c.re * (a.im - b.im))
  const scale = Math.max(Math.hypot(b.re - a.re, b.im - a.im), Math.hypot(c.re - a.re, c.im - a.im))
  if (Math.abs(d) < 1e-12 * scale * scale) {
    const dx = c.re - a.re, dy = c.im - a.im, n = Math.hypot(dx, dy) || 1
    return { kind: 'line', px: a.re, py: a.im, dx: dx / n, dy: dy / n }
  }
  const a2 = a.re * a.re + a.im * a.im, b2 = b.re * b.re + b.im * b.im, c2 = c.re * c.re + c.im * c.im
  const cx = (a2 * (b.im - c.im) + b2 * (c.im - a.im) + c2 * (a.im - b.im)) / d
  const cy = (a2 * (c.re - b.re) + b2 * (a.re - c.re) + c2 * (b.re - a.re)) / d
  return { kind: 'circle', cx, cy, radius: Math.hypot(a.re - cx, a.im - cy) }
}

function threePoints(part: ModelledPart, zPrev: Complex, z0: number, frequencyHz: number) {
  const unit = unitValue(part, z0, frequencyHz)
  const at = (p: number) => pointAt(part, p, unit, zPrev, z0, frequencyHz).gamma
  return { unit, g1: at(P1), g2: at(P2), g3: at(P3) }
}

/** The circle a modelled part's point moves on as its nominal value changes. */
export function modelledLocus(part: ModelledPart, zPrev: Complex, z0: number, frequencyHz: number): GammaLocus {
  const { g1, g2, g3 } = threePoints(part, zPrev, z0, frequencyHz)
  return circleThrough(g1, g2, g3)
}

/** `dragElement` for a modelled L or C: see the file comment. */
export function dragModelled(part: ModelledPart, input: DragInput): DragResult {
  const { zPrev, z0, frequencyHz, pointer } = input
  const { unit, g1, g2, g3 } = threePoints(part, zPrev, z0, frequencyHz)
  const locus = circleThrough(g1, g2, g3)
  const q = nearestOnLocus(locus, pointer.re, pointer.im, g2)
  // w = cross-ratio of q with the three points; p solves w·(p − P3) = K·(p − P1), K = (P2 − P3)/(P2 − P1).
  const w = div(mul(sub(q, g1), sub(g2, g3)), mul(sub(q, g3), sub(g2, g1)))
  const k = (P2 - P3) / (P2 - P1)
  const p = div({ re: w.re * P3 - k * P1, im: w.im * P3 }, { re: w.re - k, im: w.im }).re
  let t = p
  let blocked: 'sign' | undefined
  if (!(t > 0)) {
    blocked = 'sign'
    const low = pointAt(part, DRAG_T_MIN, unit, zPrev, z0, frequencyHz).gamma
    const high = pointAt(part, DRAG_T_MAX, unit, zPrev, z0, frequencyHz).gamma
    t = Math.hypot(q.re - low.re, q.im - low.im) <= Math.hypot(q.re - high.re, q.im - high.im) ? DRAG_T_MIN : DRAG_T_MAX
  }
  t = Math.min(DRAG_T_MAX, Math.max(DRAG_T_MIN, t))
  const { z, gamma } = pointAt(part, t, unit, zPrev, z0, frequencyHz)
  return { value: valueOf(part, t, unit), field: 'value', z, gamma, ...(blocked ? { blocked } : {}) }
}
