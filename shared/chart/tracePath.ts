/**
 * The drawn path of each element's trace segment: the true arc along the element's circle, not
 * a chord. A lumped part, a stub or a transformer adds its impedance (series) or admittance
 * (shunt) in proportion to a parameter s from 0 (no part) to 1 (its value) — a lossy L or C too,
 * since its ESR = |X|/Q scales with X — so the path is z_prev + s·(z_next − z_prev) in the plane
 * it adds in. A line turns the point about its own Zc as its length grows from 0 to its value.
 * A measured block has no such path and is drawn as a straight step.
 * Points are sampled by bisection until neighbours are closer than `maxStepGamma` in Γ.
 */
import type { Complex, Element } from '../rf/types'
import { applyElement } from '../rf/elements'
import { gammaOf } from '../rf/gamma'
import { isInfinite } from '../rf/complex'
import type { ViewTransform } from './viewport'

/** Flat Γ coordinates [re0, im0, re1, im1, …]. */
export type GammaPolyline = number[]

/** About 0.3° of the unit circle between drawn samples: smooth at the zooms we allow. */
export const DEFAULT_MAX_STEP_GAMMA = 0.012
const START_INTERVALS = 8
const MAX_DEPTH = 7

function invert(z: Complex): Complex {
  if (isInfinite(z)) return { re: 0, im: 0 }
  const m = z.re * z.re + z.im * z.im
  if (m === 0) return { re: Infinity, im: 0 }
  return { re: z.re / m, im: -z.im / m }
}

function lerp(a: Complex, b: Complex, s: number): Complex {
  return { re: a.re + s * (b.re - a.re), im: a.im + s * (b.im - a.im) }
}

/** The element's point at parameter s ∈ [0, 1], as Γ against z0. */
function pathPoint(element: Element, zPrev: Complex, zNext: Complex, z0: number, frequencyHz: number) {
  if (element.kind === 'line') {
    return (s: number) => gammaOf(applyElement(zPrev, { ...element, deg: element.deg * s }, frequencyHz), z0)
  }
  if (element.kind === 'block') {
    // Measured data has no path between its ends: a straight step in Γ.
    const a = gammaOf(zPrev, z0)
    const b = gammaOf(zNext, z0)
    return (s: number) => lerp(a, b, s)
  }
  const isShunt = 'placement' in element && element.placement === 'shunt'
  if (isShunt) {
    const yPrev = invert(zPrev)
    const yNext = invert(zNext)
    if (isInfinite(yPrev) || isInfinite(yNext)) return null
    return (s: number) => gammaOf(invert(lerp(yPrev, yNext, s)), z0)
  }
  if (isInfinite(zPrev) || isInfinite(zNext)) return null
  return (s: number) => gammaOf(lerp(zPrev, zNext, s), z0)
}

/**
 * The Γ path of one element from the point before it (`zPrev`, Ω) to the point after it
 * (`zNext`), at the design frequency. Degenerate segments (through an open or a short) are drawn
 * as their two end points.
 */
export function segmentPath(
  element: Element, zPrev: Complex, zNext: Complex, z0: number, frequencyHz: number,
  maxStepGamma = DEFAULT_MAX_STEP_GAMMA,
): GammaPolyline {
  const at = pathPoint(element, zPrev, zNext, z0, frequencyHz)
  if (!at) {
    const a = gammaOf(zPrev, z0)
    const b = gammaOf(zNext, z0)
    return [a.re, a.im, b.re, b.im]
  }
  const out: number[] = []
  let prev = at(0)
  out.push(prev.re, prev.im)
  const refine = (s0: number, g0: Complex, s1: number, g1: Complex, depth: number) => {
    if (depth < MAX_DEPTH && Math.hypot(g1.re - g0.re, g1.im - g0.im) > maxStepGamma) {
      const sm = (s0 + s1) / 2
      const gm = at(sm)
      refine(s0, g0, sm, gm, depth + 1)
      refine(sm, gm, s1, g1, depth + 1)
      return
    }
    out.push(g1.re, g1.im)
  }
  for (let k = 1; k <= START_INTERVALS; k++) {
    const s = k / START_INTERVALS
    const g = at(s)
    refine((k - 1) / START_INTERVALS, prev, s, g, 0)
    prev = g
  }
  return out
}

/** Γ of each impedance of a list (Ω), flat. */
export function gammaPolyline(impedances: readonly Complex[], z0: number): GammaPolyline {
  const out: number[] = new Array(impedances.length * 2)
  for (let i = 0; i < impedances.length; i++) {
    const g = gammaOf(impedances[i]!, z0)
    out[2 * i] = g.re
    out[2 * i + 1] = g.im
  }
  return out
}

/** Flat Γ coordinates to flat screen coordinates [x0, y0, x1, y1, …] for a canvas polyline. */
export function polylineToScreen(points: GammaPolyline, view: ViewTransform): number[] {
  const out: number[] = new Array(points.length)
  for (let i = 0; i < points.length; i += 2) {
    out[i] = view.originX + view.scalePx * points[i]!
    out[i + 1] = view.originY - view.scalePx * points[i + 1]!
  }
  return out
}
