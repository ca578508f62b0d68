/**
 * Painting the chart on a 2D canvas context: the grid, the traces and the handles, from screen
 * data made by grid.ts, labels.ts and scene.ts. Plain canvas calls only (the Konva layers hand
 * over their native context), so the look lives in one place: ink-grey impedance grid, teal
 * dotted admittance grid, element hues, Work Sans labels on calm paper.
 */
import type { GridSet } from './grid'
import type { ScreenLabel } from './labels'
import type { ScreenArc } from './clip'
import { arcToScreen } from './clip'
import type { ScreenHandle, ScreenTraceScene } from './scene'
import type { ScreenPoint, ViewTransform } from './viewport'
import { MARKER_HUE } from '../board/measured-style'

/** The part of a canvas 2D context the painters use (declared here: shared code has no DOM types). */
export interface Paint2D {
  beginPath(): void
  moveTo(x: number, y: number): void
  lineTo(x: number, y: number): void
  arc(x: number, y: number, radius: number, startAngle: number, endAngle: number): void
  rect(x: number, y: number, width: number, height: number): void
  stroke(): void
  fill(): void
  fillText(text: string, x: number, y: number): void
  setLineDash(segments: number[]): void
  save(): void
  restore(): void
  strokeStyle: unknown
  fillStyle: unknown
  lineWidth: number
  lineCap: string
  lineJoin: string
  globalAlpha: number
  font: string
  textAlign: string
  textBaseline: string
}

export const CHART_COLOURS = {
  paper: '#f7f5f0',
  ink: '#2b2f36',
  inkSoft: '#5b616b',
  inkFaint: '#9aa0a8',
  teal: '#2f8f8a',
  accent: '#c2410c',
} as const

export const LABEL_FONT = '10px "Work Sans", system-ui, sans-serif'
export const SMALL_LABEL_FONT = '600 10px "Work Sans", system-ui, sans-serif'

const GRID_STYLE = {
  impedance: {
    rim: { colour: CHART_COLOURS.ink, width: 1.4, alpha: 1, dash: [] as number[] },
    major: { colour: CHART_COLOURS.inkSoft, width: 0.9, alpha: 0.85, dash: [] as number[] },
    minor: { colour: CHART_COLOURS.inkFaint, width: 0.55, alpha: 0.6, dash: [] as number[] },
  },
  admittance: {
    rim: { colour: CHART_COLOURS.teal, width: 1, alpha: 0.9, dash: [1.2, 3] },
    major: { colour: CHART_COLOURS.teal, width: 1, alpha: 0.8, dash: [1.2, 3] },
    minor: { colour: CHART_COLOURS.teal, width: 0.7, alpha: 0.5, dash: [1, 3.5] },
  },
}

function strokeArcs(ctx: Paint2D, arcs: readonly ScreenArc[]) {
  ctx.beginPath()
  for (const a of arcs) {
    ctx.moveTo(a.x + a.radiusPx * Math.cos(a.startAngle), a.y + a.radiusPx * Math.sin(a.startAngle))
    ctx.arc(a.x, a.y, a.radiusPx, a.startAngle, a.endAngle)
  }
  ctx.stroke()
}

/** One grid (impedance or admittance) in its own style. */
export function paintGrid(ctx: Paint2D, grid: GridSet, family: 'impedance' | 'admittance', view: ViewTransform) {
  const styles = GRID_STYLE[family]
  ctx.save()
  ctx.lineCap = 'round'
  for (const weight of ['minor', 'major', 'rim'] as const) {
    const arcs = grid.arcs.filter(a => a.weight === weight).map(a => arcToScreen(a, view))
    if (arcs.length === 0) continue
    const s = styles[weight]
    ctx.strokeStyle = s.colour
    ctx.lineWidth = s.width
    ctx.globalAlpha = s.alpha
    ctx.setLineDash(s.dash)
    strokeArcs(ctx, arcs)
  }
  if (family === 'impedance') {
    const s = styles.major
    ctx.strokeStyle = s.colour
    ctx.lineWidth = s.width
    ctx.globalAlpha = s.alpha
    ctx.setLineDash([])
    ctx.beginPath()
    ctx.moveTo(view.originX + view.scalePx * grid.axis.from, view.originY)
    ctx.lineTo(view.originX + view.scalePx * grid.axis.to, view.originY)
    ctx.stroke()
  }
  ctx.restore()
}

export function paintLabels(ctx: Paint2D, labels: readonly ScreenLabel[]) {
  ctx.save()
  ctx.font = LABEL_FONT
  for (const l of labels) {
    ctx.fillStyle = l.family === 'impedance' ? CHART_COLOURS.inkSoft : CHART_COLOURS.teal
    ctx.textAlign = l.align
    ctx.textBaseline = l.baseline
    ctx.fillText(l.text, l.x, l.y)
  }
  ctx.restore()
}

function polyline(ctx: Paint2D, points: readonly number[]) {
  if (points.length < 4) return
  ctx.moveTo(points[0]!, points[1]!)
  for (let i = 2; i < points.length; i += 2) ctx.lineTo(points[i]!, points[i + 1]!)
}

function dot(ctx: Paint2D, p: ScreenPoint, radius: number, fill: string, ring?: string) {
  ctx.beginPath()
  ctx.arc(p.x, p.y, radius, 0, 2 * Math.PI)
  ctx.fillStyle = fill
  ctx.fill()
  if (ring) {
    ctx.strokeStyle = ring
    ctx.lineWidth = 1.5
    ctx.stroke()
  }
}

function endLabel(ctx: Paint2D, text: string, at: ScreenPoint, dir: { x: number; y: number }) {
  ctx.textAlign = dir.x > 0.35 ? 'left' : dir.x < -0.35 ? 'right' : 'center'
  ctx.textBaseline = dir.y > 0.35 ? 'top' : dir.y < -0.35 ? 'bottom' : 'middle'
  ctx.fillText(text, at.x + dir.x * 9, at.y + dir.y * 9)
}

/** Band ribbon, preview, constant-Q arcs, mismatch ring, element segments, goal and end markers. */
export function paintTraces(ctx: Paint2D, scene: ScreenTraceScene, labels: { bandStart: string; bandStop: string; q: string | null }) {
  ctx.save()
  ctx.lineCap = 'round'
  ctx.lineJoin = 'round'
  ctx.setLineDash([])

  // Constant-Q arcs: faint long dashes, under everything else.
  if (scene.qArcs.length) {
    ctx.strokeStyle = CHART_COLOURS.inkSoft
    ctx.globalAlpha = 0.7
    ctx.lineWidth = 1
    ctx.setLineDash([7, 4])
    strokeArcs(ctx, scene.qArcs)
    if (labels.q) {
      const top = scene.qArcs[0]!
      const mid = (top.startAngle + top.endAngle) / 2
      ctx.globalAlpha = 1
      ctx.font = SMALL_LABEL_FONT
      ctx.fillStyle = CHART_COLOURS.inkSoft
      ctx.textAlign = 'center'
      ctx.textBaseline = 'bottom'
      ctx.fillText(labels.q, top.x + top.radiusPx * Math.cos(mid), top.y + top.radiusPx * Math.sin(mid) - 3)
    }
    ctx.setLineDash([])
  }

  // The mismatch ring through the end point.
  if (scene.ring) {
    ctx.globalAlpha = 0.75
    ctx.strokeStyle = CHART_COLOURS.accent
    ctx.lineWidth = 1
    ctx.setLineDash([3, 4])
    strokeArcs(ctx, [scene.ring])
    ctx.setLineDash([])
  }

  // Band ribbon: a soft wide band with a fine centre line; start dot, stop square.
  if (scene.band.length >= 4) {
    ctx.globalAlpha = 0.16
    ctx.strokeStyle = CHART_COLOURS.ink
    ctx.lineWidth = 8
    ctx.beginPath()
    polyline(ctx, scene.band)
    ctx.stroke()
    ctx.globalAlpha = 0.85
    ctx.lineWidth = 1.1
    ctx.beginPath()
    polyline(ctx, scene.band)
    ctx.stroke()
    const b = scene.band
    const start = { x: b[0]!, y: b[1]! }
    const stop = { x: b[b.length - 2]!, y: b[b.length - 1]! }
    ctx.globalAlpha = 1
    dot(ctx, start, 3.5, CHART_COLOURS.ink, CHART_COLOURS.paper)
    ctx.fillStyle = CHART_COLOURS.paper
    ctx.strokeStyle = CHART_COLOURS.ink
    ctx.lineWidth = 1.5
    ctx.beginPath()
    ctx.rect(stop.x - 3.5, stop.y - 3.5, 7, 7)
    ctx.fill()
    ctx.stroke()
    // Each end's label sits beyond its end, away from the other end, so the two never meet.
    const dx = start.x - stop.x
    const dy = start.y - stop.y
    const n = Math.hypot(dx, dy)
    const dir = n > 1 ? { x: dx / n, y: dy / n } : { x: -1, y: 0 }
    ctx.font = LABEL_FONT
    ctx.fillStyle = CHART_COLOURS.ink
    endLabel(ctx, labels.bandStart, start, dir)
    endLabel(ctx, labels.bandStop, stop, { x: -dir.x, y: -dir.y })
  }

  // A solver preview: dashed ink, above the band, below the live trace.
  if (scene.preview.length) {
    ctx.globalAlpha = 0.8
    ctx.strokeStyle = CHART_COLOURS.ink
    ctx.lineWidth = 2
    ctx.setLineDash([6, 5])
    ctx.beginPath()
    for (const p of scene.preview) polyline(ctx, p)
    ctx.stroke()
    ctx.setLineDash([])
  }

  // The live trace, one hue per element.
  ctx.globalAlpha = 1
  ctx.lineWidth = 2.6
  for (const s of scene.segments) {
    ctx.strokeStyle = s.hue
    ctx.beginPath()
    polyline(ctx, s.points)
    ctx.stroke()
  }

  // Goal: an accent ring with a cross; load: an ink dot; end: a filled accent dot.
  ctx.strokeStyle = CHART_COLOURS.accent
  ctx.lineWidth = 1.6
  ctx.beginPath()
  ctx.arc(scene.goal.x, scene.goal.y, 7, 0, 2 * Math.PI)
  ctx.moveTo(scene.goal.x - 11, scene.goal.y)
  ctx.lineTo(scene.goal.x + 11, scene.goal.y)
  ctx.moveTo(scene.goal.x, scene.goal.y - 11)
  ctx.lineTo(scene.goal.x, scene.goal.y + 11)
  ctx.stroke()
  dot(ctx, scene.load, 4, CHART_COLOURS.ink, CHART_COLOURS.paper)
  dot(ctx, scene.end, 4.5, CHART_COLOURS.accent, CHART_COLOURS.paper)

  // Frequency markers on the band ribbon: small diamonds with their frequency.
  ctx.font = SMALL_LABEL_FONT
  ctx.textAlign = 'left'
  ctx.textBaseline = 'bottom'
  for (const m of scene.marks) {
    ctx.beginPath()
    ctx.moveTo(m.x, m.y - 5)
    ctx.lineTo(m.x + 5, m.y)
    ctx.lineTo(m.x, m.y + 5)
    ctx.lineTo(m.x - 5, m.y)
    ctx.fillStyle = MARKER_HUE
    ctx.fill()
    ctx.fillText(m.label, m.x + 6, m.y - 4)
  }
  ctx.restore()
}

/** Drag handles; the active one larger and filled. An optional guide arc for the dragged element. */
export function paintHandles(
  ctx: Paint2D, handles: readonly ScreenHandle[], activeId: string | null, hoverId: string | null,
  guide: { arc: ScreenArc | null; points: readonly number[] | null; hue: string } | null,
) {
  ctx.save()
  if (guide) {
    ctx.globalAlpha = 0.45
    ctx.strokeStyle = guide.hue
    ctx.lineWidth = 1.2
    ctx.setLineDash([2, 4])
    if (guide.arc) strokeArcs(ctx, [guide.arc])
    if (guide.points) {
      ctx.beginPath()
      polyline(ctx, guide.points)
      ctx.stroke()
    }
    ctx.setLineDash([])
    ctx.globalAlpha = 1
  }
  for (const h of handles) {
    const isActive = h.id === activeId
    const isHover = h.id === hoverId
    ctx.beginPath()
    ctx.arc(h.x, h.y, isActive ? 8 : isHover ? 7.5 : 6, 0, 2 * Math.PI)
    ctx.fillStyle = isActive ? h.hue : CHART_COLOURS.paper
    ctx.fill()
    ctx.strokeStyle = h.hue
    ctx.lineWidth = 2.4
    ctx.stroke()
  }
  ctx.restore()
}
