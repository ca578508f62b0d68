/**
 * Clipping circles to the chart's disk |Γ| ≤ 1, and turning Γ-plane arcs into canvas arcs.
 * Angles are radians about the circle's own centre, counter-clockwise in the Γ plane.
 */
import type { GammaCircle } from './circles'
import type { ViewTransform } from './viewport'

/** The part of a circle from angle `start` to `end` (start < end, counter-clockwise). */
export interface GammaArc {
  readonly circle: GammaCircle
  readonly start: number
  readonly end: number
}

const FULL_TURN = 2 * Math.PI
const TOUCH = 1e-12

/**
 * The arc of `circle` inside the disk of radius `diskRadius` about Γ = 0, or null if none.
 * A circle inside the disk (touching it allowed, as every constant-r circle touches Γ = 1) is
 * kept whole. Otherwise the circle crosses the disk edge at two points, the half-angle α about
 * the centre from the law of cosines cos α = (R² + d² − ρ²)/(2Rd), and the inner arc is the one
 * facing the disk's centre.
 */
export function arcInsideDisk(circle: GammaCircle, diskRadius = 1): GammaArc | null {
  const d = Math.hypot(circle.cx, circle.cy)
  const r = circle.radius
  if (d + r <= diskRadius + TOUCH) return { circle, start: 0, end: FULL_TURN }
  if (d >= r + diskRadius - TOUCH || r >= d + diskRadius - TOUCH) return null
  const cosAlpha = (r * r + d * d - diskRadius * diskRadius) / (2 * r * d)
  const alpha = Math.acos(Math.min(1, Math.max(-1, cosAlpha)))
  const towardCentre = Math.atan2(-circle.cy, -circle.cx)
  return { circle, start: towardCentre - alpha, end: towardCentre + alpha }
}

/** The point of an arc at angle θ about its circle's centre. */
export function pointOnArc(arc: GammaArc, theta: number): { re: number; im: number } {
  return {
    re: arc.circle.cx + arc.circle.radius * Math.cos(theta),
    im: arc.circle.cy + arc.circle.radius * Math.sin(theta),
  }
}

/** A canvas arc: `ctx.arc(x, y, radiusPx, startAngle, endAngle)` (clockwise on screen). */
export interface ScreenArc {
  readonly x: number
  readonly y: number
  readonly radiusPx: number
  readonly startAngle: number
  readonly endAngle: number
}

/**
 * A Γ-plane arc on screen. The screen's y axis points down, so a Γ angle θ is the canvas angle
 * −θ, and the counter-clockwise Γ arc [start, end] is the canvas arc [−end, −start].
 */
export function arcToScreen(arc: GammaArc, view: ViewTransform): ScreenArc {
  return {
    x: view.originX + view.scalePx * arc.circle.cx,
    y: view.originY - view.scalePx * arc.circle.cy,
    radiusPx: view.scalePx * arc.circle.radius,
    startAngle: -arc.end,
    endAngle: -arc.start,
  }
}
