// The keyword part of a Touchstone 2.x file: [Version], [Number of Ports], [Two-Port Data Order],
// [Number of Frequencies], [Number of Noise Frequencies], [Reference], [Matrix Format],
// [Begin Information]/[End Information], [Network Data], [Noise Data], [End]. Keyword names are
// case-insensitive. The set and its rules are recalled from memory, not copied from the standard.
import { TouchstoneError, quoteToken, readDecimal, scanNumbers, tokensOf, type LineContext, type OptionLine } from './touchstone-lex'
import { RecordReader, makeLayout } from './touchstone-records'

type MatrixFormat = 'full' | 'lower' | 'upper'

export class V2Header {
  version: '2.0' | '2.1' | undefined
  hasEnded = false
  private options?: OptionLine
  private ports?: number
  private order?: '12_21' | '21_12'
  private frequencyCount?: number
  private noiseCount?: number
  private references?: number[]
  private missingReferences = 0
  private matrix: MatrixFormat = 'full'
  private isInInfo = false
  private sawNetworkData = false
  private isNetworkCounted = false
  private readonly scratch = new Float64Array(64)

  constructor(private readonly fileName: string, private readonly limits: { maxPorts: number, maxFrequencies: number }) {}

  /** True for the lines of an information block, which are skipped whatever they hold. */
  isInInformation(line: string): boolean {
    if (!this.isInInfo) return false
    if (/^\s*\[\s*end\s+information\s*\]/i.test(line)) this.isInInfo = false
    return true
  }

  setOptions(options: OptionLine): void {
    this.options = options
  }

  /** Reads one keyword line; returns the record reader when [Network Data] starts. */
  readKeyword(text: string, first: number, where: LineContext, reader: RecordReader | undefined): RecordReader | undefined {
    const close = text.indexOf(']', first)
    if (close < 0) this.fail('bad-keyword', `keyword without a closing ']' (expected e.g. [Number of Ports] 2)`, where, first + 1)
    const keyword = text.slice(first + 1, close).trim().toLowerCase().replace(/\s+/g, ' ')
    const named = quoteToken(keyword)
    const args = tokensOf(text, close + 1)
    if (this.hasEnded) return undefined
    if (!this.version && keyword !== 'version') this.fail('bad-keyword', `[${named}] before [Version] (a Touchstone 2 file starts with [Version] 2.0)`, where, first + 1)
    if (this.missingReferences > 0) this.fail('bad-keyword', `[Reference] needs ${this.missingReferences} more value(s), one per port`, where, first + 1)
    const arg = (what: string): string => {
      if (args.length !== 1) this.fail('bad-keyword', `[${named}] needs exactly one value: ${what}`, where, close + 2)
      return args[0]!.text.toLowerCase()
    }
    const count = (what: string): number => {
      const value = arg(what)
      const n = readDecimal(value, 0, value.length)
      if (!Number.isInteger(n) || n < 1) this.fail('bad-keyword', `[${named}] needs ${what}, got '${quoteToken(args[0]!.text)}'`, where, args[0]!.column)
      return n
    }
    switch (keyword) {
      case 'version': {
        if (this.version) this.fail('bad-keyword', '[Version] given twice', where, first + 1)
        const value = arg('the version 2.0')
        if (value !== '2.0' && value !== '2.1') this.fail('unsupported', `Touchstone version '${quoteToken(args[0]!.text)}' is not supported (expected 2.0 or 2.1)`, where, args[0]!.column)
        this.version = value
        return undefined
      }
      case 'number of ports': {
        const ports = count('a whole number of ports, 1 or more')
        // Refused here, before [Network Data] lays out ports² values per frequency.
        if (ports > this.limits.maxPorts) this.fail('port-count', `${ports} ports: this reader takes 1 to ${this.limits.maxPorts}`, where, args[0]!.column)
        this.ports = ports
        return undefined
      }
      case 'two-port data order': {
        const value = arg('12_21 or 21_12')
        if (value !== '12_21' && value !== '21_12') this.fail('bad-keyword', `[Two-Port Data Order] must be 12_21 or 21_12, got '${quoteToken(args[0]!.text)}'`, where, args[0]!.column)
        this.order = value
        return undefined
      }
      case 'number of frequencies': this.frequencyCount = this.frequencyLimited(count('a whole number of frequencies, 1 or more'), where, args[0]!.column); return undefined
      case 'number of noise frequencies': this.noiseCount = this.frequencyLimited(count('a whole number of noise frequencies, 1 or more'), where, args[0]!.column); return undefined
      case 'reference': {
        if (this.ports === undefined) this.fail('bad-keyword', '[Reference] before [Number of Ports]', where, first + 1)
        this.references = []
        this.missingReferences = this.ports!
        this.readHeaderNumbers(text.slice(0, close + 1).replace(/./g, ' ') + text.slice(close + 1), where)
        return undefined
      }
      case 'matrix format': {
        const value = arg('Full, Lower or Upper')
        if (value !== 'full' && value !== 'lower' && value !== 'upper') this.fail('bad-keyword', `[Matrix Format] must be Full, Lower or Upper, got '${quoteToken(args[0]!.text)}'`, where, args[0]!.column)
        this.matrix = value as MatrixFormat
        return undefined
      }
      case 'mixed-mode order': this.fail('unsupported', 'mixed-mode data is not supported (expected single-ended S-parameters)', where, first + 1)
      // falls through: fail() never returns
      case 'begin information': this.isInInfo = true; return undefined
      case 'network data': return this.startNetworkData(where, first)
      case 'noise data': {
        if (!reader) this.fail('bad-keyword', '[Noise Data] before [Network Data]', where, first + 1)
        if (this.ports !== 2) this.fail('bad-keyword', 'only a two-port file may have [Noise Data]', where, first + 1)
        if (this.noiseCount === undefined) this.fail('bad-keyword', '[Noise Data] without [Number of Noise Frequencies]', where, first + 1)
        this.checkNetworkCount(reader!, where.lineNumber)
        reader!.startNoiseBlock()
        return undefined
      }
      case 'end':
        if (reader) this.checkCounts(reader, where.lineNumber)
        this.hasEnded = true
        return undefined
      default:
        this.fail('unknown-keyword', `unknown keyword [${named}]`, where, first + 1)
    }
  }

  /** Numbers outside the data sections: only the continuation of a [Reference] list is allowed. */
  readHeaderNumbers(text: string, where: LineContext): void {
    if (this.missingReferences === 0) {
      this.fail('bad-keyword', 'numbers before [Network Data] (expected a keyword line or the option line)', where)
    }
    const count = scanNumbers(text, text.length, this.scratch, 0, where)
    if (count > this.missingReferences) this.fail('bad-keyword', `[Reference] has more values than the ${this.ports} ports`, where)
    for (let k = 0; k < count; k++) {
      const ohms = this.scratch[k]!
      if (!(ohms > 0)) this.fail('bad-keyword', `reference resistance ${ohms} must be positive`, where)
      this.references!.push(ohms)
    }
    this.missingReferences -= count
  }

  /** Checks made when the file ends. */
  finish(reader: RecordReader | undefined, warnings: string[], lineCount: number): void {
    if (!this.options) throw new TouchstoneError('missing-option-line', 'no option line (expected e.g. "# GHz S MA R 50" after [Version])', this.fileName, null)
    if (!this.sawNetworkData) throw new TouchstoneError('no-data', 'no [Network Data] section', this.fileName, null)
    if (!this.hasEnded) {
      warnings.push('the file has no [End] line')
      if (reader) this.checkCounts(reader, lineCount)
    }
  }

  referenceOhms(fallback: number): number[] {
    return this.references ?? new Array(this.ports ?? 1).fill(fallback)
  }

  private startNetworkData(where: LineContext, first: number): RecordReader {
    const missing = (what: string): never => this.fail('bad-keyword', `[Network Data] before ${what}`, where, first + 1)
    if (this.sawNetworkData) this.fail('bad-keyword', '[Network Data] given twice', where, first + 1)
    if (!this.options) missing('the option line')
    if (this.ports === undefined) missing('[Number of Ports]')
    if (this.frequencyCount === undefined) missing('[Number of Frequencies]')
    if (this.ports === 2 && !this.order) missing('[Two-Port Data Order] (required for two-port files)')
    this.sawNetworkData = true
    const layout = makeLayout(this.ports!, { matrix: this.matrix, order21Before12: this.order === '21_12', canWrap: true })
    return new RecordReader(layout, this.options!.format, this.options!.unit, this.fileName, this.limits.maxFrequencies)
  }

  private checkNetworkCount(reader: RecordReader, line: number): void {
    if (this.isNetworkCounted) return
    this.isNetworkCounted = true
    reader.finish()
    if (reader.frequencies.length !== this.frequencyCount) {
      throw new TouchstoneError('frequency-count', `[Number of Frequencies] is ${this.frequencyCount} but [Network Data] holds ${reader.frequencies.length}`, this.fileName, line)
    }
  }

  private checkCounts(reader: RecordReader, line: number): void {
    this.checkNetworkCount(reader, line)
    reader.finish()
    const noise = reader.noise.length
    if ((this.noiseCount ?? 0) !== noise) {
      throw new TouchstoneError('frequency-count', `[Number of Noise Frequencies] is ${this.noiseCount ?? 0} but [Noise Data] holds ${noise}`, this.fileName, line)
    }
  }

  private frequencyLimited(n: number, where: LineContext, column: number): number {
    if (n > this.limits.maxFrequencies) this.fail('too-many-frequencies', `${n} frequencies: this reader takes at most ${this.limits.maxFrequencies}`, where, column)
    return n
  }

  private fail(code: 'bad-keyword' | 'unknown-keyword' | 'unsupported' | 'port-count' | 'too-many-frequencies', detail: string, where: LineContext, column?: number): never {
    throw new TouchstoneError(code, detail, this.fileName, where.lineNumber, column)
  }
}
