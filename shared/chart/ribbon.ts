// Picking a point of the band ribbon on screen: the band index nearest a click, within reach.

/** Index of the point of a flat [x0, y0, x1, y1, …] polyline nearest (x, y), or null beyond `reachPx`. */
export function nearestRibbonIndex(points: readonly number[], x: number, y: number, reachPx = 8): number | null {
  let best: number | null = null
  let bestDistance = reachPx
  for (let i = 0; i + 1 < points.length; i += 2) {
    const d = Math.hypot(points[i]! - x, points[i + 1]! - y)
    if (d <= bestDistance) { best = i / 2; bestDistance = d }
  }
  return best
}
