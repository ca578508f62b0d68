/**
 * Label placement for the main grid circles. Labels keep a fixed pixel size and offset at every
 * zoom, so they are anchored at a Γ point and pushed off it along a screen direction:
 * - r on the real axis at Γ = (r − 1)/(r + 1), just above it; g at Γ = (1 − g)/(1 + g), just below
 *   (r = g = 1 share Γ = 0, one above and one below);
 * - x where its arc meets the rim, P(x) = ((x² − 1)/(x² + 1), 2x/(x² + 1)), pushed outward;
 * - b where its arc meets the rim away from Γ = −1, −P(b), pushed inward (−P(b) is also where
 *   x = −1/b ends, so the two families sit on either side of the rim).
 */
import type { Complex } from '../rf/types'
import { MAIN_GRID_VALUES } from './grid'
import { gammaToScreen, type ViewTransform } from './viewport'

export type GridFamily = 'impedance' | 'admittance'

export interface GridLabel {
  readonly text: string
  readonly family: GridFamily
  /** Where the label is anchored. */
  readonly at: Complex
  /** Screen direction (unit vector, y down) to push the label off its anchor. */
  readonly dirX: number
  readonly dirY: number
}

export interface ScreenLabel {
  readonly text: string
  readonly family: GridFamily
  readonly x: number
  readonly y: number
  readonly align: 'left' | 'center' | 'right'
  readonly baseline: 'top' | 'middle' | 'bottom'
}

/** Offset of a label from its anchor, in pixels. */
export const LABEL_OFFSET_PX = 4

function plain(value: number): string {
  return String(Number(value.toPrecision(3)))
}

function rimPoint(x: number): Complex {
  const x2 = x * x
  return { re: (x2 - 1) / (x2 + 1), im: (2 * x) / (x2 + 1) }
}

/** Labels of the main circles of one grid. */
export function gridLabels(family: GridFamily): GridLabel[] {
  const labels: GridLabel[] = []
  for (const v of MAIN_GRID_VALUES) {
    if (family === 'impedance') {
      labels.push({ text: plain(v), family, at: { re: (v - 1) / (v + 1), im: 0 }, dirX: 0.45, dirY: -0.9 })
      for (const sign of [1, -1]) {
        const at = rimPoint(sign * v)
        labels.push({ text: `${sign > 0 ? '+' : '−'}j${plain(v)}`, family, at, dirX: at.re, dirY: -at.im })
      }
    } else {
      labels.push({ text: plain(v), family, at: { re: (1 - v) / (1 + v), im: 0 }, dirX: -0.45, dirY: 0.9 })
      for (const sign of [1, -1]) {
        const p = rimPoint(sign * v)
        const at = { re: -p.re, im: -p.im }
        labels.push({ text: `${sign > 0 ? '+' : '−'}j${plain(v)}`, family, at, dirX: -at.re, dirY: at.im })
      }
    }
  }
  return labels
}

/** Screen position and text alignment of a label: aligned so the text grows away from its anchor. */
export function placeLabel(label: GridLabel, view: ViewTransform, offsetPx = LABEL_OFFSET_PX): ScreenLabel {
  const p = gammaToScreen(label.at, view)
  const align = label.dirX > 0.3 ? 'left' : label.dirX < -0.3 ? 'right' : 'center'
  const baseline = label.dirY > 0.3 ? 'top' : label.dirY < -0.3 ? 'bottom' : 'middle'
  return {
    text: label.text,
    family: label.family,
    x: p.x + label.dirX * offsetPx,
    y: p.y + label.dirY * offsetPx,
    align,
    baseline,
  }
}
