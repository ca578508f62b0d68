// Typed entries for terminals and board settings: text in engineering notation becomes a new
// terminal or a settings patch, or a ValueEntryError that says what is wrong.
import type { BoardSettings, Terminal } from './schema'
import {
  CAPACITANCE_FIELD, FREQUENCY_FIELD, INDUCTANCE_FIELD, RESISTANCE_FIELD, USUAL_Z0_OHM, ValueEntryError, readEntry,
  type EntryField, type EntryReading,
} from './quantity-entry'

export type TerminalField = 'r' | 'x' | 'l' | 'c'

/**
 * The terminal with one field replaced by typed text. For a fixed impedance `r` and `x` are its
 * real and imaginary parts; for an R-L-C model `r`, `l`, `c` are its parts and an empty text
 * removes that part.
 */
export function terminalWithField(terminal: Terminal, field: TerminalField, text: string): Terminal {
  return terminalEntry(terminal, field, text).terminal
}

/** The entry field of a terminal value: R and X in Ω, L in nH, C in pF. */
export function terminalFieldOf(field: TerminalField): EntryField {
  if (field === 'l') return INDUCTANCE_FIELD('L')
  if (field === 'c') return CAPACITANCE_FIELD('C')
  return RESISTANCE_FIELD(field.toUpperCase())
}

/** terminalWithField with the warning of an implausible value. */
export function terminalEntry(terminal: Terminal, field: TerminalField, text: string): { terminal: Terminal, warning?: string } {
  if (terminal.kind === 'impedance') {
    if (field !== 'r' && field !== 'x') throw new ValueEntryError('A fixed impedance has only R and X')
    const { value, warning } = readEntry(text, terminalFieldOf(field))
    if (field === 'r' && value < 0) throw new ValueEntryError('R cannot be negative (a passive terminal)')
    return { terminal: { kind: 'impedance', z: field === 'r' ? { re: value, im: terminal.z.im } : { re: terminal.z.re, im: value } }, warning }
  }
  if (terminal.kind === 'rlc') {
    if (field === 'x') throw new ValueEntryError('An R-L-C model has no X field')
    const next: Terminal = { ...terminal }
    if (!text.trim()) {
      delete next[field]
      if (next.r === undefined && next.l === undefined && next.c === undefined) {
        throw new ValueEntryError('An R-L-C model needs at least one of R, L and C')
      }
      return { terminal: next }
    }
    const { value, warning } = readEntry(text, terminalFieldOf(field))
    if (field === 'r' ? value < 0 : value <= 0) {
      throw new ValueEntryError(`${field.toUpperCase()} must be ${field === 'r' ? 'zero or more' : 'greater than zero'}`)
    }
    next[field] = value
    return { terminal: next, warning }
  }
  throw new ValueEntryError('A Z0 source has no values to edit')
}

export type SettingsField = 'z0' | 'frequencyHz' | 'bandStartHz' | 'bandStopHz' | 'bandPoints'
  | 'minReturnLossDb' | 'f1Hz' | 'f2Hz'

const SETTING_NAMES: Record<SettingsField, string> = {
  z0: 'Z0', frequencyHz: 'Design frequency', bandStartHz: 'Band start', bandStopHz: 'Band stop',
  bandPoints: 'Band points', minReturnLossDb: 'Minimum return loss', f1Hz: 'Spec start', f2Hz: 'Spec stop',
}

/** The entry field of each setting: frequencies in MHz, Z0 in Ω, the spec's level in dB. */
export function settingsFieldOf(field: SettingsField): EntryField {
  const what = SETTING_NAMES[field]
  if (field === 'z0') return RESISTANCE_FIELD(what, USUAL_Z0_OHM)
  if (field === 'bandPoints') return { what, quantity: 'number', unit: '' }
  if (field === 'minReturnLossDb') return { what, quantity: 'level', unit: 'dB' }
  return FREQUENCY_FIELD(what)
}

/** The settings patch for typed text in one settings field ("915M", "50", "201", "10 dB"). */
export function settingsPatchFor(settings: BoardSettings, field: SettingsField, text: string): Partial<BoardSettings> {
  return settingsEntry(settings, field, text).patch
}

/** settingsPatchFor with the warning of an implausible value. */
export function settingsEntry(settings: BoardSettings, field: SettingsField, text: string): { patch: Partial<BoardSettings>, warning?: string } {
  const reading: EntryReading = readEntry(text, settingsFieldOf(field))
  return { patch: settingsPatchOf(settings, field, reading.value), warning: reading.warning }
}

function settingsPatchOf(settings: BoardSettings, field: SettingsField, v: number): Partial<BoardSettings> {
  const what = SETTING_NAMES[field]
  switch (field) {
    case 'z0': {
      if (v <= 0) throw new ValueEntryError('Z0 must be greater than zero')
      return { z0: v }
    }
    case 'bandPoints': {
      if (!Number.isInteger(v) || v < 2 || v > 2001) throw new ValueEntryError('Band points must be a whole number from 2 to 2001')
      return { bandPoints: v }
    }
    case 'minReturnLossDb': {
      if (v < 0 || v > 80) throw new ValueEntryError('Minimum return loss must be between 0 and 80 dB')
      return { spec: { ...settings.spec, minReturnLossDb: v } }
    }
    default: {
      if (v <= 0) throw new ValueEntryError(`${what} must be greater than zero`)
      if (field === 'f1Hz' || field === 'f2Hz') {
        const spec = { ...settings.spec, [field]: v }
        if (spec.f1Hz >= spec.f2Hz) throw new ValueEntryError('The spec start must be below the spec stop')
        return { spec }
      }
      if (field === 'bandStartHz' && v >= settings.bandStopHz) throw new ValueEntryError('Band start must be below band stop')
      if (field === 'bandStopHz' && v <= settings.bandStartHz) throw new ValueEntryError('Band stop must be above band start')
      return { [field]: v }
    }
  }
}
