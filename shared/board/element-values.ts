// The one editable figure of each element kind (a part value, a length, a ratio), how it is shown
// in engineering notation and how typed text becomes a value. Typed text is refused with a message
// that says what is wrong; nothing here touches a document.
import { formatEng } from '../rf'
import {
  CAPACITANCE_FIELD, INDUCTANCE_FIELD, RESISTANCE_FIELD, USUAL_Z0_OHM, ValueEntryError, readEntry,
  type EntryField, type EntryReading,
} from './quantity-entry'
import type { BoardElement, ElementJson, ElementKind } from './schema'

/** The field a tile edits and a chart drag changes. */
export type EditField = 'value' | 'deg' | 'ratio' | 'z0' | 'q'

export function mainFieldOf(kind: ElementKind): Exclude<EditField, 'z0' | 'q'> {
  if (kind === 'line' || kind === 'stub') return 'deg'
  if (kind === 'xfmr') return 'ratio'
  return 'value'
}

const UNIT_OF_KIND: Record<'L' | 'C' | 'R', string> = { L: 'H', C: 'F', R: 'Ω' }

/** The unit symbol of a field of an element kind. */
export function unitOf(kind: ElementKind, field: EditField): string {
  if (field === 'z0') return 'Ω'
  if (field === 'q') return ''
  if (field === 'deg') return '°'
  if (field === 'ratio') return ':1'
  return UNIT_OF_KIND[kind as 'L' | 'C' | 'R']
}

export function fieldValueOf(element: ElementJson, field: EditField): number | undefined {
  const value = (element as Record<string, unknown>)[field]
  return typeof value === 'number' ? value : undefined
}

/** A copy of the element with `field` set; fields that the kind lacks are ignored. */
export function withFieldValue<E extends ElementJson>(element: E, field: EditField, value: number): E {
  if (!(field in element)) return element
  return { ...element, [field]: value }
}

function significant(value: number, digits = 4): string {
  return String(Number(value.toPrecision(digits)))
}

/** The field's value as shown on a tile: "4.7 nH", "30°", "2:1", "50 Ω". */
export function formatField(element: ElementJson, field: EditField): string {
  const value = fieldValueOf(element, field)
  if (value === undefined) return ''
  if (field === 'deg') return `${significant(value)}°`
  if (field === 'ratio') return `${significant(value)}:1`
  if (field === 'q') return significant(value)
  return formatEng(value, unitOf(element.kind, field))
}

export { ValueEntryError }

/** The entry field of `field` on a `kind` element: L in nH, C in pF, R and Z0 in Ω, lengths in °. */
export function entryFieldOf(kind: ElementKind, field: EditField): EntryField {
  if (field === 'z0') return RESISTANCE_FIELD('Line Z0', USUAL_Z0_OHM)
  if (field === 'deg') return { what: 'Electrical length', quantity: 'angle', unit: '°' }
  if (field === 'ratio') return { what: 'Turns ratio', quantity: 'ratio', unit: ':1' }
  if (field === 'q') return { what: 'Q', quantity: 'number', unit: '' }
  if (kind === 'L') return INDUCTANCE_FIELD('Inductance')
  if (kind === 'C') return CAPACITANCE_FIELD('Capacitance')
  return RESISTANCE_FIELD('Resistance')
}

/**
 * The number typed for `field` of a `kind` element ("4.7p", "12n", "1k", "2.2 nH", "45°").
 * Throws ValueEntryError with a message for the person typing.
 */
export function parseFieldValue(kind: ElementKind, field: EditField, text: string): number {
  return readFieldValue(kind, field, text).value
}

/** parseFieldValue with the warning of an implausible value. */
export function readFieldValue(kind: ElementKind, field: EditField, text: string): EntryReading {
  const reading = readEntry(text, entryFieldOf(kind, field))
  const value = reading.value
  if (field === 'deg') {
    if (value < 0) throw new ValueEntryError('A length cannot be negative')
    if (value > 36000) throw new ValueEntryError('A length above 36000° is not plausible')
  }
  else if (value <= 0) {
    const what = { ratio: 'A turns ratio', z0: 'A line impedance', q: 'Q', value: 'A part value' }[field]
    throw new ValueEntryError(`${what} must be greater than zero`)
  }
  return reading
}

/** A short name of the element for tiles and tables: "series L", "shunt open stub", "line". */
export function elementLabel(element: Pick<BoardElement, 'kind'> & { placement?: string, end?: string, name?: string }): string {
  switch (element.kind) {
    case 'block': return `measured ${element.name || 'block'}`
    case 'line': return 'line'
    case 'xfmr': return 'transformer'
    case 'stub': return `${element.placement} ${element.end} stub`
    default: return `${element.placement} ${element.kind}`
  }
}
