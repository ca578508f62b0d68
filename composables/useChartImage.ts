// The board's chart as a PNG: the Konva stage inside the chart area, drawn at twice its size on
// the paper colour (the stage itself is transparent; the page behind it gives the colour).
import Konva from 'konva'

const PAPER = '#f7f5f0' // tailwind.config.ts `paper`

/** A data: URL of the chart's PNG, or null when no chart is on the page. */
export function chartPngDataUrl(pixelRatio = 2): string | null {
  const stage = Konva.stages.find(s => s.container()?.closest('[data-testid="chart"]'))
  if (!stage) return null
  const drawn = stage.toCanvas({ pixelRatio })
  const canvas = document.createElement('canvas')
  canvas.width = drawn.width
  canvas.height = drawn.height
  const ctx = canvas.getContext('2d')!
  ctx.fillStyle = PAPER
  ctx.fillRect(0, 0, canvas.width, canvas.height)
  ctx.drawImage(drawn, 0, 0)
  return canvas.toDataURL('image/png')
}
