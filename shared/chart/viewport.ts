/**
 * The view transform between the reflection-coefficient plane (Γ, dimensionless, y up) and the
 * screen (CSS pixels, y down). A view is plain data so it can sit in Vue state or a test:
 *   screenX = originX + scalePx · Γre,  screenY = originY − scalePx · Γim
 * `scalePx` is the radius of the unit circle |Γ| = 1 in pixels.
 */
import type { Complex } from '../rf/types'

export interface ViewTransform {
  /** Screen position of Γ = 0, in CSS pixels from the stage's top-left corner. */
  readonly originX: number
  readonly originY: number
  /** Pixels per unit of Γ: the unit circle's radius on screen. */
  readonly scalePx: number
}

export interface ScreenPoint {
  readonly x: number
  readonly y: number
}

/** Margin kept between the unit circle and the stage edge by `fitView`, for the x and b labels. */
export const FIT_MARGIN_PX = 28

/** Zoom limits relative to the fitted scale: far enough to read a crowded centre, never lost. */
export const MIN_ZOOM = 0.5
export const MAX_ZOOM = 60

/** The view that shows the whole unit circle centred in a `widthPx` × `heightPx` stage. */
export function fitView(widthPx: number, heightPx: number, marginPx = FIT_MARGIN_PX): ViewTransform {
  const half = Math.min(widthPx, heightPx) / 2
  return { originX: widthPx / 2, originY: heightPx / 2, scalePx: Math.max(1, half - marginPx) }
}

export function gammaToScreen(gamma: Complex, view: ViewTransform): ScreenPoint {
  return { x: view.originX + view.scalePx * gamma.re, y: view.originY - view.scalePx * gamma.im }
}

export function screenToGamma(point: ScreenPoint, view: ViewTransform): Complex {
  return { re: (point.x - view.originX) / view.scalePx, im: (view.originY - point.y) / view.scalePx }
}

/** A length in Γ units as pixels (radii of circles). */
export function gammaLengthToPx(length: number, view: ViewTransform): number {
  return length * view.scalePx
}

/**
 * Zooms by `factor` about a screen point, keeping the Γ under that point where it was (so the
 * wheel zooms "into the pointer"). The scale is held within [MIN_ZOOM, MAX_ZOOM] × `fittedScalePx`.
 */
export function zoomAt(view: ViewTransform, at: ScreenPoint, factor: number, fittedScalePx: number): ViewTransform {
  const scalePx = clamp(view.scalePx * factor, fittedScalePx * MIN_ZOOM, fittedScalePx * MAX_ZOOM)
  const k = scalePx / view.scalePx
  return {
    originX: at.x - (at.x - view.originX) * k,
    originY: at.y - (at.y - view.originY) * k,
    scalePx,
  }
}

/** Moves the view by a screen offset (the background follows the pointer). */
export function panBy(view: ViewTransform, dxPx: number, dyPx: number): ViewTransform {
  return { originX: view.originX + dxPx, originY: view.originY + dyPx, scalePx: view.scalePx }
}

/** The zoom factor of one wheel event: smooth for trackpads (small deltas), one step per notch. */
export function wheelZoomFactor(deltaY: number, deltaMode = 0): number {
  const pixels = deltaMode === 1 ? deltaY * 16 : deltaMode === 2 ? deltaY * 400 : deltaY
  return Math.exp(-clamp(pixels, -300, 300) * 0.0015)
}

/** The zoom of a view relative to the fitted one (1 = whole chart). */
export function zoomLevel(view: ViewTransform, fittedScalePx: number): number {
  return view.scalePx / fittedScalePx
}

export function sameView(a: ViewTransform, b: ViewTransform, tolerancePx = 1e-6): boolean {
  return Math.abs(a.originX - b.originX) <= tolerancePx
    && Math.abs(a.originY - b.originY) <= tolerancePx
    && Math.abs(a.scalePx - b.scalePx) <= tolerancePx
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, x))
}
