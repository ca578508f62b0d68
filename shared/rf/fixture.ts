/**
 * A part described by its maker's measured S-parameter file: the component mounted in a
 * series-through fixture (in the path between port 1 and port 2) or a shunt-through fixture
 * (from the through line to ground), both ports at the file's real reference Z0. Its impedance
 * across frequency follows from S21 alone, by the standard fixture relations (the component as a
 * series or shunt impedance between two Z0 ports, S21 = 2Z0/(2Z0 + Z) resp. 2Z/(2Z + Z0)):
 *   series-through: Z = 2·Z0·(1 − S21)/S21
 *   shunt-through:  Z = Z0·S21/(2·(1 − S21))
 * S21 is interpolated linearly in re/im between measured points (interpolate.ts) and never
 * extrapolated: a band reaching beyond the file is refused with the range named.
 */
import type { Complex, LumpedElement, MeasuredPart } from './types'
import { OPEN } from './complex'
import { RfInputError, describe } from './errors'
import { interpolateMatrices, rangeOf } from './interpolate'
import type { BlockLookup, BlockRange, TwoPortData } from './twoport'

/** Which fixture the maker measured the part in. */
export type FixtureKind = MeasuredPart['fixture']

/** An L or C element described by a measured file. */
export type MeasuredLumped = LumpedElement & { readonly measured: MeasuredPart }

/** True for an L or C element whose impedance comes from a fixture measurement. */
export function isMeasuredPart(element: { kind: string; measured?: unknown }): element is MeasuredLumped {
  return element.measured !== undefined && (element.kind === 'L' || element.kind === 'C')
}

/** Checks the `measured` field of an element; throws naming it. */
export function validateMeasuredPart(value: unknown, kind: string, path: string): MeasuredPart {
  if (kind !== 'L' && kind !== 'C') throw new RfInputError(path, `only an L or C part can be a measured part, not ${describe(kind)}`)
  const m = value as Record<string, unknown> | null
  if (m === null || typeof m !== 'object') throw new RfInputError(path, `must be { uploadId, fixture }, got ${describe(value)}`)
  if (typeof m.uploadId !== 'string' || m.uploadId === '') throw new RfInputError(`${path}.uploadId`, `must name the measured file, got ${describe(m.uploadId)}`)
  if (m.fixture !== 'series' && m.fixture !== 'shunt') throw new RfInputError(`${path}.fixture`, `must be "series" or "shunt", got ${describe(m.fixture)}`)
  return value as MeasuredPart
}

/**
 * The component's impedance (Ω) from one S21 of its fixture measurement at real reference z0
 * (formulas in the file comment). S21 = 0 in series-through, or S21 = 1 in shunt-through, is an
 * open (`OPEN`).
 */
export function fixtureImpedance(s21: Complex, z0: number, fixture: FixtureKind): Complex {
  const { re, im } = s21
  if (fixture === 'series') {
    // 2·Z0·(1 − S21)/S21
    const m = re * re + im * im
    if (m === 0) return OPEN
    const nr = 2 * z0 * (1 - re), ni = -2 * z0 * im
    return { re: (nr * re + ni * im) / m, im: (ni * re - nr * im) / m }
  }
  // Z0·S21/(2·(1 − S21))
  const dr = 2 * (1 - re), di = -2 * im
  const m = dr * dr + di * di
  if (m === 0) return OPEN
  const nr = z0 * re, ni = z0 * im
  return { re: (nr * dr + ni * di) / m, im: (ni * dr - nr * di) / m }
}

function fileOf(element: MeasuredLumped, blocks: BlockLookup | undefined, path: string): TwoPortData {
  const data = blocks?.[element.measured.uploadId]
  if (!data) throw new RfInputError(`${path}.measured`, `the part's measured file (upload ${element.measured.uploadId}) is not given`)
  if (data.s[0]?.length !== 2) throw new RfInputError(`${path}.measured`, 'a fixture measurement must be a two-port file (.s2p)')
  return data
}

/**
 * The measured part's impedance (Ω) at each frequency. Throws `RfInputError` naming the element
 * when a frequency lies outside the file (with `range: 'nearest'`, the nearest measured point is
 * used instead — only for a single-frequency view that says so).
 */
export function measuredPartImpedances(
  element: MeasuredLumped, blocks: BlockLookup | undefined, frequenciesHz: ArrayLike<number>,
  options: { path?: string; range?: BlockRange } = {},
): Complex[] {
  const path = options.path ?? 'element'
  const data = fileOf(element, blocks, path)
  const range = rangeOf(data.frequencies)
  const targets = Array.from(frequenciesHz, f => options.range === 'nearest' ? Math.min(range.fMaxHz, Math.max(range.fMinHz, f)) : f)
  const { values, outsideHz } = interpolateMatrices(data.frequencies, data.s, targets)
  if (outsideHz.length > 0) {
    throw new RfInputError(`${path}.measured`, `the part's measured file covers ${range.fMinHz}–${range.fMaxHz} Hz and ${outsideHz.length} frequencies lie outside it (first ${outsideHz[0]} Hz); it does not cover the board's band and is never extrapolated`)
  }
  return values.map(s => fixtureImpedance(s![1]![0]!, data.z0, element.measured.fixture))
}
