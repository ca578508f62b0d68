// Painting of the chart's slow-changing overlays (the measured load, the Monte Carlo cloud) on a
// native 2D context; points are flat screen [x0, y0, x1, y1, …] arrays. Pure drawing, no state.
import { MEASURED_HUE } from '../board/measured-style'

const CLOUD_FILL = 'rgba(43, 47, 54, 0.55)'

/** The measured load across its frequencies: a dotted polyline with a small square per point. */
export function paintMeasuredLoad(ctx: CanvasRenderingContext2D, line: readonly number[]): void {
  if (line.length < 4) return
  ctx.save()
  ctx.strokeStyle = MEASURED_HUE
  ctx.lineWidth = 1.5
  ctx.setLineDash([2, 3])
  ctx.beginPath()
  ctx.moveTo(line[0]!, line[1]!)
  for (let i = 2; i < line.length; i += 2) ctx.lineTo(line[i]!, line[i + 1]!)
  ctx.stroke()
  ctx.setLineDash([])
  ctx.fillStyle = MEASURED_HUE
  for (let i = 0; i < line.length; i += 2) ctx.fillRect(line[i]! - 1.5, line[i + 1]! - 1.5, 3, 3)
  ctx.restore()
}

/** The Monte Carlo cloud: one small dot per trial's end point. */
export function paintCloud(ctx: CanvasRenderingContext2D, xy: readonly number[]): void {
  if (!xy.length) return
  ctx.save()
  ctx.fillStyle = CLOUD_FILL
  for (let i = 0; i < xy.length; i += 2) {
    ctx.beginPath()
    ctx.arc(xy[i]!, xy[i + 1]!, 1.6, 0, 2 * Math.PI)
    ctx.fill()
  }
  ctx.restore()
}
