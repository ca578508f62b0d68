// The chart's view transform as reactive state: size of the stage, the Γ ↔ screen transform, and
// the zoom, pan and fit commands. The arithmetic is in shared/chart/viewport.ts.
import { computed, shallowRef } from 'vue'
import {
  fitView, panBy, sameView, screenToGamma, gammaToScreen, zoomAt, wheelZoomFactor,
  type ScreenPoint, type ViewTransform,
} from '#shared/chart/viewport'

export function useViewport() {
  const widthPx = shallowRef(0)
  const heightPx = shallowRef(0)
  const view = shallowRef<ViewTransform>(fitView(1, 1))
  const fittedScalePx = computed(() => fitView(widthPx.value, heightPx.value).scalePx)
  const isFitted = computed(() => sameView(view.value, fitView(widthPx.value, heightPx.value)))
  /** 1 when the whole chart is shown; 2 at twice the size. */
  const zoom = computed(() => view.value.scalePx / fittedScalePx.value)

  /** The stage changed size: a fitted view stays fitted, a zoomed one keeps its centre. */
  function resize(width: number, height: number) {
    if (width <= 0 || height <= 0) return
    const wasFitted = widthPx.value === 0 || isFitted.value
    const dx = (width - widthPx.value) / 2
    const dy = (height - heightPx.value) / 2
    widthPx.value = width
    heightPx.value = height
    view.value = wasFitted ? fitView(width, height) : panBy(view.value, dx, dy)
  }

  function fit() {
    view.value = fitView(widthPx.value, heightPx.value)
  }

  function zoomAtPoint(at: ScreenPoint, factor: number) {
    view.value = zoomAt(view.value, at, factor, fittedScalePx.value)
  }

  function zoomByWheel(at: ScreenPoint, deltaY: number, deltaMode = 0) {
    zoomAtPoint(at, wheelZoomFactor(deltaY, deltaMode))
  }

  function pan(dxPx: number, dyPx: number) {
    if (dxPx === 0 && dyPx === 0) return
    view.value = panBy(view.value, dxPx, dyPx)
  }

  return {
    widthPx, heightPx, view, zoom, isFitted,
    resize, fit, zoomAtPoint, zoomByWheel, pan,
    toGamma: (p: ScreenPoint) => screenToGamma(p, view.value),
    toScreen: (g: { re: number; im: number }) => gammaToScreen(g, view.value),
  }
}
