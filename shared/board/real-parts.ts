// Real-part fields of the board: typed entry of source power, Q, tolerance and ratings, their
// display, and a plain copy of analysis input for a worker. Pure; no Vue.
import { dbmFromWatts, formatEng } from '../rf'
import { entryFieldOf } from './element-values'
import { ValueEntryError, readEntry, type EntryField } from './quantity-entry'
import type { BoardElement } from './schema'

export type PowerUnit = 'W' | 'dBm'

/** Source power used when a board sets none: 100 mW (20 dBm), a common small-radio level. */
export const DEFAULT_SOURCE_POWER_W = 0.1

/** Source power (W) from text: "0.5", "500m", "500 mW", "3 W", "27 dBm"; a bare number is in `unit`. */
export function parsePowerW(text: string, unit: PowerUnit): number {
  const watts = readEntry(text, { what: 'Source power', quantity: 'power', unit }).value
  if (!(watts > 0)) throw new ValueEntryError('The source power must be greater than zero')
  if (watts > 1e6) throw new ValueEntryError('A source power above 1 MW is not plausible here')
  return watts
}

/** The power as text in `unit` ("100 mW" or "20 dBm"). */
export function formatPower(watts: number, unit: PowerUnit): string {
  return unit === 'dBm' ? `${Number(dbmFromWatts(watts).toFixed(2))} dBm` : formatEng(watts, 'W')
}

/** An optional positive number from text ("" or "—" clears it). */
function parseOptional(text: string, field: EntryField): number | undefined {
  if (text.trim() === '' || text.trim() === '—') return undefined
  const value = readEntry(text, field).value
  if (!(value > 0)) throw new ValueEntryError(`${field.what} must be greater than zero`)
  return value
}

/** A rating from text: "50", "50 V", "300m", "0.3 A"; a bare number is in V or A; empty clears it. */
export function parseRating(text: string, unit: 'V' | 'A'): number | undefined {
  return parseOptional(text, unit === 'V'
    ? { what: 'A voltage rating', quantity: 'voltage', unit: 'V' }
    : { what: 'A current rating', quantity: 'current', unit: 'A' })
}

/** A Q from text: "40"; empty clears it (the board's default Q then applies). */
export function parseQ(text: string): number | undefined {
  const q = parseOptional(text, { what: 'Q', quantity: 'number', unit: '' })
  if (q !== undefined && q > 1e5) throw new ValueEntryError('A Q above 100000 is not plausible')
  return q
}

/**
 * A tolerance from text: "5", "5%" or "±5 %" → { tolerance: 0.05 } (a bare number is a
 * percentage); "0.1p", "±0.1 pF", "2n" → an absolute { toleranceAbs } in the part's own quantity;
 * empty clears both. One form replaces the other.
 */
export function parseTolerance(text: string, kind: BoardElement['kind']): { tolerance?: number, toleranceAbs?: number } {
  const t = text.trim()
  if (t === '' || t === '—') return { tolerance: undefined, toleranceAbs: undefined }
  if (kind !== 'L' && kind !== 'C' && kind !== 'R') throw new ValueEntryError('Only inductors, capacitors and resistors take a tolerance')
  const part = entryFieldOf(kind, 'value')
  const isPercent = /%$/.test(t) || /^±?\s*[\d.]+(e[+-]?\d+)?$/i.test(t)
  if (isPercent) {
    const percent = readEntry(t, { what: 'Tolerance', quantity: 'percent', unit: '%' }).value
    if (!(percent >= 0 && percent < 100)) throw new ValueEntryError('A tolerance must be from 0 % to below 100 %')
    return { tolerance: percent / 100, toleranceAbs: undefined }
  }
  const value = readEntry(t, { ...part, what: 'Tolerance', usual: undefined }).value
  if (!(value > 0)) throw new ValueEntryError('An absolute tolerance must be greater than zero')
  return { tolerance: undefined, toleranceAbs: value }
}

/** The tolerance as typed back: "±5 %", "±0.1 pF", or "" for none. */
export function formatTolerance(element: BoardElement): string {
  if (element.kind !== 'L' && element.kind !== 'C' && element.kind !== 'R') return ''
  if (element.toleranceAbs !== undefined) return `±${formatEng(element.toleranceAbs, element.kind === 'L' ? 'H' : element.kind === 'C' ? 'F' : 'Ω')}`
  if (element.tolerance !== undefined) return `±${Number((element.tolerance * 100).toPrecision(3))} %`
  return ''
}

/**
 * A deep copy made of plain arrays and objects only (reactive proxies read through), so the
 * result can be posted to a worker. Numbers keep ±Infinity (unlike a JSON round trip).
 */
export function plainCopy<T>(value: T): T {
  if (Array.isArray(value)) return value.map(v => plainCopy(v)) as T
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {}
    for (const [k, v] of Object.entries(value)) if (v !== undefined) out[k] = plainCopy(v)
    return out as T
  }
  return value
}
