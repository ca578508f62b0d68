/**
 * The chart's two grids as plain Γ-plane arcs (view-independent, built once) and the labels on
 * their main circles. The impedance grid: constant r circles and constant x arcs; the admittance
 * grid: constant g circles and constant b arcs; both clipped to the unit circle.
 */
import {
  conductanceCircle, reactanceCircle, resistanceCircle, susceptanceCircle, UNIT_CIRCLE,
} from './circles'
import { arcInsideDisk, type GammaArc } from './clip'

/** The labelled circles of each grid. */
export const MAIN_GRID_VALUES = [0.2, 0.5, 1, 2, 5] as const

/** Lighter circles between them, for reading values near the centre. */
export const MINOR_GRID_VALUES = [0.1, 0.3, 0.4, 0.6, 0.7, 0.8, 0.9, 1.5, 3, 4, 10, 20] as const

export type GridWeight = 'rim' | 'major' | 'minor'

export interface GridArc extends GammaArc {
  readonly weight: GridWeight
}

export interface GridSet {
  readonly arcs: readonly GridArc[]
  /** The real axis from Γ = −1 to Γ = 1 (x = 0 and b = 0). */
  readonly axis: { readonly from: number; readonly to: number }
}

function weightOf(value: number): GridWeight {
  return (MAIN_GRID_VALUES as readonly number[]).includes(value) ? 'major' : 'minor'
}

const ALL_VALUES = [...MAIN_GRID_VALUES, ...MINOR_GRID_VALUES].sort((a, b) => a - b)

function clipped(circle: Parameters<typeof arcInsideDisk>[0], weight: GridWeight): GridArc[] {
  const arc = arcInsideDisk(circle)
  return arc ? [{ ...arc, weight }] : []
}

/** Constant r circles, constant x arcs (both signs) and the unit circle r = 0. */
export function impedanceGrid(): GridSet {
  const arcs: GridArc[] = [{ circle: UNIT_CIRCLE, start: 0, end: 2 * Math.PI, weight: 'rim' }]
  for (const v of ALL_VALUES) {
    arcs.push(...clipped(resistanceCircle(v), weightOf(v)))
    arcs.push(...clipped(reactanceCircle(v), weightOf(v)))
    arcs.push(...clipped(reactanceCircle(-v), weightOf(v)))
  }
  return { arcs, axis: { from: -1, to: 1 } }
}

/** Constant g circles and constant b arcs (both signs); the rim is the impedance grid's. */
export function admittanceGrid(): GridSet {
  const arcs: GridArc[] = []
  for (const v of ALL_VALUES) {
    arcs.push(...clipped(conductanceCircle(v), weightOf(v)))
    arcs.push(...clipped(susceptanceCircle(v), weightOf(v)))
    arcs.push(...clipped(susceptanceCircle(-v), weightOf(v)))
  }
  return { arcs, axis: { from: -1, to: 1 } }
}
