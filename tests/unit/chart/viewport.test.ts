// The view transform: round trips, zoom about the pointer, pan, fit and its limits.
import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  FIT_MARGIN_PX, MAX_ZOOM, MIN_ZOOM, fitView, gammaToScreen, panBy, screenToGamma, wheelZoomFactor, zoomAt,
} from '../../../shared/chart/viewport'

describe('viewport', () => {
  it('fits the unit circle in the smaller side, centred, with the label margin', () => {
    const v = fitView(800, 600)
    expect(v.originX).toBe(400)
    expect(v.originY).toBe(300)
    expect(v.scalePx).toBe(300 - FIT_MARGIN_PX)
    // Γ = j is straight above the centre (screen y grows downwards).
    const top = gammaToScreen({ re: 0, im: 1 }, v)
    expect(top.x).toBeCloseTo(400, 12)
    expect(top.y).toBeCloseTo(300 - v.scalePx, 12)
  })

  it('round-trips Γ → screen → Γ for random views', () => {
    const rng = seedrandom('viewport-roundtrip')
    for (let i = 0; i < 200; i++) {
      const view = { originX: rng() * 1000, originY: rng() * 1000, scalePx: 10 + rng() * 5000 }
      const g = { re: rng() * 2 - 1, im: rng() * 2 - 1 }
      const back = screenToGamma(gammaToScreen(g, view), view)
      expect(Math.hypot(back.re - g.re, back.im - g.im)).toBeLessThan(1e-12)
    }
  })

  it('zooms about the pointer: the Γ under it stays put', () => {
    const rng = seedrandom('viewport-zoom')
    const fitted = fitView(900, 700)
    for (let i = 0; i < 100; i++) {
      const at = { x: rng() * 900, y: rng() * 700 }
      const before = screenToGamma(at, fitted)
      const zoomed = zoomAt(fitted, at, 1 + rng() * 3, fitted.scalePx)
      const after = screenToGamma(at, zoomed)
      expect(Math.hypot(after.re - before.re, after.im - before.im)).toBeLessThan(1e-12)
      expect(zoomed.scalePx).toBeGreaterThan(fitted.scalePx)
    }
  })

  it('holds the zoom between its limits', () => {
    const fitted = fitView(500, 500)
    const far = zoomAt(fitted, { x: 10, y: 10 }, 1e6, fitted.scalePx)
    const near = zoomAt(fitted, { x: 10, y: 10 }, 1e-6, fitted.scalePx)
    expect(far.scalePx).toBeCloseTo(fitted.scalePx * MAX_ZOOM, 9)
    expect(near.scalePx).toBeCloseTo(fitted.scalePx * MIN_ZOOM, 9)
  })

  it('pans by a screen offset and turns wheel deltas into zoom factors', () => {
    const v = panBy(fitView(400, 400), 12, -7)
    expect(v.originX).toBe(212)
    expect(v.originY).toBe(193)
    expect(wheelZoomFactor(-100)).toBeGreaterThan(1)
    expect(wheelZoomFactor(100)).toBeLessThan(1)
    expect(wheelZoomFactor(100) * wheelZoomFactor(-100)).toBeCloseTo(1, 12)
    // One line of a line-mode wheel zooms as much as 16 pixels.
    expect(wheelZoomFactor(1, 1)).toBeCloseTo(wheelZoomFactor(16, 0), 12)
  })
})
