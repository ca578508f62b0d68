// Fano's limit on the band plot: a dash-dot line at the limit across the searched band (return
// loss view: the limit in dB; |Γ| view: 10^(−limit/20)). Drawn from a uPlot draw hook.
import type uPlot from 'uplot'
import type { HuntFano } from '#shared/board/hunt'

export const FANO_LINE_HUE = '#7c3aed'

export function drawFanoLimit(u: uPlot, fano: HuntFano | null, frequenciesHz: readonly number[], isReturnLoss: boolean): void {
  if (!fano || frequenciesHz.length < 2 || !Number.isFinite(fano.limitDb)) return
  const value = isReturnLoss ? fano.limitDb : 10 ** (-fano.limitDb / 20)
  const { ctx, bbox } = u
  const y = u.valToPos(value, 'y', true)
  if (y < bbox.top || y > bbox.top + bbox.height) return
  const x1 = Math.max(bbox.left, u.valToPos(frequenciesHz[0]! / 1e6, 'x', true))
  const x2 = Math.min(bbox.left + bbox.width, u.valToPos(frequenciesHz[frequenciesHz.length - 1]! / 1e6, 'x', true))
  ctx.save()
  ctx.strokeStyle = FANO_LINE_HUE
  ctx.lineWidth = 1.25
  ctx.setLineDash([7, 3, 1.5, 3])
  ctx.beginPath()
  ctx.moveTo(x1, y)
  ctx.lineTo(x2, y)
  ctx.stroke()
  ctx.restore()
}
