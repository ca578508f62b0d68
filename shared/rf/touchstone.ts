/**
 * Touchstone reading (v1.x and v2.0/2.1) and writing (v1.1), an open IBIS standard.
 *
 * v1: the option line `# <unit> <parameter> <format> R <ohms>` comes first (tokens in any order
 * and case, defaults GHz S MA R 50); the port count comes from the file extension (.s1p, .s2p, …).
 * One- and two-port rows hold one frequency each (two-port column order f S11 S21 S12 S22); files
 * of 3 or more ports wrap each frequency over several lines, row by row. A two-port may end with a
 * noise-parameter block whose first row's frequency is not above the last S-parameter frequency.
 * v2: `[Version] 2.0` first, then keywords ([Number of Ports], [Two-Port Data Order],
 * [Number of Frequencies], [Reference], [Matrix Format], [Network Data], [Noise Data], [End]);
 * any record may wrap. The keyword set is recalled from memory, not copied from the standard.
 *
 * `s` holds the parameter the file names (S almost always; Y/Z/H/G are kept as written: in v1
 * they are normalised to R, in v2 they are in ohms or siemens). Errors are TouchstoneError with
 * the 1-based line (and column) of the problem.
 */
import type { Complex } from './types'
import {
  TOUCHSTONE_MAX_PORTS, TouchstoneError, parseOptionLine, quoteToken,
  type DataFormat, type TouchstoneLimits, type FrequencyUnit, type LineContext, type NetworkParameter, type OptionLine,
} from './touchstone-lex'
import { RecordReader, makeLayout, type NoiseParameters } from './touchstone-records'
import { V2Header } from './touchstone-v2'

export { TOUCHSTONE_MAX_PORTS, TouchstoneError, type TouchstoneErrorCode, type TouchstoneLimits, type FrequencyUnit, type NetworkParameter, type DataFormat } from './touchstone-lex'
export type { NoiseParameters } from './touchstone-records'
export { writeTouchstone, type TouchstoneWriteInput } from './touchstone-write'

/** What parseTouchstone returns; plain JSON-safe data. */
export interface TouchstoneData {
  version: '1.x' | '2.0' | '2.1'
  ports: number
  /** Reference resistance of port 1, ohms (all ports share it unless `referenceOhms` says otherwise). */
  z0: number
  /** Reference resistance of each port, ohms. */
  referenceOhms: number[]
  parameter: NetworkParameter
  /** How the numbers were written in the file (the values in `s` are always re/im). */
  format: DataFormat
  frequencyUnit: FrequencyUnit
  /** Hz, strictly increasing. */
  frequencies: number[]
  /** s[k][i][j] is parameter (i+1)(j+1) at frequencies[k]. */
  s: Complex[][][]
  /** The noise-parameter block of a two-port (empty when there is none); never mixed into `s`. */
  noise: NoiseParameters[]
  /** Things read past without failing (a repeated option line, a missing [End]). */
  warnings: string[]
}

/** Port count from a .sNp extension, or undefined. */
function portsFromFileName(fileName: string): number | undefined {
  const match = /\.s(\d+)p$/i.exec(fileName)
  const ports = match ? Number(match[1]) : Number.NaN
  return ports >= 1 ? ports : undefined
}

function firstNonSpace(text: string, end: number): number {
  let i = 0
  while (i < end && text.charCodeAt(i) <= 32) i++
  return i
}

/**
 * Reads a Touchstone file. `fileName` gives the port count of a v1 file and names the file in
 * errors. `limits` bounds the ports and frequencies taken (a file past them is a TouchstoneError
 * on the line that goes past, raised before anything is laid out for it).
 */
export function parseTouchstone(text: string, fileName: string, limits: TouchstoneLimits = {}): TouchstoneData {
  if (typeof text !== 'string') throw new TouchstoneError('bad-argument', 'the file text must be a string', String(fileName), null)
  const name = typeof fileName === 'string' && fileName ? fileName : 'file'
  const lines = text.split('\n')
  if (lines[0]!.charCodeAt(0) === 0xFEFF) lines[0] = lines[0]!.slice(1)
  const bounds = {
    maxPorts: Math.min(limits.maxPorts ?? TOUCHSTONE_MAX_PORTS, TOUCHSTONE_MAX_PORTS),
    maxFrequencies: limits.maxFrequencies ?? Number.POSITIVE_INFINITY,
  }
  const warnings: string[] = []
  const where: LineContext = { fileName: name, lineNumber: 0 }
  let options: OptionLine | undefined
  let v2: V2Header | undefined
  let reader: RecordReader | undefined
  let sawData = false

  for (let index = 0; index < lines.length; index++) {
    const line = lines[index]!
    where.lineNumber = index + 1
    if (v2?.isInInformation(line)) continue
    const bang = line.indexOf('!')
    const end = bang >= 0 ? bang : line.length
    const first = firstNonSpace(line, end)
    if (first >= end) continue
    const code = line.charCodeAt(first)
    if (code === 35) { // '#'
      if (options) warnings.push(`line ${where.lineNumber}: a second option line is ignored`)
      else if (sawData) throw new TouchstoneError('missing-option-line', 'the option line must come before the data', name, where.lineNumber)
      else {
        options = parseOptionLine(line.slice(0, end), first, where)
        v2?.setOptions(options)
      }
      continue
    }
    if (code === 91) { // '['
      if (!v2 && !options && !sawData) v2 = new V2Header(name, bounds)
      if (!v2) throw new TouchstoneError('bad-keyword', 'a keyword line needs [Version] 2.0 as the first line of the file (this is a Touchstone 1 file)', name, where.lineNumber, first + 1)
      const next = v2.readKeyword(line.slice(0, end), first, where, reader)
      if (next) reader = next
      continue
    }
    sawData = true
    if (v2) {
      if (!reader) {
        v2.readHeaderNumbers(line.slice(0, end), where)
        continue
      }
      if (v2.hasEnded) continue
    }
    else if (!options) {
      throw new TouchstoneError('missing-option-line', 'data before the option line (expected a line such as "# MHz S RI R 50" first)', name, where.lineNumber)
    }
    else if (!reader) {
      const ports = portsFromFileName(name)
      if (ports === undefined) {
        throw new TouchstoneError('unknown-port-count', `cannot tell the number of ports of '${quoteToken(name)}' (expected a .s1p, .s2p, … file name, or a Touchstone 2.0 file with [Number of Ports])`, name, null)
      }
      if (ports > bounds.maxPorts) {
        throw new TouchstoneError('port-count', `the file name says ${ports} ports: this reader takes 1 to ${bounds.maxPorts}`, name, where.lineNumber)
      }
      reader = new RecordReader(makeLayout(ports, { order21Before12: true, canWrap: ports >= 3 }), options.format, options.unit, name, bounds.maxFrequencies)
    }
    reader!.readLine(line, end, first + 1, where)
  }

  if (v2) v2.finish(reader, warnings, lines.length)
  else if (!options) throw new TouchstoneError('empty', sawData ? 'data but no option line' : 'no option line and no data', name, null)
  if (!reader || reader.frequencies.length === 0) {
    throw new TouchstoneError('no-data', 'option line but no data rows (expected at least one frequency)', name, null)
  }
  reader.finish()
  const opts = options!
  const referenceOhms = v2?.referenceOhms(opts.referenceOhms) ?? [opts.referenceOhms]
  const ports = reader.s[0]!.length
  return {
    version: v2?.version ?? '1.x',
    ports,
    z0: referenceOhms[0]!,
    referenceOhms: ports === referenceOhms.length ? referenceOhms : new Array(ports).fill(referenceOhms[0]),
    parameter: opts.parameter,
    format: opts.format,
    frequencyUnit: opts.unit,
    frequencies: reader.frequencies,
    s: reader.s,
    noise: reader.noise,
    warnings,
  }
}
