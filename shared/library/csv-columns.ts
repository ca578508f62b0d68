// The stock-list CSV columns (import and export share them). A header row names the columns, in
// any order; only part_id, kind and value are required. Values take engineering notation
// (3.3n, 1.2p, 2.45G) or plain SI numbers.
//   part_id      our own identifier (letters, digits, . - _)
//   kind         L or C
//   value        nominal value in H or F (e.g. 3.3n, 1.2p)
//   tolerance_pct  ± tolerance in percent (5 = ±5 %)
//   v_rating_v   voltage rating (V RMS); i_rating_a  current rating (A RMS)
//   q            constant Q (where there is no Q table)
//   q_table      Q by frequency, "Hz:Q" pairs separated by ";" in rising frequency (100M:30;1G:60)
//   srf_hz       inductor self-resonance (Hz); esl_h  capacitor series inductance (H)
//   pad_c_f      pad capacitance to ground at each end (F)
//   stocked      yes/no (also true/false, 1/0)
//   description  free text, up to 200 characters
// A part's fixture measurement is attached in the app, not through the CSV.
export const PART_CSV_COLUMNS = [
  'part_id', 'kind', 'value', 'tolerance_pct', 'v_rating_v', 'i_rating_a', 'q', 'q_table',
  'srf_hz', 'esl_h', 'pad_c_f', 'stocked', 'description',
] as const
export type PartCsvColumn = typeof PART_CSV_COLUMNS[number]
export const REQUIRED_PART_CSV_COLUMNS: readonly PartCsvColumn[] = ['part_id', 'kind', 'value']

/** Which column a field of the part (a zod issue path) came from. */
export function columnOfPath(path: readonly PropertyKey[]): PartCsvColumn {
  const [head, sub] = path.map(String)
  switch (head) {
    case 'partId': return 'part_id'
    case 'tolerance': return 'tolerance_pct'
    case 'vRatingV': return 'v_rating_v'
    case 'iRatingA': return 'i_rating_a'
    case 'model': return sub === 'q' ? 'q_table' : sub === 'srf' ? 'srf_hz' : sub === 'esl' ? 'esl_h' : 'pad_c_f'
    default: return (PART_CSV_COLUMNS as readonly string[]).includes(head!) ? head as PartCsvColumn : 'part_id'
  }
}
