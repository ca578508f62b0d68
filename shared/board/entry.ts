// Typed entries for terminals and board settings: text in engineering notation becomes a new
// terminal or a settings patch, or a ValueEntryError that says what is wrong.
import { parseEng } from '../rf'
import type { BoardSettings, Terminal } from './schema'
import { ValueEntryError } from './element-values'

function numberFrom(text: string, what: string, unit: RegExp): number {
  const trimmed = text.trim()
  if (!trimmed) throw new ValueEntryError(`Type a value for ${what}`)
  let value: number
  try {
    value = parseEng(trimmed.replace(unit, ''))
  }
  catch (error) {
    throw new ValueEntryError(`${what}: ${error instanceof Error ? error.message : 'not a number'}`)
  }
  if (!Number.isFinite(value)) throw new ValueEntryError(`${what} must be a finite number`)
  return value
}

const OHMS = /\s*(Ω|ohms?|Ohms?)$/
const HERTZ = /\s*(Hz|hz)$/
const DB = /\s*dB$/i

export type TerminalField = 'r' | 'x' | 'l' | 'c'

/**
 * The terminal with one field replaced by typed text. For a fixed impedance `r` and `x` are its
 * real and imaginary parts; for an R-L-C model `r`, `l`, `c` are its parts and an empty text
 * removes that part.
 */
export function terminalWithField(terminal: Terminal, field: TerminalField, text: string): Terminal {
  if (terminal.kind === 'impedance') {
    if (field !== 'r' && field !== 'x') throw new ValueEntryError('A fixed impedance has only R and X')
    const value = numberFrom(text, field === 'r' ? 'R' : 'X', OHMS)
    if (field === 'r' && value < 0) throw new ValueEntryError('R cannot be negative (a passive terminal)')
    return { kind: 'impedance', z: field === 'r' ? { re: value, im: terminal.z.im } : { re: terminal.z.re, im: value } }
  }
  if (terminal.kind === 'rlc') {
    if (field === 'x') throw new ValueEntryError('An R-L-C model has no X field')
    const next: Terminal = { ...terminal }
    if (!text.trim()) {
      delete next[field]
      if (next.r === undefined && next.l === undefined && next.c === undefined) {
        throw new ValueEntryError('An R-L-C model needs at least one of R, L and C')
      }
      return next
    }
    const unit = field === 'r' ? OHMS : field === 'l' ? /\s*H$/ : /\s*F$/
    const value = numberFrom(text, field.toUpperCase(), unit)
    if (field === 'r' ? value < 0 : value <= 0) {
      throw new ValueEntryError(`${field.toUpperCase()} must be ${field === 'r' ? 'zero or more' : 'greater than zero'}`)
    }
    next[field] = value
    return next
  }
  throw new ValueEntryError('A Z0 source has no values to edit')
}

export type SettingsField = 'z0' | 'frequencyHz' | 'bandStartHz' | 'bandStopHz' | 'bandPoints'
  | 'minReturnLossDb' | 'f1Hz' | 'f2Hz'

const SETTING_NAMES: Record<SettingsField, string> = {
  z0: 'Z0', frequencyHz: 'Design frequency', bandStartHz: 'Band start', bandStopHz: 'Band stop',
  bandPoints: 'Band points', minReturnLossDb: 'Minimum return loss', f1Hz: 'Spec start', f2Hz: 'Spec stop',
}

/** The settings patch for typed text in one settings field ("915M", "50", "201", "10 dB"). */
export function settingsPatchFor(settings: BoardSettings, field: SettingsField, text: string): Partial<BoardSettings> {
  const what = SETTING_NAMES[field]
  switch (field) {
    case 'z0': {
      const v = numberFrom(text, what, OHMS)
      if (v <= 0) throw new ValueEntryError('Z0 must be greater than zero')
      return { z0: v }
    }
    case 'bandPoints': {
      const v = numberFrom(text, what, /$/)
      if (!Number.isInteger(v) || v < 2 || v > 2001) throw new ValueEntryError('Band points must be a whole number from 2 to 2001')
      return { bandPoints: v }
    }
    case 'minReturnLossDb': {
      const v = numberFrom(text, what, DB)
      if (v < 0 || v > 80) throw new ValueEntryError('Minimum return loss must be between 0 and 80 dB')
      return { spec: { ...settings.spec, minReturnLossDb: v } }
    }
    default: {
      const v = numberFrom(text, what, HERTZ)
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
