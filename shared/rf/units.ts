/**
 * Engineering notation for part values and frequencies: "4.7 pF", "12 nH", "2.45 GHz".
 * SI prefixes f p n µ m k M G (BIPM, The International System of Units, prefixes table).
 */
import { RfInputError } from './errors'

const PREFIXES: readonly [string, number][] = [
  ['f', -15], ['p', -12], ['n', -9], ['µ', -6], ['m', -3], ['', 0], ['k', 3], ['M', 6], ['G', 9],
]
const PREFIX_EXPONENT: Record<string, number> = {
  f: -15, p: -12, n: -9, u: -6, 'µ': -6, 'μ': -6, m: -3, k: 3, M: 6, G: 9, T: 12,
}
const UNITS = ['Hz', 'F', 'H', 'Ω', 'ohms', 'ohm', 'S']

/**
 * `value` in engineering notation with `digits` significant figures (default 3, trailing zeros
 * dropped) and an SI prefix from f to G: formatEng(4.7e-12, 'F') → "4.7 pF",
 * formatEng(2.45e9, 'Hz') → "2.45 GHz", formatEng(50, 'Ω') → "50 Ω". Values beyond the prefix
 * range keep the end prefix ("0.001 fF", "5000 GHz"); ±Infinity is "∞ Ω" / "-∞ Ω" (an open).
 * The micro sign is U+00B5 "µ". Throws for NaN.
 */
export function formatEng(value: number, unit: string, digits = 3): string {
  if (typeof value !== 'number' || Number.isNaN(value)) throw new RfInputError('value', 'is not a number (NaN)')
  if (!Number.isInteger(digits) || digits < 1 || digits > 15) throw new RfInputError('digits', `must be an integer from 1 to 15, got ${digits}`)
  const join = (text: string, prefix: string) => `${text} ${prefix}${unit}`.trim()
  if (!Number.isFinite(value)) return join(value > 0 ? '∞' : '-∞', '')
  if (value === 0) return join('0', '')
  let index = PREFIXES.findIndex(([, e]) => e === Math.floor(Math.log10(Math.abs(value)) / 3) * 3)
  if (index < 0) index = Math.abs(value) < 1 ? 0 : PREFIXES.length - 1
  let mantissa = Number((value / 10 ** PREFIXES[index]![1]).toPrecision(digits))
  if (Math.abs(mantissa) >= 1000 && index < PREFIXES.length - 1) {
    index += 1 // 999.96 rounds to 1000: show 1 k instead
    mantissa = Number((value / 10 ** PREFIXES[index]![1]).toPrecision(digits))
  }
  return join(String(mantissa), PREFIXES[index]![0])
}

const NUMBER = /^([+\-−]?)(\d+(?:\.\d*)?|\.\d+)(?:[eE]([+-]?\d+))?/

/** What a unit symbol measures; the entry fields refuse a unit of another quantity. */
export type Quantity = 'frequency' | 'inductance' | 'capacitance' | 'resistance' | 'conductance'
  | 'power' | 'voltage' | 'current' | 'level' | 'angle' | 'percent' | 'ratio' | 'number'

/** Canonical unit symbol → the quantity it measures ("dBm" is a power on a log scale). */
export const UNIT_QUANTITY: Readonly<Record<string, Quantity>> = {
  'Hz': 'frequency', 'H': 'inductance', 'F': 'capacitance', 'Ω': 'resistance', 'S': 'conductance',
  'W': 'power', 'dBm': 'power', 'V': 'voltage', 'A': 'current', 'dB': 'level', '°': 'angle',
  '%': 'percent', ':1': 'ratio',
}
// Spellings people type for a unit (matched whole, after the number and any prefix).
const UNIT_SPELLINGS: readonly [RegExp, string][] = [
  [/^hz$/i, 'Hz'], [/^H$/, 'H'], [/^F$/, 'F'], [/^(Ω|Ω|ohms?)$/i, 'Ω'], [/^S$/, 'S'], [/^W$/, 'W'],
  [/^dBm$/i, 'dBm'], [/^V$/, 'V'], [/^A$/, 'A'], [/^dB$/i, 'dB'], [/^(°|deg|degrees?)$/i, '°'],
  [/^%$/, '%'], [/^(:\s*1|x)$/i, ':1'],
]
const unitOfSpelling = (text: string) => UNIT_SPELLINGS.find(([re]) => re.test(text))?.[1]
// Units that take no SI prefix ("k%" or "mdB" mean nothing).
const NO_PREFIX = new Set(['dBm', 'dB', '°', '%', ':1'])

/** A number read from engineering notation, with the unit it was written in. */
export interface EngReading {
  /** The value with the SI prefix applied (in the unit's base: "915 MHz" → 915e6). */
  value: number
  /** The canonical unit symbol typed ("Hz", "Ω", "dBm"…), or "" when none was typed. */
  unit: string
  /** Whether an SI prefix was typed ("12n", "2.45 GHz"). */
  hasPrefix: boolean
}

/**
 * Reads engineering notation with its unit: "4.7 pF" → { value 4.7e-12, unit "F", hasPrefix },
 * "915" → { value 915, unit "", hasPrefix false }. Prefixes f p n u/µ m k M G are case-sensitive
 * (m milli, M mega); units Hz F H Ω (ohm) S W dBm V A dB ° (deg) % and ":1" may follow. Throws an
 * Error whose message says what is wrong for empty text, a missing number, an unknown prefix or
 * unit, digits after the prefix ("1k5": write 1.5k) or a value too large.
 */
export function readEng(text: string): EngReading {
  if (typeof text !== 'string') throw new Error('expected text such as 4.7p, 12n or 2.45G')
  const t = text.trim()
  if (t === '') throw new Error('the value is empty: type a number such as 4.7p, 12n or 2.45G')
  const m = NUMBER.exec(t)
  if (!m) throw new Error(`"${t}" does not start with a number: expected e.g. 4.7p, 12n, 2.45G or 1e-12`)
  const sign = m[1] === '' || m[1] === '+' ? '' : '-'
  let rest = t.slice(m[0].length).trim()
  let exponent = m[3] === undefined ? 0 : Number(m[3])
  let unit = rest === '' ? '' : unitOfSpelling(rest)
  let hasPrefix = false
  if (unit === undefined) {
    const first = rest.charAt(0)
    if (!(first in PREFIX_EXPONENT)) {
      throw new Error(`"${t}": unknown prefix or unit "${rest}" (prefixes: f p n µ m k M G T; units: Hz F H Ω S W dBm V A dB °)`)
    }
    exponent += PREFIX_EXPONENT[first]!
    hasPrefix = true
    rest = rest.slice(1).trim()
    if (/^\d/.test(rest)) throw new Error(`"${t}": digits after the prefix "${first}" — write e.g. 1.5k rather than 1k5`)
    unit = rest === '' ? '' : unitOfSpelling(rest)
    if (unit === undefined || NO_PREFIX.has(unit)) {
      throw new Error(`"${t}": unknown unit "${rest}" after the prefix "${first}" (units: Hz F H Ω S W V A)`)
    }
  }
  const value = Number(`${sign}${m[2]}e${exponent}`)
  if (!Number.isFinite(value)) throw new Error(`"${t}" is too large to be a number`)
  return { value, unit, hasPrefix }
}

/**
 * Reads engineering notation: "4.7p" → 4.7e-12, "12n", "2.45G", "50", "4.7 pF", "1e-12",
 * "2.2u" or "2.2µ" → 2.2e-6, "10 kΩ", "915 MHz" (the number of readEng; the unit is not checked).
 */
export function parseEng(text: string): number {
  return readEng(text).value
}
