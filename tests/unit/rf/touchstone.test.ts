// Touchstone reading and writing. The reference files (tests/fixtures/reference/touchstone, outside the
// repo) are checked against their expected.json; the v2 files below are our own invented data,
// written inline, with the expected values worked out here from the numbers in the text.
import { readFileSync, readdirSync } from 'node:fs'
import { REFERENCE_ROOT } from '../../support/reference'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  TouchstoneError, parseTouchstone, writeTouchstone, RfInputError,
  type Complex, type DataFormat, type FrequencyUnit, type TouchstoneData,
} from '../../../shared/rf/index'
import { complexError } from './reference'

const REFERENCE_DIR = path.resolve(REFERENCE_ROOT, 'touchstone')
const SOURCE = 'reference touchstone/expected.json, read back by scikit-rf 0.15.4 and an independent strict reader'

type Pair = [number, number]
interface ValidCase { file: string, ports: number, parameter: string, format: string, z0: number, freqHz: number[], s: Pair[][][], noise?: { freqHz: number, nfminDb: number, gammaOpt: Pair, rnNormalized: number }[] }
interface MalformedCase { file: string, why: string, error: { code: string, line: number | null, message: string } }
const expected = JSON.parse(readFileSync(path.join(REFERENCE_DIR, 'expected.json'), 'utf8')) as
  { valid: ValidCase[], malformed: MalformedCase[], tolerance: { freqRel: number, sRel: number } }

const readReference = (file: string) => readFileSync(path.join(REFERENCE_DIR, file), 'utf8')
const c = (re: number, im: number): Complex => ({ re, im })
const polar = (magnitude: number, deg: number): Complex => c(magnitude * Math.cos(deg * Math.PI / 180), magnitude * Math.sin(deg * Math.PI / 180))

/** Relative complex distance with an absolute floor near zero (floor = 1e-6 × absFloor in complexError). */
function expectClose(actual: Complex, wanted: Complex, rel: number, label: string): void {
  expect(complexError(actual, wanted, rel * 1e-6), `${label}: got ${actual.re}${actual.im >= 0 ? '+' : ''}${actual.im}j, want ${wanted.re}${wanted.im >= 0 ? '+' : ''}${wanted.im}j`).toBeLessThanOrEqual(rel)
}

function expectRelClose(actual: number, wanted: number, rel: number, label: string): void {
  expect(Math.abs(actual - wanted), `${label}: got ${actual}, want ${wanted}`).toBeLessThanOrEqual(rel * Math.max(Math.abs(wanted), 1e-300))
}

function expectError(run: () => unknown, code: string, line: number | null, column?: number): TouchstoneError {
  try {
    run()
  }
  catch (error) {
    expect(error).toBeInstanceOf(TouchstoneError)
    const e = error as TouchstoneError
    expect(e.code, e.message).toBe(code)
    expect(e.line, e.message).toBe(line)
    if (column !== undefined) expect(e.column, e.message).toBe(column)
    if (line !== null) expect(e.message).toContain(`line ${line}`)
    return e
  }
  throw new Error(`expected a '${code}' error, the file was accepted`)
}

describe(`reference files (${SOURCE})`, () => {
  it('has an entry in expected.json for every file in the folder', () => {
    const listed = new Set([...expected.valid, ...expected.malformed].map(entry => entry.file))
    const files = readdirSync(REFERENCE_DIR).filter(name => name !== 'expected.json')
    expect(files.filter(name => !listed.has(name))).toEqual([])
    expect(files.length).toBeGreaterThanOrEqual(20)
  })

  it.each(expected.valid.map(v => [v.file, v] as const))('%s gives the expected frequencies and values', (file, want) => {
    const got = parseTouchstone(readReference(file), file)
    expect(got.ports).toBe(want.ports)
    expect(got.parameter).toBe(want.parameter)
    expect(got.format).toBe(want.format)
    expect(got.z0).toBe(want.z0)
    expect(got.frequencies).toHaveLength(want.freqHz.length)
    expect(got.s).toHaveLength(want.s.length)
    want.freqHz.forEach((f, k) => expectRelClose(got.frequencies[k]!, f, expected.tolerance.freqRel, `f[${k}]`))
    want.s.forEach((matrix, k) => matrix.forEach((row, i) => row.forEach(([re, im], j) => {
      expectClose(got.s[k]![i]![j]!, c(re, im), expected.tolerance.sRel, `${file} s[${k}][${i}][${j}]`)
    })))
    expect(got.noise).toHaveLength(want.noise?.length ?? 0)
  })

  it('keeps the noise block of amp_noise_ghz.s2p apart from the S data', () => {
    const want = expected.valid.find(v => v.file === 'amp_noise_ghz.s2p')!
    const got = parseTouchstone(readReference(want.file), want.file)
    expect(got.frequencies.at(-1)).toBe(3e9)
    want.noise!.forEach((row, k) => {
      const noise = got.noise[k]!
      expectRelClose(noise.frequencyHz, row.freqHz, 1e-12, `noise f[${k}]`)
      expectRelClose(noise.nfminDb, row.nfminDb, 1e-12, `NFmin[${k}]`)
      expectRelClose(noise.rnNormalized, row.rnNormalized, 1e-12, `Rn[${k}]`)
      expectClose(noise.gammaOpt, c(...row.gammaOpt), 1e-12, `Gopt[${k}]`)
    })
  })

  it.each(expected.malformed.map(m => [m.file, m] as const))('%s fails with the expected error and line', (file, want) => {
    const error = expectError(() => parseTouchstone(readReference(file), file), want.error.code, want.error.line)
    expect(error.message).toContain(want.error.message)
    expect(error.message).toContain(file)
    expect(error).toBeInstanceOf(RfInputError)
  })
})

describe('Touchstone 1 details', () => {
  const body = '800 0.1 0.2\n810 0.3 -0.4\n'

  it('reads option tokens in any order and case, and takes the defaults GHz S MA R 50', () => {
    const a = parseTouchstone(`#  r 75  Ri mHz\n${body}`, 'a.s1p')
    expect([a.frequencyUnit, a.format, a.parameter, a.z0]).toEqual(['MHZ', 'RI', 'S', 75])
    expect(a.frequencies).toEqual([800e6, 810e6])
    const b = parseTouchstone('#\n1 0.5 90\n', 'b.s1p')
    expect([b.frequencyUnit, b.format, b.z0]).toEqual(['GHZ', 'MA', 50])
    expectClose(b.s[0]![0]![0]!, c(0, 0.5), 1e-12, 'defaults')
  })

  it('takes any positive reference resistance and a Z or Y parameter as written', () => {
    const got = parseTouchstone('# khz z ri r 12.5e0\n1 0.25 1\n', 'z.s1p')
    expect([got.parameter, got.z0, got.frequencies[0]]).toEqual(['Z', 12.5, 1000])
  })

  it.each([
    ['# MHz S RI R 50 GHz', 'bad-option-line', 17],
    ['# MHz S RI R -50', 'bad-option-line', 14],
    ['# MHz S RI R 0x32', 'bad-option-line', 14],
    ['# MHz S RI DB', 'bad-option-line', 12],
    ['# MHz S S RI', 'bad-option-line', 9],
  ])('refuses the option line %j', (option, code, column) => {
    expectError(() => parseTouchstone(`! header\n${option}\n${body}`, 'x.s1p'), code, 2, column)
  })

  it.each([
    ['0x10', 5], ['Infinity', 5], ['1e', 5], ['1.2.3', 5], ['NaN', 5], ['--1', 5], ['1,5', 5],
  ])('refuses the token %j with its line and column', (token, column) => {
    expectError(() => parseTouchstone(`# MHz S RI R 50\n800 ${token} 0.2\n`, 'x.s1p'), 'non-numeric', 2, column)
  })

  it('accepts .5, 5., +1e-3 and capital E exponents', () => {
    const got = parseTouchstone('# Hz S RI R 50\n1 .5 5.\n2 +1e-3 -2.5E+1\n', 'x.s1p')
    expectClose(got.s[0]![0]![0]!, c(0.5, 5), 1e-15, 'row 1')
    expectClose(got.s[1]![0]![0]!, c(0.001, -25), 1e-15, 'row 2')
  })

  it('gives the same result for CRLF line endings and a byte-order mark', () => {
    const lf = parseTouchstone(readReference('amp_ri_ghz.s2p'), 'amp.s2p')
    const crlf = parseTouchstone(`\uFEFF${readReference('amp_ri_ghz.s2p').replace(/\n/g, '\r\n')}`, 'amp.s2p')
    expect(crlf).toEqual(lf)
  })

  it('needs the option line before the data, and a port count from the name', () => {
    expectError(() => parseTouchstone('! x\n800 0.1 0.2\n# MHz S RI R 50\n', 'x.s1p'), 'missing-option-line', 2)
    expectError(() => parseTouchstone(`# MHz S RI R 50\n${body}`, 'antenna.txt'), 'unknown-port-count', null)
  })

  it('ignores a second option line with a warning', () => {
    const got = parseTouchstone(`# MHz S RI R 50\n800 0.1 0.2\n# GHz S MA R 75\n810 0.3 0.4\n`, 'x.s1p')
    expect(got.frequencies).toEqual([800e6, 810e6])
    expect(got.warnings).toHaveLength(1)
  })

  it('refuses a 1- or 2-port row wrapped over two lines', () => {
    expectError(() => parseTouchstone('# MHz S RI R 50\n800 0.1\n0.2\n', 'x.s1p'), 'wrong-column-count', 2)
    expectError(() => parseTouchstone('# GHz S RI R 50\n1 0.1 0.2 3 0.1\n0.01 0.02 0.3 -0.1\n', 'x.s2p'), 'wrong-column-count', 2)
  })

  it('refuses negative frequencies and a repeated frequency', () => {
    expectError(() => parseTouchstone('# Hz S RI R 50\n-1 0.1 0.2\n', 'x.s1p'), 'negative-frequency', 2, 1)
    expectError(() => parseTouchstone('# Hz S RI R 50\n1 0.1 0.2\n  1 0.1 0.2\n', 'x.s1p'), 'frequency-not-increasing', 3, 3)
  })

  it('reads a 3-port file with each matrix row on its own line (row-major order)', () => {
    const text = [
      '# GHz S RI R 50',
      '1.0  0.11 0.01  0.12 0.02  0.13 0.03',
      '     0.21 0.04  0.22 0.05  0.23 0.06',
      '     0.31 0.07  0.32 0.08  0.33 0.09 ! row 3',
      '2.0  1 0  2 0  3 0',
      '     4 0  5 0  6 0',
      '     7 0  8 0  9 0',
    ].join('\n')
    const got = parseTouchstone(text, 'split.s3p')
    expect(got.ports).toBe(3)
    expect(got.frequencies).toEqual([1e9, 2e9])
    expectClose(got.s[0]![1]![2]!, c(0.23, 0.06), 1e-15, 'S23 at 1 GHz')
    expectClose(got.s[0]![2]![0]!, c(0.31, 0.07), 1e-15, 'S31 at 1 GHz')
    expect(got.s[1]!.map(row => row.map(v => v.re))).toEqual([[1, 2, 3], [4, 5, 6], [7, 8, 9]])
  })

  it('reads a 4-port file wrapped at four values per line', () => {
    const rows = [1, 2, 3, 4].map(i => `${[1, 2, 3, 4].map(j => `${i}${j} -${j}`).join(' ')}`)
    const text = `# MHz S RI R 50\n100 ${rows[0]}\n${rows.slice(1).join('\n')}\n`
    const got = parseTouchstone(text, 'x.s4p')
    expect(got.s[0]!.map(row => row.map(v => v.re))).toEqual([[11, 12, 13, 14], [21, 22, 23, 24], [31, 32, 33, 34], [41, 42, 43, 44]])
    expectError(() => parseTouchstone(`${text}200 1 2\n`, 'x.s4p'), 'wrong-column-count', 6)
    expectError(() => parseTouchstone(`# MHz S RI R 50\n100 ${rows.join(' ')} 7\n`, 'x.s4p'), 'wrong-column-count', 2)
  })

  it('keeps the noise rows of a two-port apart and checks them too', () => {
    const s2p = '# GHz S MA R 50\n1 0.5 10 2 20 0.1 30 0.4 40\n2 0.5 10 2 20 0.1 30 0.4 40\n'
    const got = parseTouchstone(`${s2p}1 0.9 0.5 45 0.2\n1.5 1.1 0.4 90 0.3\n`, 'x.s2p')
    expect(got.frequencies).toEqual([1e9, 2e9])
    expect(got.noise.map(n => n.frequencyHz)).toEqual([1e9, 1.5e9])
    expectClose(got.noise[1]!.gammaOpt, c(0, 0.4), 1e-12, 'Gopt at 1.5 GHz')
    expectClose(got.s[1]![1]![0]!, polar(2, 20), 1e-12, 'S21 is the second pair')
    expectClose(got.s[1]![0]![1]!, polar(0.1, 30), 1e-12, 'S12 is the third pair')
    expectError(() => parseTouchstone(`${s2p}3 0.9 0.5 45 0.2\n`, 'x.s2p'), 'wrong-column-count', 4)
    expectError(() => parseTouchstone(`${s2p}1 0.9 0.5 45 0.2\n0.5 1 0.5 45 0.2\n`, 'x.s2p'), 'frequency-not-increasing', 5)
    expectError(() => parseTouchstone(`${s2p}1 0.9 0.5 45 0.2\n3 0.5 10 2 20 0.1 30 0.4 40\n`, 'x.s2p'), 'wrong-column-count', 5)
  })
})

describe('Touchstone 2.0 (our own invented data)', () => {
  const twoPort = (order: string, extra = '') => [
    '! Brackwater gateway 2.4 GHz module output, invented numbers',
    '[Version] 2.0',
    '# GHz S RI R 50',
    '[Number of Ports] 2',
    `[Two-Port Data Order] ${order}`,
    '[Number of Frequencies] 2',
    extra,
    '[Network Data]',
    '2.40 0.11 0.01 0.21 0.02',
    '     0.12 0.03 0.22 0.04',
    '2.48 0.31 0.05 0.41 0.06 0.32 0.07 0.42 0.08',
    '[End]',
  ].join('\n')

  it('reads 12_21 order (S11 S12 S21 S22) with a record wrapped over two lines', () => {
    const got = parseTouchstone(twoPort('12_21'), 'gateway.ts')
    expect([got.version, got.ports, got.frequencies]).toEqual(['2.0', 2, [2.4e9, 2.48e9]])
    expectClose(got.s[0]![0]![1]!, c(0.21, 0.02), 1e-15, 'S12')
    expectClose(got.s[0]![1]![0]!, c(0.12, 0.03), 1e-15, 'S21')
    expectClose(got.s[1]![1]![1]!, c(0.42, 0.08), 1e-15, 'S22')
  })

  it('reads 21_12 order (S11 S21 S12 S22)', () => {
    const got = parseTouchstone(twoPort('21_12'), 'gateway.s2p')
    expectClose(got.s[0]![1]![0]!, c(0.21, 0.02), 1e-15, 'S21')
    expectClose(got.s[0]![0]![1]!, c(0.12, 0.03), 1e-15, 'S12')
  })

  it('takes per-port references from [Reference], over several lines', () => {
    const got = parseTouchstone(twoPort('12_21', '[Reference] 50\n   75'), 'gateway.ts')
    expect(got.referenceOhms).toEqual([50, 75])
    expect(got.z0).toBe(50)
    expectError(() => parseTouchstone(twoPort('12_21', '[Reference] 50'), 'g.ts'), 'bad-keyword', 8)
  })

  it('skips an information block and reads a lower-triangle matrix as symmetric', () => {
    const text = [
      '[Version] 2.0', '# MHz S MA R 50', '[Number of Ports] 3', '[Number of Frequencies] 1',
      '[Matrix Format] Lower', '[Begin Information]', 'anything 1 2 3 [Whatever]', '[End Information]',
      '[Network Data]', '915 0.1 0', '0.2 90 0.3 0', '0.4 180 0.5 -90 0.6 0', '[End]',
    ].join('\n')
    const got = parseTouchstone(text, 'splitter.ts')
    expectClose(got.s[0]![0]![1]!, c(0, 0.2), 1e-12, 'S12 mirrors S21')
    expectClose(got.s[0]![2]![0]!, c(-0.4, 0), 1e-12, 'S31')
    expectClose(got.s[0]![1]![2]!, c(0, -0.5), 1e-12, 'S23 mirrors S32')
  })

  it('reads [Noise Data] apart from the network data', () => {
    const text = twoPort('12_21', '[Number of Noise Frequencies] 2').replace('[End]', '[Noise Data]\n2.4 1.2 0.3 60 0.25\n2.5 1.3 0.28 65 0.24\n[End]')
    const got = parseTouchstone(text, 'lna.ts')
    expect(got.s).toHaveLength(2)
    expect(got.noise.map(n => n.nfminDb)).toEqual([1.2, 1.3])
    expectClose(got.noise[0]!.gammaOpt, polar(0.3, 60), 1e-12, 'Gopt')
  })

  it.each([
    ['a count that does not match', twoPort('12_21').replace('[Number of Frequencies] 2', '[Number of Frequencies] 3'), 'frequency-count', 12],
    ['no [Two-Port Data Order]', twoPort('12_21').replace('[Two-Port Data Order] 12_21', ''), 'bad-keyword', 8],
    ['an unknown keyword', twoPort('12_21', '[Colour] teal'), 'unknown-keyword', 7],
    ['version 3.0', twoPort('12_21').replace('[Version] 2.0', '[Version] 3.0'), 'unsupported', 2],
    ['mixed-mode data', twoPort('12_21', '[Mixed-Mode Order] D2,1 C2,1'), 'unsupported', 7],
    ['a record running into the next frequency', twoPort('12_21').replace('0.12 0.03 0.22 0.04', '0.12 0.03 0.22 0.04 2.44'), 'wrong-column-count', 10],
    ['numbers before [Network Data]', twoPort('12_21', '1 2 3'), 'bad-keyword', 7],
  ])('refuses %s', (_what, text, code, line) => {
    expectError(() => parseTouchstone(text, 'bad.ts'), code, line)
  })

  it('refuses keywords in a Touchstone 1 file', () => {
    expectError(() => parseTouchstone('# MHz S RI R 50\n[Number of Ports] 1\n800 0.1 0.2\n', 'x.s1p'), 'bad-keyword', 2, 1)
  })
})

describe('writeTouchstone → parseTouchstone round trip (seeded)', () => {
  const random = seedrandom('brackwater-touchstone-round-trip')
  const formats: DataFormat[] = ['RI', 'MA', 'DB']
  const units: FrequencyUnit[] = ['HZ', 'KHZ', 'MHZ', 'GHZ']

  function randomNetwork(ports: number, points: number): Pick<TouchstoneData, 'ports' | 'z0' | 'frequencies' | 's'> {
    let f = 1e6 + random() * 1e8
    const frequencies: number[] = []
    const s: Complex[][][] = []
    for (let k = 0; k < points; k++) {
      f += 1 + random() * 5e7
      frequencies.push(f)
      s.push(Array.from({ length: ports }, () => Array.from({ length: ports }, () => c((random() - 0.5) * 3, (random() - 0.5) * 3))))
    }
    return { ports, z0: 10 + random() * 90, frequencies, s }
  }

  for (const format of formats) {
    for (const unit of units) {
      it(`returns the same data in ${format} and ${unit} for 1, 2, 3 and 5 ports`, () => {
        for (const ports of [1, 2, 3, 5]) {
          const network = randomNetwork(ports, 7)
          const noise = ports === 2 ? [{ frequencyHz: network.frequencies[0]!, nfminDb: 0.7, gammaOpt: c(0.1, -0.3), rnNormalized: 0.2 }] : undefined
          const text = writeTouchstone({ ...network, format, unit, comment: 'Brackwater soil node\nround trip', noise })
          expect(text.split('\n').find(line => line.startsWith('#'))).toBe(`# ${unit} S ${format} R ${network.z0}`)
          const back = parseTouchstone(text, `trip.s${ports}p`)
          expect([back.ports, back.format, back.frequencyUnit]).toEqual([ports, format, unit])
          expectRelClose(back.z0, network.z0, 0, 'z0')
          network.frequencies.forEach((f0, k) => expectRelClose(back.frequencies[k]!, f0, 1e-12, `f[${k}]`))
          network.s.forEach((m, k) => m.forEach((row, i) => row.forEach((v, j) => expectClose(back.s[k]![i]![j]!, v, 1e-12, `${ports}-port s[${k}][${i}][${j}]`))))
          if (noise) expectClose(back.noise[0]!.gammaOpt, noise[0]!.gammaOpt, 1e-12, 'noise Gopt')
        }
      })
    }
  }

  it('writes an exact zero in DB as a vanishing magnitude that reads back near zero', () => {
    const text = writeTouchstone({ ports: 1, z0: 50, frequencies: [1e9], s: [[[c(0, 0)]]], format: 'DB', unit: 'GHZ' })
    expect(Math.hypot(parseTouchstone(text, 'z.s1p').s[0]![0]![0]!.re)).toBeLessThan(1e-40)
  })

  it('refuses data it cannot write, naming the argument', () => {
    const base = { ports: 1, z0: 50, frequencies: [1e9, 2e9], s: [[[c(0.1, 0)]], [[c(0.2, 0)]]] }
    expect(() => writeTouchstone({ ...base, frequencies: [2e9, 1e9] })).toThrow(/frequencies\[1\]/)
    expect(() => writeTouchstone({ ...base, z0: 0 })).toThrow(/z0/)
    expect(() => writeTouchstone({ ...base, s: [[[c(Number.NaN, 0)]], [[c(0.2, 0)]]] })).toThrow(/s\[0\]\[0\]\[0\]/)
    expect(() => writeTouchstone({ ...base, ports: 2 })).toThrow(RfInputError)
  })
})

describe('limits: what a file may make the reader hold', () => {
  it('refuses a port count past the limit from the file name, on the first data line, before laying anything out', () => {
    const error = expectError(() => parseTouchstone('! probe\n# GHz S RI R 50\n1 0 0\n', 'x.s12000p'), 'port-count', 3)
    expect(error.message).toContain('12000 ports')
    expectError(() => parseTouchstone('# GHz S RI R 50\n1 0 0 0 0 0 0\n0 0 0 0 0 0\n0 0 0 0 0 0\n', 'triple.s3p', { maxPorts: 2 }), 'port-count', 2)
  })

  it('refuses a huge [Number of Ports] on its own line, with the column of the value', () => {
    const text = ['[Version] 2.0', '# GHz S RI R 50', '[Number of Ports] 1000000000', '[Number of Frequencies] 1', '[Network Data]', '1 0 0', '[End]'].join('\n')
    expectError(() => parseTouchstone(text, 'big.ts'), 'port-count', 3, 19)
    expectError(() => parseTouchstone(text.replace('1000000000', '3'), 'big.ts', { maxPorts: 2 }), 'port-count', 3, 19)
  })

  it('stops at the first frequency past maxFrequencies, in the data and in [Number of Frequencies]', () => {
    const rows = Array.from({ length: 5 }, (_, k) => `${k + 1} 0.1 0.2`).join('\n')
    expect(parseTouchstone(`# GHz S RI R 50\n${rows}\n`, 'a.s1p', { maxFrequencies: 5 }).frequencies).toHaveLength(5)
    expectError(() => parseTouchstone(`# GHz S RI R 50\n${rows}\n`, 'a.s1p', { maxFrequencies: 4 }), 'too-many-frequencies', 6)
    const v2 = ['[Version] 2.0', '# GHz S RI R 50', '[Number of Ports] 1', '[Number of Frequencies] 99999999', '[Network Data]', '1 0 0', '[End]'].join('\n')
    expectError(() => parseTouchstone(v2, 'a.ts', { maxFrequencies: 1000 }), 'too-many-frequencies', 4, 25)
  })

  it('quotes at most 40 characters of a bad token, keyword or file name', () => {
    const token = 'x'.repeat(1_000_000)
    const bad = expectError(() => parseTouchstone(`# MHz S RI R 50\n800 0.1 ${token}\n`, 'a.s1p'), 'non-numeric', 2, 9)
    expect(bad.message.length).toBeLessThan(300)
    const keyword = expectError(() => parseTouchstone(`[Version] 2.0\n[${token}]\n`, 'a.ts'), 'unknown-keyword', 2, 1)
    expect(keyword.message.length).toBeLessThan(300)
    const name = expectError(() => parseTouchstone('# MHz S RI R 50\n800 0.1 0.2\n', `${token}.txt`), 'unknown-port-count', null)
    expect(name.message.length).toBeLessThan(400)
  })
})
