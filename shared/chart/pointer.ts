/**
 * What the pointer is over: the nearest handle within reach, and the readout at the pointer.
 */
import type { Complex } from '../rf/types'
import { gammaOf, impedanceOf } from '../rf/gamma'
import { formatEng } from '../rf/units'
import { readoutOf } from '../board/readout'
import { withoutNoise } from '../board/format'
import type { ScreenPoint } from './viewport'

/** How far from a handle's centre a press still grabs it (px): a comfortable finger-free target. */
export const HANDLE_REACH_PX = 11

/** The id of the handle nearest to (x, y) within `reachPx`, or null. */
export function handleAt<H extends ScreenPoint & { id: string }>(handles: readonly H[], x: number, y: number, reachPx = HANDLE_REACH_PX): string | null {
  let best: string | null = null
  let bestDistance = reachPx
  for (const h of handles) {
    const d = Math.hypot(h.x - x, h.y - y)
    if (d <= bestDistance) {
      best = h.id
      bestDistance = d
    }
  }
  return best
}

/** The index of the point of a flat screen polyline [x0, y0, x1, y1, …] nearest (x, y) within reach, or −1. */
export function pointIndexAt(points: readonly number[], x: number, y: number, reachPx = HANDLE_REACH_PX): number {
  let best = -1
  let bestDistance = reachPx
  for (let i = 0; i + 1 < points.length; i += 2) {
    const d = Math.hypot(points[i]! - x, points[i + 1]! - y)
    if (d <= bestDistance) {
      best = i / 2
      bestDistance = d
    }
  }
  return best
}

export interface ReadoutRow {
  readonly label: string
  readonly text: string
}

function complexText(value: Complex, unit: string): string {
  if (!Number.isFinite(value.re) || !Number.isFinite(value.im)) return `∞ ${unit}`
  const z = withoutNoise(value, 3)
  const sign = z.im < 0 ? '−' : '+'
  return `${formatEng(z.re, unit)} ${sign} j${formatEng(Math.abs(z.im), unit)}`
}

function figure(value: number, digits: number, unit = ''): string {
  if (!Number.isFinite(value)) return value > 0 ? `∞${unit}` : '—'
  return `${value.toFixed(digits)}${unit}`
}

/** What the readout says instead of numbers when the pointer is beyond the rim. */
export const OUTSIDE_CHART_TEXT = 'outside the passive chart'

/**
 * The cursor readout at a point of the chart (Γ against z0): Z, Y, |Γ|∠, VSWR, return loss.
 * Beyond the rim (|Γ| > 1) the point is an active impedance (negative R): no part of a passive
 * ladder lands there, so the readout gives a note instead of figures that would mislead.
 */
export function cursorReadout(gamma: Complex, z0: number): ReadoutRow[] {
  const magnitude = Math.hypot(gamma.re, gamma.im)
  if (!(magnitude <= 1)) return [{ label: 'Pointer', text: OUTSIDE_CHART_TEXT }]
  const r = readoutOf(impedanceOf(gamma, z0), z0)
  return [
    { label: 'Z', text: complexText(r.z, 'Ω') },
    { label: 'Y', text: complexText(r.y, 'S') },
    { label: 'Γ', text: `${magnitude.toFixed(3)} ∠ ${r.gammaAngleDeg.toFixed(1)}°` },
    { label: 'VSWR', text: figure(r.vswr, 2) },
    { label: 'Return loss', text: figure(r.returnLossDb, 1, ' dB') },
  ]
}

/**
 * Γ (against z0) of the point the dragged element leads to, as the trace computes it with the
 * board's Q: the pointer only steers a drag along the element's lossless circle, so during a drag
 * the readout shows this point (the one the tile and the end point agree with), not the pointer.
 * Null without a drag or when the element is not in the trace.
 */
export function draggedPointGamma(impedances: readonly Complex[], elementIds: readonly string[], draggedId: string | null, z0: number): Complex | null {
  if (draggedId === null) return null
  const index = elementIds.indexOf(draggedId)
  const z = index < 0 ? undefined : impedances[index + 1]
  return z ? gammaOf(z, z0) : null
}
