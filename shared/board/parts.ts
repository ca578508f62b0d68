// The parts list: each element's exact value and its nearest standard value, and the CSV of it.
import { stringify } from 'csv-stringify/browser/esm/sync'
import { formatEng, nearestStandard } from '../rf'
import type { BoardElement, SnapSeries } from './schema'
import { elementLabel, fieldValueOf, formatField, mainFieldOf, unitOf } from './element-values'

export interface PartRow {
  id: string
  position: number
  label: string
  kind: BoardElement['kind']
  /** The exact value in SI units (H, F, Ω), or the length (°) or ratio for other kinds. */
  exactValue: number
  exactText: string
  /** The nearest value of the series for L, C and R; null for lines, stubs and transformers. */
  standardValue: number | null
  standardText: string
  /** (standard − exact)/exact; null where there is no standard value. */
  snapError: number | null
  q: number | null
  tolerance: number | null
  detail: string
}

export function partRows(elements: readonly BoardElement[], series: Exclude<SnapSeries, 'none'>): PartRow[] {
  return elements.map((e, i) => {
    const field = mainFieldOf(e.kind)
    const exactValue = fieldValueOf(e, field) ?? 0
    const isLumped = e.kind === 'L' || e.kind === 'C' || e.kind === 'R'
    const standardValue = isLumped ? nearestStandard(exactValue, series) : null
    return {
      id: e.id,
      position: i + 1,
      label: elementLabel(e),
      kind: e.kind,
      exactValue,
      exactText: formatField(e, field),
      standardValue,
      standardText: standardValue === null ? '—' : formatEng(standardValue, unitOf(e.kind, field)),
      snapError: standardValue === null ? null : (standardValue - exactValue) / exactValue,
      q: isLumped && e.q !== undefined ? e.q : null,
      tolerance: isLumped && e.tolerance !== undefined ? e.tolerance : null,
      detail: e.kind === 'line' || e.kind === 'stub' ? `Z₀ ${formatField(e, 'z0')}` : '',
    }
  })
}

/** The parts list as CSV text (a header row, then one row per element from the load side). */
export function partsCsv(rows: readonly PartRow[], series: string): string {
  return stringify(rows.map(r => ({
    position: r.position,
    element: r.label,
    exact: r.exactText,
    exact_si: r.exactValue,
    [`nearest_${series}`]: r.standardText,
    [`nearest_${series}_si`]: r.standardValue ?? '',
    q: r.q ?? '',
    tolerance: r.tolerance ?? '',
    detail: r.detail,
  })), { header: true })
}
