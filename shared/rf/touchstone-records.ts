// Turning the numbers of a Touchstone data section into frequencies, matrices and noise rows:
// the column order of each layout, the RI/MA/DB conversions and the checks every record gets
// (strictly increasing frequencies, the right number of numbers).
import type { Complex } from './types'
import { TouchstoneError, UNIT_SCALE, formatFileNumber, scanNumbers, type DataFormat, type FrequencyUnit, type LineContext } from './touchstone-lex'

/** The noise parameters of a two-port at one frequency (Touchstone's noise block). */
export interface NoiseParameters {
  frequencyHz: number
  /** Minimum noise figure, dB. */
  nfminDb: number
  /** Source reflection coefficient giving the minimum noise figure (always magnitude/angle in the file). */
  gammaOpt: Complex
  /** Effective noise resistance divided by the reference resistance. */
  rnNormalized: number
}

/** How the numbers of one frequency are laid out in the file. */
export interface RecordLayout {
  ports: number
  /** 1 + 2 × the number of complex values in the file per frequency. */
  recordLength: number
  /** For each complex value in file order, its place i·ports + j in the matrix. */
  placeOfValue: Int32Array
  /** Lower/upper-triangle files: S_ji equals S_ij and is written once. */
  isSymmetric: boolean
  /** May the numbers of one frequency run over several lines? */
  canWrap: boolean
  /** Two-port files may end with a noise block of 5-number rows (v1: found by the frequency going back). */
  hasNoiseBlock: boolean
}

/**
 * File order of the matrix entries. Full matrices run row by row (S11 S12 … S1N S21 …) except a
 * two-port in "21_12" order (every v1 two-port: S11 S21 S12 S22). Triangles keep j ≤ i (lower) or
 * j ≥ i (upper), row by row.
 */
export function makeLayout(ports: number, options: { matrix?: 'full' | 'lower' | 'upper', order21Before12?: boolean, canWrap: boolean }): RecordLayout {
  const matrix = options.matrix ?? 'full'
  const places: number[] = []
  if (ports === 2 && matrix === 'full' && options.order21Before12) places.push(0, 2, 1, 3)
  else {
    for (let i = 0; i < ports; i++) {
      for (let j = 0; j < ports; j++) {
        if ((matrix === 'lower' && j > i) || (matrix === 'upper' && j < i)) continue
        places.push(i * ports + j)
      }
    }
  }
  return {
    ports,
    recordLength: 1 + 2 * places.length,
    placeOfValue: Int32Array.from(places),
    isSymmetric: matrix !== 'full',
    canWrap: options.canWrap,
    hasNoiseBlock: ports === 2,
  }
}

const DEG = Math.PI / 180
const NOISE_ROW = 5

/** Collects records line by line and converts them; one instance per file. */
export class RecordReader {
  readonly frequencies: number[] = []
  readonly s: Complex[][][] = []
  readonly noise: NoiseParameters[] = []
  isInNoiseBlock = false

  private readonly buffer: Float64Array
  private filled = 0
  private recordLine = 0
  private recordColumn = 0
  private lastFrequency = Number.NEGATIVE_INFINITY
  private readonly scale: number

  constructor(private readonly layout: RecordLayout, private readonly format: DataFormat, unit: FrequencyUnit, private readonly fileName: string,
    private readonly maxFrequencies = Number.POSITIVE_INFINITY) {
    this.buffer = new Float64Array(Math.max(layout.recordLength, NOISE_ROW))
    this.scale = UNIT_SCALE[unit]
  }

  /** True while a wrapped record is only partly read. */
  get isMidRecord(): boolean {
    return this.filled > 0
  }

  /** Reads one data line; `end` is where its comment starts, `firstColumn` its first token's column. */
  readLine(text: string, end: number, firstColumn: number, where: LineContext): void {
    const { layout, buffer } = this
    if (this.isInNoiseBlock) return this.readNoiseLine(text, end, firstColumn, where)
    if (!layout.canWrap) {
      const count = scanNumbers(text, end, buffer, 0, where)
      if (count === NOISE_ROW && layout.hasNoiseBlock && this.s.length > 0 && buffer[0]! <= this.lastFrequency) {
        this.isInNoiseBlock = true
        this.lastFrequency = Number.NEGATIVE_INFINITY
        return this.commitNoise(where.lineNumber, firstColumn)
      }
      if (count !== layout.recordLength) {
        const hint = layout.hasNoiseBlock ? ' (or 5 in a noise-parameter block, which starts with a frequency not above the last one)' : ''
        this.fail('wrong-column-count', `${count} numbers, a ${layout.ports}-port row needs ${layout.recordLength}${hint}`, where.lineNumber)
      }
      this.recordLine = where.lineNumber
      this.recordColumn = firstColumn
      return this.commitRecord()
    }
    if (this.filled === 0) {
      this.recordLine = where.lineNumber
      this.recordColumn = firstColumn
    }
    const count = scanNumbers(text, end, buffer, this.filled, where)
    if (this.filled + count > layout.recordLength) {
      this.fail('wrong-column-count', `${count} numbers, but the frequency that started on line ${this.recordLine} needs only ${layout.recordLength - this.filled} more `
        + `(${layout.recordLength} per frequency for ${layout.ports} ports; a new frequency starts on a new line)`, where.lineNumber)
    }
    this.filled += count
    if (this.filled === layout.recordLength) {
      this.filled = 0
      this.commitRecord()
    }
  }

  /** Starts the noise block of a two-port (v2: after the [Noise Data] keyword). */
  startNoiseBlock(): void {
    this.isInNoiseBlock = true
    this.lastFrequency = Number.NEGATIVE_INFINITY
  }

  /** Throws when the file ends inside a wrapped record. */
  finish(): void {
    if (this.filled > 0) {
      this.fail('wrong-column-count', `the file ends after ${this.filled} of the ${this.layout.recordLength} numbers of the frequency that started here`, this.recordLine)
    }
  }

  private readNoiseLine(text: string, end: number, firstColumn: number, where: LineContext): void {
    const count = scanNumbers(text, end, this.buffer, 0, where)
    if (count !== NOISE_ROW) this.fail('wrong-column-count', `${count} numbers, a noise-parameter row needs 5 (f NFmin |Gopt| ang(Gopt) Rn/R)`, where.lineNumber)
    this.commitNoise(where.lineNumber, firstColumn)
  }

  private checkFrequency(value: number, line: number, column: number): number {
    if (value < 0) this.fail('negative-frequency', `frequency ${formatFileNumber(value)} is negative (expected zero or more)`, line, column)
    if (value <= this.lastFrequency) {
      this.fail('frequency-not-increasing', `frequency ${formatFileNumber(value)} after ${formatFileNumber(this.lastFrequency)} (frequencies must strictly increase)`, line, column)
    }
    this.lastFrequency = value
    return value * this.scale
  }

  private commitRecord(): void {
    const { buffer, layout } = this
    const n = layout.ports
    if (this.frequencies.length >= this.maxFrequencies) this.tooMany(this.recordLine)
    this.frequencies.push(this.checkFrequency(buffer[0]!, this.recordLine, this.recordColumn))
    const places = layout.placeOfValue
    // Fast paths build the small matrices as literals (packed arrays, fewer allocations).
    if (n === 1) {
      this.s.push([[this.toComplex(buffer[1]!, buffer[2]!)]])
      return
    }
    if (n === 2 && !layout.isSymmetric) {
      // placeOfValue is [0, 2, 1, 3] (f S11 S21 S12 S22) or [0, 1, 2, 3] (f S11 S12 S21 S22).
      const s11 = this.toComplex(buffer[1]!, buffer[2]!)
      const second = this.toComplex(buffer[3]!, buffer[4]!)
      const third = this.toComplex(buffer[5]!, buffer[6]!)
      const s22 = this.toComplex(buffer[7]!, buffer[8]!)
      this.s.push(places[1] === 2 ? [[s11, third], [second, s22]] : [[s11, second], [third, s22]])
      return
    }
    const matrix: Complex[][] = []
    for (let i = 0; i < n; i++) matrix.push(new Array<Complex>(n))
    for (let v = 0; v < places.length; v++) {
      const value = this.toComplex(buffer[1 + 2 * v]!, buffer[2 + 2 * v]!)
      const place = places[v]!
      const i = (place / n) | 0
      const j = place - i * n
      matrix[i]![j] = value
      if (layout.isSymmetric) matrix[j]![i] = value
    }
    this.s.push(matrix)
  }

  private commitNoise(line: number, column: number): void {
    const b = this.buffer
    if (this.noise.length >= this.maxFrequencies) this.tooMany(line)
    const frequencyHz = this.checkFrequency(b[0]!, line, column)
    const angle = b[3]! * DEG
    this.noise.push({ frequencyHz, nfminDb: b[1]!, gammaOpt: { re: b[2]! * Math.cos(angle), im: b[2]! * Math.sin(angle) }, rnNormalized: b[4]! })
  }

  private toComplex(a: number, b: number): Complex {
    if (this.format === 'RI') return { re: a, im: b }
    const magnitude = this.format === 'MA' ? a : 10 ** (a / 20)
    if (!Number.isFinite(magnitude)) this.fail('out-of-range', `${a} dB is too large a magnitude`, this.recordLine)
    const angle = b * DEG
    return { re: magnitude * Math.cos(angle), im: magnitude * Math.sin(angle) }
  }

  private tooMany(line: number): never {
    throw new TouchstoneError('too-many-frequencies', `more than ${this.maxFrequencies} frequencies (the most this reader takes)`, this.fileName, line)
  }

  private fail(code: 'wrong-column-count' | 'frequency-not-increasing' | 'negative-frequency' | 'out-of-range', detail: string, line: number, column?: number): never {
    throw new TouchstoneError(code, detail, this.fileName, line, column)
  }
}
