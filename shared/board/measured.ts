// Measured files on a board: the load's impedance from a .s1p's S11 across frequency, the band
// the board's measured data covers, and the band points that fall outside it (shown to the user,
// never extrapolated).
import {
  gammaOf, impedanceOf, interpolateComplex, isInRange, rangeOf,
  type BlockLookup, type Complex, type FrequencyRange, type TwoPortData,
} from '../rf'
import type { BoardElement, BoardSettings } from './schema'

/** Parsed measured files by upload id (one- and two-ports alike). */
export type MeasuredLookup = BlockLookup

/** The upload ids a board refers to: its measured terminals and its blocks. */
export function measuredUploadIds(settings: Pick<BoardSettings, 'load' | 'source'>, elements: readonly Pick<BoardElement, 'kind'>[]): string[] {
  const ids = new Set<string>()
  for (const t of [settings.load, settings.source]) if (t.kind === 'measured') ids.add(t.uploadId)
  for (const e of elements) if (e.kind === 'block') ids.add((e as { uploadId: string }).uploadId)
  return [...ids]
}

/**
 * The upload ids of the board's fixture-measured parts. They are fetched like the others but do
 * not narrow the band: a part's file that does not cover the band is refused, not worked around.
 */
export function measuredPartUploadIds(elements: readonly Pick<BoardElement, 'kind'>[]): string[] {
  const ids = new Set<string>()
  for (const e of elements) {
    const measured = (e as { measured?: { uploadId: string } }).measured
    if ((e.kind === 'L' || e.kind === 'C') && measured) ids.add(measured.uploadId)
  }
  return [...ids]
}

/**
 * The range every measured file of the board covers (the intersection), or null when the board
 * has none loaded. An empty intersection has fMinHz > fMaxHz.
 */
export function measuredCoverage(ids: readonly string[], files: MeasuredLookup): FrequencyRange | null {
  let range: FrequencyRange | null = null
  for (const id of ids) {
    const data = files[id]
    if (!data) continue
    const r = rangeOf(data.frequencies)
    range = range ? { fMinHz: Math.max(range.fMinHz, r.fMinHz), fMaxHz: Math.min(range.fMaxHz, r.fMaxHz) } : r
  }
  return range
}

/** Splits band frequencies into those inside the measured range and those outside it. */
export function splitByCoverage(frequenciesHz: readonly number[], range: FrequencyRange | null): { insideHz: number[], outsideHz: number[] } {
  if (!range) return { insideHz: frequenciesHz.slice(), outsideHz: [] }
  const insideHz: number[] = []
  const outsideHz: number[] = []
  for (const f of frequenciesHz) (isInRange(range, f) ? insideHz : outsideHz).push(f)
  return { insideHz, outsideHz }
}

/** Z (Ω) of a one-port from its S11, Z = Z_ref (1 + S11)/(1 − S11) at the file's own reference. */
function impedanceFromS11(s11: Complex, referenceOhms: number): Complex {
  return impedanceOf(s11, referenceOhms)
}

/**
 * The measured one-port's impedance (Ω) at each frequency, S11 interpolated linearly in re/im;
 * null (and listed in outsideHz) outside the file's range.
 */
export function measuredImpedances(data: TwoPortData, frequenciesHz: readonly number[]): { impedances: (Complex | null)[], outsideHz: number[] } {
  const s11 = data.s.map(m => m[0]![0]!)
  const { values, outsideHz } = interpolateComplex(data.frequencies, s11, frequenciesHz)
  return { impedances: values.map(g => (g ? impedanceFromS11(g, data.z0) : null)), outsideHz }
}

/**
 * The impedance at one frequency, taking the nearest measured point outside the file's range
 * (the board flags a design frequency there). Without the data yet, the board's z0.
 */
export function measuredImpedanceAt(data: TwoPortData | undefined, frequencyHz: number, z0: number): Complex {
  if (!data) return { re: z0, im: 0 }
  const r = rangeOf(data.frequencies)
  const f = Math.min(r.fMaxHz, Math.max(r.fMinHz, frequencyHz))
  return measuredImpedances(data, [f]).impedances[0]!
}

/** The measured points themselves as impedances (Ω), for the chart's dotted trace. */
export function measuredPoints(data: TwoPortData): { frequenciesHz: readonly number[], impedances: Complex[] } {
  return { frequenciesHz: data.frequencies, impedances: data.s.map(m => impedanceFromS11(m[0]![0]!, data.z0)) }
}

/** The measured load's points as Γ against the chart's z0, or [] when the load is not measured or not loaded. */
export function measuredLoadGammas(load: BoardSettings['load'], files: MeasuredLookup, z0: number): Complex[] {
  if (load.kind !== 'measured') return []
  const data = files[load.uploadId]
  return data ? measuredPoints(data).impedances.map(z => gammaOf(z, z0)) : []
}
