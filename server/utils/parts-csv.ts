// The stock list as CSV (columns in shared/library/csv-columns.ts): csv-parse reads it, each row is
// checked by the library's one part schema, and the first bad row refuses the whole file with its
// row (the file's line, the header being line 1) and column; csv-stringify writes it back.
import { parse } from 'csv-parse/sync'
import { stringify } from 'csv-stringify/sync'
import { formatEng, parseEng } from '../../shared/rf'
import { PART_CSV_COLUMNS, REQUIRED_PART_CSV_COLUMNS, columnOfPath, type PartCsvColumn } from '../../shared/library/csv-columns'
import { PartInputSchema, type LibraryPart } from '../../shared/library/part'

export class PartCsvError extends Error {
  constructor(readonly row: number, readonly column: string | null, problem: string) {
    super(column ? `row ${row}, column ${column}: ${problem}` : `row ${row}: ${problem}`)
  }
}

const YES = new Set(['yes', 'y', 'true', '1'])
const NO = new Set(['no', 'n', 'false', '0', ''])

function numberIn(text: string, row: number, column: PartCsvColumn): number | undefined {
  if (text.trim() === '') return undefined
  try {
    return parseEng(text)
  }
  catch (error) {
    throw new PartCsvError(row, column, (error as Error).message)
  }
}

function qTableIn(text: string, row: number): [number, number][] | undefined {
  if (text.trim() === '') return undefined
  return text.split(';').map((pair) => {
    const [hz, q, extra] = pair.split(':')
    if (hz === undefined || q === undefined || extra !== undefined) throw new PartCsvError(row, 'q_table', `"${pair.trim()}" is not a Hz:Q pair (e.g. 1G:60)`)
    return [numberIn(hz, row, 'q_table')!, numberIn(q, row, 'q_table')!] as [number, number]
  })
}

/** One CSV record (by column name) as part input; throws PartCsvError naming the column. */
function partOf(record: Record<string, string>, row: number): LibraryPart {
  const get = (c: PartCsvColumn) => record[c] ?? ''
  const stockedText = get('stocked').trim().toLowerCase()
  if (!YES.has(stockedText) && !NO.has(stockedText)) throw new PartCsvError(row, 'stocked', `"${get('stocked')}" is not yes or no`)
  const tolerancePct = numberIn(get('tolerance_pct'), row, 'tolerance_pct')
  const model = {
    q: qTableIn(get('q_table'), row),
    srf: numberIn(get('srf_hz'), row, 'srf_hz'),
    esl: numberIn(get('esl_h'), row, 'esl_h'),
    padC: numberIn(get('pad_c_f'), row, 'pad_c_f'),
  }
  const hasModel = Object.values(model).some(v => v !== undefined)
  const input = {
    partId: get('part_id').trim(),
    kind: get('kind').trim().toUpperCase(),
    value: numberIn(get('value'), row, 'value'),
    tolerance: tolerancePct === undefined ? undefined : tolerancePct / 100,
    vRatingV: numberIn(get('v_rating_v'), row, 'v_rating_v'),
    iRatingA: numberIn(get('i_rating_a'), row, 'i_rating_a'),
    q: numberIn(get('q'), row, 'q'),
    model: hasModel ? Object.fromEntries(Object.entries(model).filter(([, v]) => v !== undefined)) : undefined,
    stocked: YES.has(stockedText),
    description: get('description').trim() || undefined,
  }
  const parsed = PartInputSchema.safeParse(Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)))
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    throw new PartCsvError(row, columnOfPath(issue.path), issue.message)
  }
  return parsed.data
}

/** Every part of a stock-list CSV, or a PartCsvError for the first bad row (nothing is kept). */
export function parsePartsCsv(text: string): LibraryPart[] {
  let rows: string[][]
  try {
    rows = parse(text, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: false }) as string[][]
  }
  catch (error) {
    const e = error as { lines?: number, message: string }
    throw new PartCsvError(e.lines ?? 1, null, e.message)
  }
  if (rows.length === 0) throw new PartCsvError(1, null, 'the file is empty: expected a header row naming the columns')
  const header = rows[0]!.map(h => h.trim().toLowerCase())
  header.forEach((h) => {
    if (!(PART_CSV_COLUMNS as readonly string[]).includes(h)) throw new PartCsvError(1, h, `is not a stock-list column (${PART_CSV_COLUMNS.join(', ')})`)
  })
  for (const c of REQUIRED_PART_CSV_COLUMNS) if (!header.includes(c)) throw new PartCsvError(1, c, 'is required in the header row')
  const seen = new Map<string, number>()
  return rows.slice(1).map((cells, i) => {
    const row = i + 2
    const part = partOf(Object.fromEntries(header.map((h, k) => [h, cells[k] ?? ''])), row)
    const earlier = seen.get(part.partId)
    if (earlier !== undefined) throw new PartCsvError(row, 'part_id', `"${part.partId}" already appears on row ${earlier}`)
    seen.set(part.partId, row)
    return part
  })
}

const eng = (v: number | undefined, unit = '') => v === undefined ? '' : formatEng(v, unit, 9).replace(/\s+/g, '')

/** The parts as a stock-list CSV with every column (round-trips through parsePartsCsv). */
export function partsToCsv(parts: readonly LibraryPart[]): string {
  return stringify(parts.map(p => ({
    part_id: p.partId,
    kind: p.kind,
    value: eng(p.value),
    tolerance_pct: p.tolerance === undefined ? '' : String(Number((p.tolerance * 100).toPrecision(6))),
    v_rating_v: p.vRatingV ?? '',
    i_rating_a: p.iRatingA ?? '',
    q: p.q ?? '',
    q_table: p.model?.q?.map(([hz, q]) => `${eng(hz)}:${q}`).join(';') ?? '',
    srf_hz: eng(p.model?.srf),
    esl_h: eng(p.model?.esl),
    pad_c_f: eng(p.model?.padC),
    stocked: p.stocked ? 'yes' : 'no',
    description: p.description ?? '',
  })), { header: true, columns: [...PART_CSV_COLUMNS] })
}
