/**
 * The trade's circles on the source plane (ΓS) and the load plane (ΓL) of a two-port: stability
 * circles and constant-gain circles (available gain on the source plane, operating gain on the
 * load plane). Noise circles live in noise.ts.
 *
 * Each locus is α|Γ|² − 2·Re(β·Γ) + γ = 0, a circle of centre conj(β)/α, or a straight line when α = 0
 * (the circle through the point at infinity). Closed forms: Gonzalez, Microwave Transistor
 * Amplifiers, 2nd ed., §3.3 (stability circles), §3.7–3.8 (operating- and available-gain circles),
 * recalled from memory and checked point by point from each definition in the tests.
 */
import ComplexJs from 'complex.js'
import type { Complex } from './types'
import { OPEN, fromComplexJs } from './complex'
import { RfInputError } from './errors'
import { sParts, type SMatrix2, type SParts } from './amplifier'

/**
 * A circle on a Γ plane, or (when `line` is present) the straight line it degenerates to:
 * then `center` is `OPEN`, `radius` is Infinity and the line is every Γ with Re(Γ·normal*) = offset
 * (`normal` a unit vector).
 */
export type GammaCircle = {
  readonly center: Complex
  readonly radius: number
  readonly line?: { readonly normal: Complex; readonly offset: number }
}

/** A stability circle and which side of it is stable. */
export type StabilityCircle = GammaCircle & {
  /**
   * True when the points inside the circle are the stable ones. For a line (no inside) it is
   * false and the stable side is the half-plane Re(Γ·normal*) < offset.
   */
  readonly stableInside: boolean
}

// |α| below this share of the other coefficients: the circle is a line (|S11| = |Δ|, or 1 + g·(…) = 0).
const LINE_TOLERANCE = 1e-12
// A radicand this far below zero is rounding at the maximum gain (a point circle), not "no circle".
const RADICAND_SLACK = 1e-12

/**
 * The locus α|Γ|² − 2Re(βΓ) + γ = 0. `radicand` is (|β|² − αγ) written the way the closed form
 * writes it (better rounding than the subtraction); the radius is √radicand / |α|. Null: no point.
 */
function quadraticLocus(alpha: number, beta: ComplexJs, gamma: number, radicand: number): GammaCircle | null {
  const scale = Math.max(1, beta.abs(), Math.abs(gamma))
  if (Math.abs(alpha) <= LINE_TOLERANCE * scale) {
    const b = beta.abs()
    if (b === 0) return null
    return {
      center: OPEN, radius: Infinity,
      line: { normal: fromComplexJs(beta.conjugate().div(b), 'normal'), offset: gamma / (2 * b) },
    }
  }
  if (radicand < -RADICAND_SLACK) return null
  return { center: fromComplexJs(beta.conjugate().div(alpha), 'center'), radius: Math.sqrt(Math.max(0, radicand)) / Math.abs(alpha) }
}

const abs2 = (x: ComplexJs) => x.re * x.re + x.im * x.im

/** The source-plane (ports 1) or load-plane (port 2) view of the device: the port's own and the far port's S. */
function planeParts(p: SParts, plane: 'source' | 'load') {
  return plane === 'source'
    ? { near: p.s11, far: p.s22 }
    : { near: p.s22, far: p.s11 }
}

/**
 * The stability circle of the source plane (where |Γout| = 1) or of the load plane (where |Γin| = 1).
 * Source: centre (S11 − Δ·S22*)* / (|S11|² − |Δ|²), radius |S12·S21| / ||S11|² − |Δ|²|; the load
 * plane swaps S11 and S22. From |1 − S11ΓS|² − |S22 − ΔΓS|² > 0 ⇔ |Γout| < 1, the stable points lie
 * inside exactly when |S11|² < |Δ|² (source; |S22|² < |Δ|² on the load plane). |S11| = |Δ| gives a line.
 */
export function stabilityCircle(s: SMatrix2, plane: 'source' | 'load'): StabilityCircle {
  if (plane !== 'source' && plane !== 'load') throw new RfInputError('plane', `must be 'source' or 'load', got ${String(plane)}`)
  const p = sParts(s)
  const { near, far } = planeParts(p, plane)
  const alpha = abs2(near) - abs2(p.delta)
  const beta = near.sub(p.delta.mul(far.conjugate()))
  const loop = p.s12.mul(p.s21).abs()
  const circle = quadraticLocus(alpha, beta, 1 - abs2(far), loop * loop)
  if (!circle) throw new RfInputError('s', 'this device has no stability boundary on that plane (S11 − Δ·S22* = 0 with |S11| = |Δ|)')
  return { ...circle, stableInside: !circle.line && alpha < 0 }
}

/**
 * A constant-gain circle: normalised gain g = G/|S21|², centre g·conj(C)/(1 + g·(|near|² − |Δ|²)),
 * radius √(1 − 2K|S12S21|g + |S12S21|²g²) / |1 + g·(|near|² − |Δ|²)|, C = near − Δ·far*.
 */
function gainCircle(s: SMatrix2, gainDb: number, plane: 'source' | 'load'): GammaCircle | null {
  if (typeof gainDb !== 'number' || Number.isNaN(gainDb) || gainDb === Infinity) {
    throw new RfInputError('gainDb', `must be a number of dB, got ${String(gainDb)}`)
  }
  const p = sParts(s)
  const s21 = abs2(p.s21)
  if (s21 === 0) throw new RfInputError('s', 'S21 is zero: the device has no gain circles')
  const g = Math.pow(10, gainDb / 10) / s21
  const { near, far } = planeParts(p, plane)
  const alpha = 1 + g * (abs2(near) - abs2(p.delta))
  const beta = near.sub(p.delta.mul(far.conjugate())).mul(g)
  const loop = p.s12.mul(p.s21).abs()
  const m11 = abs2(p.s11), m22 = abs2(p.s22), md = abs2(p.delta)
  // 2K|S12S21| = 1 − |S11|² − |S22|² + |Δ|², so the radicand needs no division by S12·S21.
  const radicand = 1 - (1 - m11 - m22 + md) * g + loop * loop * g * g
  return quadraticLocus(alpha, beta, g * (1 - abs2(far)) - 1, radicand)
}

/**
 * The source-plane circle of constant available gain GA = `gainDb` (GA is the gain with the
 * output conjugately matched; it depends on ΓS only). Null above the maximum available gain.
 */
export function availableGainCircle(s: SMatrix2, gainDb: number): GammaCircle | null {
  return gainCircle(s, gainDb, 'source')
}

/**
 * The load-plane circle of constant operating gain GP = `gainDb` (GP is the gain with the input
 * conjugately matched; it depends on ΓL only). Null above the maximum available gain.
 */
export function operatingGainCircle(s: SMatrix2, gainDb: number): GammaCircle | null {
  return gainCircle(s, gainDb, 'load')
}

/**
 * True when Γ lies on the stable side of a stability circle (points on the circle count as unstable:
 * |Γout| or |Γin| = 1 there).
 */
export function isOnStableSide(circle: StabilityCircle, gamma: Complex): boolean {
  if (circle.line) {
    const n = circle.line.normal
    return gamma.re * n.re + gamma.im * n.im < circle.line.offset
  }
  const inside = Math.hypot(gamma.re - circle.center.re, gamma.im - circle.center.im) < circle.radius
  return inside === circle.stableInside
}
