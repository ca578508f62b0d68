// Low-level reading of Touchstone lines: the error type, a number scanner that works on character
// codes (one pass, no regex per token: a 100,000-line file must parse in well under 300 ms) and
// the option line `# <unit> <parameter> <format> R <ohms>`.
import { RfInputError } from './errors'

/** What kind of problem a Touchstone file has; stable strings for callers and tests. */
export type TouchstoneErrorCode =
  | 'empty' | 'no-data' | 'missing-option-line' | 'bad-option-line' | 'non-numeric'
  | 'wrong-column-count' | 'frequency-not-increasing' | 'negative-frequency' | 'out-of-range'
  | 'unknown-port-count' | 'bad-keyword' | 'unknown-keyword' | 'unsupported' | 'frequency-count'
  | 'bad-argument' | 'port-count' | 'too-many-frequencies'

/**
 * A file that cannot be read. `line` is 1-based (null when the problem is the file as a whole,
 * such as an empty file); `column` is the 1-based character position of the offending token.
 * An RfInputError whose argument is the file text, so one `instanceof` catches every bad input.
 */
export class TouchstoneError extends RfInputError {
  readonly code: TouchstoneErrorCode
  readonly line: number | null
  readonly column?: number
  readonly fileName: string

  constructor(code: TouchstoneErrorCode, detail: string, fileName: string, line: number | null, column?: number) {
    const shownName = quoteToken(fileName)
    const where = line === null ? shownName : `${shownName} line ${line}${column ? `, column ${column}` : ''}`
    super('text', detail)
    this.message = `${where}: ${detail}`
    this.name = 'TouchstoneError'
    this.code = code
    this.line = line
    if (column !== undefined) this.column = column
    this.fileName = fileName
  }
}

/** Longest piece of the file (a token, a keyword, a file name) quoted in a message. */
const QUOTE_MAX_CHARS = 40

/**
 * A token as shown in an error message: cut to 40 characters with an ellipsis, so a message
 * never echoes a huge line (a 20 MB "token") back to the caller.
 */
export function quoteToken(token: string): string {
  return token.length <= QUOTE_MAX_CHARS ? token : `${token.slice(0, QUOTE_MAX_CHARS)}…`
}

/** How much a file may hold; checked as the file is read, before anything is laid out for it. */
export interface TouchstoneLimits {
  /** Most ports (default TOUCHSTONE_MAX_PORTS): an N-port record lays out N² values. */
  maxPorts?: number
  /** Most frequencies in the network data, and in the noise block (default: no limit). */
  maxFrequencies?: number
}

/**
 * The reader's own ceiling on ports: 64² values per frequency is already far beyond any
 * measured file; a name such as `x.s12000p` must not make it lay out 144 million values.
 */
export const TOUCHSTONE_MAX_PORTS = 64

export type FrequencyUnit = 'HZ' | 'KHZ' | 'MHZ' | 'GHZ'
export type NetworkParameter = 'S' | 'Y' | 'Z' | 'H' | 'G'
export type DataFormat = 'RI' | 'MA' | 'DB'

export const UNIT_SCALE: Readonly<Record<FrequencyUnit, number>> = { HZ: 1, KHZ: 1e3, MHZ: 1e6, GHZ: 1e9 }
const PARAMETERS: ReadonlySet<string> = new Set(['S', 'Y', 'Z', 'H', 'G'])
const FORMATS: ReadonlySet<string> = new Set(['RI', 'MA', 'DB'])

export interface OptionLine {
  unit: FrequencyUnit
  parameter: NetworkParameter
  format: DataFormat
  referenceOhms: number
}

/** Where the file is being read, for error messages. */
export interface LineContext {
  fileName: string
  lineNumber: number
}

function isSpace(code: number): boolean {
  return code <= 32
}

// Exact powers of ten: a mantissa below 2^53 times or divided by one of these is correctly
// rounded, the same double Number() gives (Clinger's fast path).
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`))

/**
 * The value of text[start, end) when it is a plain decimal literal
 * [+-]digits[.digits][(e|E)[+-]digits] ('.5' and '5.' allowed), else NaN. Number() alone would
 * also take hex, binary and 'Infinity', which a Touchstone file never means. Short literals are
 * converted here in one pass; longer ones fall back to Number().
 */
export function readDecimal(text: string, start: number, end: number): number {
  let i = start
  let code = text.charCodeAt(i)
  const isNegative = code === 45
  if (code === 43 || code === 45) code = text.charCodeAt(++i) // + -
  let mantissa = 0
  let digits = 0
  let exponent = 0
  while (i < end && code >= 48 && code <= 57) { mantissa = mantissa * 10 + (code - 48); digits++; code = text.charCodeAt(++i) }
  if (i < end && code === 46) { // .
    code = text.charCodeAt(++i)
    while (i < end && code >= 48 && code <= 57) { mantissa = mantissa * 10 + (code - 48); digits++; exponent--; code = text.charCodeAt(++i) }
  }
  if (digits === 0) return Number.NaN
  if (i < end && (code === 101 || code === 69)) { // e E
    code = text.charCodeAt(++i)
    const isExponentNegative = code === 45
    if (code === 43 || code === 45) code = text.charCodeAt(++i)
    let written = 0
    let expDigits = 0
    while (i < end && code >= 48 && code <= 57) {
      if (written < 1e6) written = written * 10 + (code - 48)
      expDigits++
      code = text.charCodeAt(++i)
    }
    if (expDigits === 0) return Number.NaN
    exponent += isExponentNegative ? -written : written
  }
  if (i !== end) return Number.NaN
  if (mantissa <= Number.MAX_SAFE_INTEGER && exponent >= -22 && exponent <= 22) {
    const value = exponent < 0 ? mantissa / POW10[-exponent]! : mantissa * POW10[exponent]!
    return isNegative ? -value : value
  }
  return Number(text.slice(start, end))
}

/**
 * Reads every whitespace-separated number of text[0, end) into out[offset…] (numbers beyond
 * out.length are counted, not stored) and returns how many there were. Throws 'non-numeric' at
 * the first token that is not a decimal literal.
 */
export function scanNumbers(text: string, end: number, out: Float64Array, offset: number, where: LineContext): number {
  let count = 0
  let i = 0
  while (i < end) {
    while (i < end && isSpace(text.charCodeAt(i))) i++
    if (i >= end) break
    const start = i
    while (i < end && !isSpace(text.charCodeAt(i))) i++
    const value = readDecimal(text, start, i)
    if (Number.isNaN(value)) {
      throw new TouchstoneError('non-numeric', `token '${quoteToken(text.slice(start, i))}' is not a number (expected a decimal number such as 0.25 or -1.5e-3)`,
        where.fileName, where.lineNumber, start + 1)
    }
    if (!Number.isFinite(value)) {
      throw new TouchstoneError('out-of-range', `number '${quoteToken(text.slice(start, i))}' is too large for a double (expected a finite number)`,
        where.fileName, where.lineNumber, start + 1)
    }
    const slot = offset + count
    if (slot < out.length) out[slot] = value
    count++
  }
  return count
}

/** Whitespace-separated tokens of a short line with their 1-based columns (option and keyword lines only). */
export function tokensOf(text: string, from = 0): { text: string, column: number }[] {
  const tokens: { text: string, column: number }[] = []
  let i = from
  while (i < text.length) {
    while (i < text.length && isSpace(text.charCodeAt(i))) i++
    if (i >= text.length) break
    const start = i
    while (i < text.length && !isSpace(text.charCodeAt(i))) i++
    tokens.push({ text: text.slice(start, i), column: start + 1 })
  }
  return tokens
}

/**
 * Parses an option line (comment already removed; `hashIndex` is where '#' stands). Tokens are
 * case-insensitive and may come in any order (recalled from memory); missing fields take the
 * defaults GHz, S, MA, R 50.
 */
export function parseOptionLine(text: string, hashIndex: number, where: LineContext): OptionLine {
  const fail = (detail: string, column: number): never => {
    throw new TouchstoneError('bad-option-line', detail, where.fileName, where.lineNumber, column)
  }
  let unit: FrequencyUnit | undefined
  let parameter: NetworkParameter | undefined
  let format: DataFormat | undefined
  let referenceOhms: number | undefined
  const tokens = tokensOf(text, hashIndex + 1)
  for (let t = 0; t < tokens.length; t++) {
    const token = tokens[t]!
    const upper = token.text.toUpperCase()
    if (upper in UNIT_SCALE) {
      if (unit) fail(`repeated frequency unit '${quoteToken(token.text)}' (one of HZ, KHZ, MHZ, GHZ expected once)`, token.column)
      unit = upper as FrequencyUnit
    }
    else if (PARAMETERS.has(upper)) {
      if (parameter) fail(`repeated parameter '${quoteToken(token.text)}' (one of S, Y, Z, H, G expected once)`, token.column)
      parameter = upper as NetworkParameter
    }
    else if (FORMATS.has(upper)) {
      if (format) fail(`repeated format '${quoteToken(token.text)}' (one of RI, MA, DB expected once)`, token.column)
      format = upper as DataFormat
    }
    else if (upper === 'R') {
      if (referenceOhms !== undefined) fail(`repeated 'R' (one reference resistance expected)`, token.column)
      const value = tokens[t + 1]
      const ohms = value ? readDecimal(value.text, 0, value.text.length) : Number.NaN
      if (!(ohms > 0) || !Number.isFinite(ohms)) fail(`'R' must be followed by a positive reference resistance in ohms`, value?.column ?? token.column)
      referenceOhms = ohms
      t++
    }
    else {
      fail(`unknown option token '${quoteToken(token.text)}' (expected a unit HZ/KHZ/MHZ/GHZ, a parameter S/Y/Z/H/G, a format RI/MA/DB or 'R <ohms>')`, token.column)
    }
  }
  return { unit: unit ?? 'GHZ', parameter: parameter ?? 'S', format: format ?? 'MA', referenceOhms: referenceOhms ?? 50 }
}

/** Formats a number from the file for a message, keeping a visible decimal point ("805.0"). */
export function formatFileNumber(value: number): string {
  return Number.isInteger(value) ? value.toFixed(1) : String(value)
}
