// The one reader of typed numbers on the board. Each field knows its quantity and the unit it
// shows: a unit of another quantity is refused with a message naming both, a bare number is read
// in the field's unit, and a value outside the usual RF range is kept with a warning.
import { formatEng, readEng, wattsFromDbm, UNIT_QUANTITY, type Quantity } from '../rf'

export class ValueEntryError extends Error {
  override name = 'ValueEntryError'
}

/** How one field reads typed text. */
export interface EntryField {
  /** The field's name in messages: "Design frequency", "Z0", "Q". */
  what: string
  quantity: Quantity
  /** The unit the field shows and reads a bare number in ("MHz", "nH", "pF", "Ω", "dBm", "°"). */
  unit: string
  /** [low, high] in SI units: outside it the value is kept with a warning. */
  usual?: readonly [number, number]
}

/** A typed value in SI units (power in W), with a warning when it is implausible. */
export interface EntryReading {
  value: number
  warning?: string
}

const QUANTITY_WORDS: Record<Quantity, string> = {
  frequency: 'a frequency', inductance: 'an inductance', capacitance: 'a capacitance',
  resistance: 'a resistance or impedance', conductance: 'a conductance', power: 'a power',
  voltage: 'a voltage', current: 'a current', level: 'a level in dB', angle: 'an angle',
  percent: 'a percentage', ratio: 'a ratio', number: 'a plain number',
}

/** The base unit each quantity is shown in (formatEng's unit). */
const BASE_UNIT: Record<Quantity, string> = {
  frequency: 'Hz', inductance: 'H', capacitance: 'F', resistance: 'Ω', conductance: 'S', power: 'W',
  voltage: 'V', current: 'A', level: 'dB', angle: '°', percent: '%', ratio: ':1', number: '',
}

/**
 * Usual ranges for RF work, where a value outside means a slip of the unit more often than a
 * design: frequencies from 1 kHz to 1 THz; parts over the E-series span the match search covers
 * (0.1 nH–10 µH, 0.1 pF–1 µF); a reference impedance from 1 Ω to 1 kΩ.
 */
export const USUAL_FREQUENCY_HZ = [1e3, 1e12] as const
export const USUAL_INDUCTANCE_H = [1e-10, 1e-5] as const
export const USUAL_CAPACITANCE_F = [1e-13, 1e-6] as const
export const USUAL_Z0_OHM = [1, 1e3] as const

/** The field reading of a part value or a frequency, with its usual range. */
export const FREQUENCY_FIELD = (what: string): EntryField => ({ what, quantity: 'frequency', unit: 'MHz', usual: USUAL_FREQUENCY_HZ })
export const INDUCTANCE_FIELD = (what: string): EntryField => ({ what, quantity: 'inductance', unit: 'nH', usual: USUAL_INDUCTANCE_H })
export const CAPACITANCE_FIELD = (what: string): EntryField => ({ what, quantity: 'capacitance', unit: 'pF', usual: USUAL_CAPACITANCE_F })
export const RESISTANCE_FIELD = (what: string, usual?: readonly [number, number]): EntryField => ({ what, quantity: 'resistance', unit: 'Ω', usual })

/** "in MHz" — what a field's placeholder says about bare numbers. */
export function placeholderOf(field: EntryField): string {
  return field.unit ? `number in ${field.unit}` : 'number'
}

function scaleOf(unit: string): number {
  if (unit === '' || unit === 'dBm') return 1
  return readEng(`1 ${unit}`).value
}

function formatSi(value: number, field: EntryField): string {
  const base = BASE_UNIT[field.quantity]
  return base === '°' || base === '%' || base === ':1' || base === 'dB' ? `${value}${base === ':1' ? ':1' : ` ${base}`}` : formatEng(value, base)
}

/**
 * Reads `text` for `field`: "915" → 915 MHz in a frequency field, "5 pF" refused in an inductance
 * field, "3 W" or "27 dBm" in a power field (dBm converted to W: P = 1 mW · 10^(dBm/10)).
 * Throws ValueEntryError with a message for the person typing.
 */
export function readEntry(text: string, field: EntryField): EntryReading {
  const trimmed = text.trim().replace(/^±\s*/, '')
  if (!trimmed) throw new ValueEntryError(`Type a value for ${field.what}${field.unit ? ` (${field.unit})` : ''}`)
  let reading
  try {
    reading = readEng(trimmed)
  }
  catch (error) {
    throw new ValueEntryError(`${field.what}: ${error instanceof Error ? error.message : 'not a number'}`)
  }
  const typed = reading.unit ? UNIT_QUANTITY[reading.unit]! : null
  if (typed !== null && typed !== field.quantity) {
    throw new ValueEntryError(`${field.what} takes ${QUANTITY_WORDS[field.quantity]}${field.unit ? ` (${field.unit})` : ''}, but “${trimmed}” is ${QUANTITY_WORDS[typed]}`)
  }
  let value = reading.value
  // A bare number is in the unit the field shows; a prefix alone ("12n") goes with the base unit.
  if (!reading.unit && !reading.hasPrefix) value *= scaleOf(field.unit)
  const isDbm = reading.unit === 'dBm' || (!reading.unit && !reading.hasPrefix && field.unit === 'dBm')
  if (isDbm) value = wattsFromDbm(value)
  if (!Number.isFinite(value)) throw new ValueEntryError(`${field.what}: “${trimmed}” is not a finite number`)
  const usual = field.usual
  if (usual && value !== 0 && (Math.abs(value) < usual[0] || Math.abs(value) > usual[1])) {
    const side = Math.abs(value) < usual[0] ? 'below' : 'above'
    return {
      value,
      warning: `${field.what} ${formatSi(value, field)} is ${side} the usual ${formatSi(usual[0], field)}–${formatSi(usual[1], field)}: kept, but check the unit`,
    }
  }
  return { value }
}

/** What a field's submit answers: null when taken, a refusal message, or taken with a warning. */
export type EntryReply = string | null | { warning: string }

/** The reply for a change that was made (`refusal` null) with an optional warning. */
export function replyOf(refusal: string | null, warning?: string): EntryReply {
  if (refusal) return refusal
  return warning ? { warning } : null
}
