// Writing Touchstone v1.1 text: one option line `# <unit> S <format> R <z0>`, numbers in the
// shortest form that reads back to the same double (String(x)), two-port columns f S11 S21 S12 S22,
// files of 3 or more ports wrapped at 4 values per line with each matrix row on a new line.
import type { Complex } from './types'
import { RfInputError } from './errors'
import { UNIT_SCALE, type DataFormat, type FrequencyUnit } from './touchstone-lex'
import type { NoiseParameters } from './touchstone-records'

export interface TouchstoneWriteInput {
  ports: number
  /** Reference resistance, ohms (one for all ports). */
  z0: number
  /** Hz, strictly increasing. */
  frequencies: readonly number[]
  /** s[k][i][j] at frequencies[k]. */
  s: readonly (readonly (readonly Complex[])[])[]
  format?: DataFormat
  unit?: FrequencyUnit
  /** Written as '!' lines at the top; line breaks start new comment lines. */
  comment?: string
  /** Two-port noise parameters, written after the S data. */
  noise?: readonly NoiseParameters[]
}

/**
 * A magnitude of exactly zero has no decibel value; it is written as this many dB
 * (a magnitude of 1e-50, far below anything measurable), and reads back as that.
 */
export const ZERO_MAGNITUDE_DB = -1000

const RAD_TO_DEG = 180 / Math.PI
const VALUES_PER_LINE = 4

function pairOf(value: Complex, format: DataFormat): string {
  if (format === 'RI') return `${value.re} ${value.im}`
  const magnitude = Math.sqrt(value.re * value.re + value.im * value.im)
  const angleDeg = Math.atan2(value.im, value.re) * RAD_TO_DEG
  if (format === 'MA') return `${magnitude} ${angleDeg}`
  return `${magnitude === 0 ? ZERO_MAGNITUDE_DB : 20 * Math.log10(magnitude)} ${angleDeg}`
}

function checkInput(input: TouchstoneWriteInput): void {
  const { ports, z0, frequencies, s } = input
  if (!Number.isInteger(ports) || ports < 1) throw new RfInputError('ports', `must be a whole number of 1 or more, got ${ports}`)
  if (!(z0 > 0) || !Number.isFinite(z0)) throw new RfInputError('z0', `must be a positive number of ohms, got ${z0}`)
  if (!Array.isArray(frequencies) || frequencies.length === 0) throw new RfInputError('frequencies', 'must hold at least one frequency')
  if (!Array.isArray(s) || s.length !== frequencies.length) throw new RfInputError('s', `must hold one matrix per frequency (${frequencies.length})`)
  if (input.format && !['RI', 'MA', 'DB'].includes(input.format)) throw new RfInputError('format', `must be RI, MA or DB, got ${input.format}`)
  if (input.unit && !(input.unit in UNIT_SCALE)) throw new RfInputError('unit', `must be HZ, KHZ, MHZ or GHZ, got ${input.unit}`)
  let previous = Number.NEGATIVE_INFINITY
  frequencies.forEach((f, k) => {
    if (!Number.isFinite(f) || f < 0) throw new RfInputError(`frequencies[${k}]`, `must be a finite frequency of 0 Hz or more, got ${f}`)
    if (f <= previous) throw new RfInputError(`frequencies[${k}]`, `must be above the one before (${previous} Hz), got ${f}`)
    previous = f
    const matrix = s[k]
    if (!Array.isArray(matrix) || matrix.length !== ports) throw new RfInputError(`s[${k}]`, `must be a ${ports}×${ports} matrix`)
    matrix.forEach((row, i) => {
      if (!Array.isArray(row) || row.length !== ports) throw new RfInputError(`s[${k}][${i}]`, `must hold ${ports} values`)
      row.forEach((v, j) => {
        if (!v || !Number.isFinite(v.re) || !Number.isFinite(v.im)) throw new RfInputError(`s[${k}][${i}][${j}]`, 'must be a finite { re, im }')
      })
    })
  })
  if (!input.noise?.length) return
  if (ports !== 2) throw new RfInputError('noise', 'only a two-port has noise parameters')
  // A v1 reader finds the noise block by its first frequency not being above the last S frequency.
  if (!(input.noise[0]!.frequencyHz <= previous)) throw new RfInputError('noise[0].frequencyHz', `must not be above the last S-parameter frequency (${previous} Hz)`)
  let previousNoise = Number.NEGATIVE_INFINITY
  input.noise.forEach((row, k) => {
    const values = [row.frequencyHz, row.nfminDb, row.gammaOpt?.re, row.gammaOpt?.im, row.rnNormalized]
    if (!values.every(Number.isFinite)) throw new RfInputError(`noise[${k}]`, 'must hold finite numbers')
    if (row.frequencyHz < 0 || row.frequencyHz <= previousNoise) throw new RfInputError(`noise[${k}].frequencyHz`, 'must be 0 Hz or more and above the one before')
    previousNoise = row.frequencyHz
  })
}

/** Writes Touchstone v1.1 text that parseTouchstone (and other readers) read back. */
export function writeTouchstone(input: TouchstoneWriteInput): string {
  checkInput(input)
  const { ports, z0, frequencies, s } = input
  const format = input.format ?? 'RI'
  const unit = input.unit ?? 'HZ'
  const scale = UNIT_SCALE[unit]
  const out: string[] = []
  for (const line of (input.comment ?? '').split(/\r?\n/)) if (line) out.push(`! ${line}`)
  out.push(`# ${unit} S ${format} R ${z0}`)
  for (let k = 0; k < frequencies.length; k++) {
    const matrix = s[k]!
    const f = unit === 'HZ' ? String(frequencies[k]) : String(frequencies[k]! / scale)
    if (ports <= 2) {
      const values = ports === 1 ? [matrix[0]![0]!] : [matrix[0]![0]!, matrix[1]![0]!, matrix[0]![1]!, matrix[1]![1]!]
      out.push(`${f} ${values.map(v => pairOf(v, format)).join(' ')}`)
      continue
    }
    for (let i = 0; i < ports; i++) {
      for (let j = 0; j < ports; j += VALUES_PER_LINE) {
        const chunk = matrix[i]!.slice(j, j + VALUES_PER_LINE).map(v => pairOf(v, format)).join(' ')
        out.push(i === 0 && j === 0 ? `${f} ${chunk}` : chunk)
      }
    }
  }
  if (input.noise?.length) {
    out.push('! noise parameters: f NFmin(dB) |Gopt| ang(Gopt) Rn/R')
    for (const row of input.noise) {
      const f = unit === 'HZ' ? String(row.frequencyHz) : String(row.frequencyHz / scale)
      out.push(`${f} ${row.nfminDb} ${pairOf(row.gammaOpt, 'MA')} ${row.rnNormalized}`)
    }
  }
  return `${out.join('\n')}\n`
}
