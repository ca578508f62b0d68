/**
 * Circles of the reflection-coefficient plane, all with normalised values (r = R/Z0, x = X/Z0,
 * g = G·Z0, b = B·Z0). With Γ = (z − 1)/(z + 1) and z = r + jx:
 * - constant r: centre (r/(1+r), 0), radius 1/(1+r) — every one touches Γ = 1 (the open);
 * - constant x: centre (1, 1/x), radius 1/|x|;
 * - constant g: centre (−g/(1+g), 0), radius 1/(1+g) — every one touches Γ = −1 (the short);
 * - constant b: centre (−1, −1/b), radius 1/|b|
 *   (admittance circles are impedance circles turned half a turn: Γ(y) = −Γ(z = y));
 * - constant Q = |x|/r: from r = (1 − |Γ|²)/|1 − Γ|² and x = 2v/|1 − Γ|² one gets
 *   u² + v² ± 2v/Q = 1, i.e. centre (0, ∓1/Q), radius √(1 + 1/Q²); the inductive (upper) arc has
 *   its centre below the axis;
 * - VSWR s: the circle |Γ| = (s − 1)/(s + 1) about the centre.
 */
import type { GammaCircle, GammaLine } from '../rf/drag'

export type { GammaCircle, GammaLine, GammaLocus } from '../rf/drag'
export { distanceFromLocus, nearestOnLocus } from '../rf/drag'

/** The real axis: constant x = 0 and constant b = 0. */
export const REAL_AXIS: GammaLine = { px: 0, py: 0, dx: 1, dy: 0 }

/** The unit circle |Γ| = 1: r = 0 and g = 0, the edge of the passive chart. */
export const UNIT_CIRCLE: GammaCircle = { cx: 0, cy: 0, radius: 1 }

export function resistanceCircle(r: number): GammaCircle {
  return { cx: r / (1 + r), cy: 0, radius: 1 / (1 + r) }
}

export function conductanceCircle(g: number): GammaCircle {
  return { cx: -g / (1 + g), cy: 0, radius: 1 / (1 + g) }
}

/** Constant normalised reactance x ≠ 0 (x = 0 is REAL_AXIS). */
export function reactanceCircle(x: number): GammaCircle {
  return { cx: 1, cy: 1 / x, radius: 1 / Math.abs(x) }
}

/** Constant normalised susceptance b ≠ 0 (b = 0 is REAL_AXIS). */
export function susceptanceCircle(b: number): GammaCircle {
  return { cx: -1, cy: -1 / b, radius: 1 / Math.abs(b) }
}

/**
 * The circle of constant node Q for the inductive (`sign` = 1) or capacitive (`sign` = −1) half
 * of the chart. Only its arc inside the unit circle, from Γ = −1 to Γ = 1, is the locus.
 */
export function constantQCircle(q: number, sign: 1 | -1): GammaCircle {
  return { cx: 0, cy: -sign / q, radius: Math.sqrt(1 + 1 / (q * q)) }
}

/** The VSWR ring through a point of reflection magnitude |Γ|: centred on Γ = 0. */
export function vswrRing(gammaMagnitude: number): GammaCircle {
  return { cx: 0, cy: 0, radius: gammaMagnitude }
}

/**
 * The ring of constant mismatch through the point `end` (Γ against Z0), about the goal `goal`
 * (Γ against Z0 of the conjugate source impedance; Γ = 0 for a Z0 source, where the ring is the
 * plain VSWR circle |Γ| = const). With a = goal, the power-wave reflection against the source is
 * Γs = e^{jφ}(Γ − a)/(1 − a*Γ), a disk automorphism, so |Γs| = ρ is the circle
 *   centre a(1 − ρ²)/(1 − ρ²|a|²),  radius ρ(1 − |a|²)/(1 − ρ²|a|²).
 * Returns null when the ring is undefined (|Γs| ≥ 1: the end point on or outside the rim).
 */
export function mismatchRing(goal: { re: number; im: number }, end: { re: number; im: number }): (GammaCircle & { rho: number }) | null {
  const a2 = goal.re * goal.re + goal.im * goal.im
  // (Γ − a)/(1 − a*Γ)
  const nr = end.re - goal.re
  const ni = end.im - goal.im
  const dr = 1 - (goal.re * end.re + goal.im * end.im)
  const di = -(goal.re * end.im - goal.im * end.re)
  const rho = Math.hypot(nr, ni) / Math.hypot(dr, di)
  if (!(rho < 1)) return null
  const k = 1 - rho * rho * a2
  return { cx: (goal.re * (1 - rho * rho)) / k, cy: (goal.im * (1 - rho * rho)) / k, radius: (rho * (1 - a2)) / k, rho }
}
