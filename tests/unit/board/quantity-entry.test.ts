import { describe, expect, it } from 'vitest'
import { UNIT_QUANTITY, readEng, type Quantity } from '../../../shared/rf/units'
import {
  ValueEntryError, placeholderOf, readEntry, type EntryField,
} from '../../../shared/board/quantity-entry'
import { settingsEntry, settingsFieldOf, terminalEntry, terminalFieldOf } from '../../../shared/board/entry'
import { entryFieldOf, readFieldValue } from '../../../shared/board/element-values'
import { parsePowerW, parseQ, parseRating, parseTolerance } from '../../../shared/board/real-parts'
import { DEFAULT_SETTINGS } from '../../../shared/board/schema'

// One field of each quantity the board reads, as the board's own fields define them.
const FIELDS: Record<Quantity, EntryField | null> = {
  frequency: settingsFieldOf('frequencyHz'),
  inductance: entryFieldOf('L', 'value'),
  capacitance: entryFieldOf('C', 'value'),
  resistance: settingsFieldOf('z0'),
  conductance: null, // no field takes a conductance; its unit is still refused elsewhere
  power: { what: 'Source power', quantity: 'power', unit: 'W' },
  voltage: { what: 'A voltage rating', quantity: 'voltage', unit: 'V' },
  current: { what: 'A current rating', quantity: 'current', unit: 'A' },
  level: settingsFieldOf('minReturnLossDb'),
  angle: entryFieldOf('line', 'deg'),
  percent: { what: 'Tolerance', quantity: 'percent', unit: '%' },
  ratio: entryFieldOf('xfmr', 'ratio'),
  number: entryFieldOf('L', 'q'),
}
// A typed example of every unit symbol, with the quantity it is.
const EXAMPLES: [string, Quantity][] = [
  ['915 MHz', 'frequency'], ['5 nH', 'inductance'], ['5 pF', 'capacitance'], ['75 Ω', 'resistance'],
  ['75 ohm', 'resistance'], ['20 mS', 'conductance'], ['3 W', 'power'], ['27 dBm', 'power'],
  ['12 V', 'voltage'], ['300 mA', 'current'], ['10 dB', 'level'], ['45°', 'angle'], ['45 deg', 'angle'],
  ['5%', 'percent'], ['2:1', 'ratio'],
]

describe('readEng', () => {
  it('names the unit typed, in canonical form', () => {
    expect(readEng('915 MHz')).toEqual({ value: 915e6, unit: 'Hz', hasPrefix: true })
    expect(readEng('915')).toEqual({ value: 915, unit: '', hasPrefix: false })
    expect(readEng('75 Ohms')).toEqual({ value: 75, unit: 'Ω', hasPrefix: false })
    expect(readEng('2.45 GHZ').unit).toBe('Hz')
    expect(readEng('12n')).toEqual({ value: 12e-9, unit: '', hasPrefix: true })
  })
  it('knows the quantity of every unit it reads', () => {
    for (const [text, quantity] of EXAMPLES) expect(UNIT_QUANTITY[readEng(text).unit], text).toBe(quantity)
  })
  it('refuses a prefix on a unit that takes none', () => {
    expect(() => readEng('3 kdBm')).toThrow(/unknown unit/)
    expect(() => readEng('5 m%')).toThrow(/unknown unit/)
  })
})

describe('readEntry: a unit of another quantity is refused, naming both', () => {
  const cases: [Quantity, string, Quantity][] = []
  for (const [field, spec] of Object.entries(FIELDS) as [Quantity, EntryField | null][]) {
    if (!spec) continue
    for (const [text, quantity] of EXAMPLES) if (quantity !== field) cases.push([field, text, quantity])
  }
  it.each(cases)('a %s field refuses %j (%s)', (field, text, typed) => {
    const spec = FIELDS[field]!
    expect(() => readEntry(text, spec)).toThrow(ValueEntryError)
    const message = (() => { try { readEntry(text, spec) } catch (e) { return (e as Error).message } return '' })()
    const words: Record<Quantity, RegExp> = {
      frequency: /a frequency/, inductance: /an inductance/, capacitance: /a capacitance/,
      resistance: /a resistance or impedance/, conductance: /a conductance/, power: /a power/,
      voltage: /a voltage/, current: /a current/, level: /a level in dB/, angle: /an angle/,
      percent: /a percentage/, ratio: /a ratio/, number: /a plain number/,
    }
    expect(message).toMatch(spec.what)
    expect(message).toMatch(words[field])
    expect(message).toMatch(words[typed])
  })
  it('says it for the reported slips: a capacitance into an inductor, into Z0', () => {
    expect(() => readFieldValue('L', 'value', '5 pF')).toThrow(/Inductance takes an inductance \(nH\), but “5 pF” is a capacitance/)
    expect(() => settingsEntry(DEFAULT_SETTINGS, 'z0', '75 pF')).toThrow(/Z0 takes a resistance or impedance \(Ω\), but “75 pF” is a capacitance/)
  })
})

describe('readEntry: a bare number is in the unit the field shows', () => {
  it.each([
    [settingsFieldOf('frequencyHz'), '915', 915e6],
    [settingsFieldOf('bandStartHz'), '2400', 2.4e9],
    [entryFieldOf('L', 'value'), '12', 12e-9],
    [entryFieldOf('C', 'value'), '4.7', 4.7e-12],
    [entryFieldOf('R', 'value'), '50', 50],
    [settingsFieldOf('z0'), '75', 75],
    [terminalFieldOf('l'), '3.3', 3.3e-9],
    [terminalFieldOf('c'), '2.2', 2.2e-12],
    [terminalFieldOf('x'), '-40', -40],
    [entryFieldOf('line', 'deg'), '90', 90],
    [entryFieldOf('xfmr', 'ratio'), '2', 2],
    [settingsFieldOf('minReturnLossDb'), '14', 14],
  ] as const)('%j reads %j as %s', (field, text, value) => {
    expect(readEntry(text, field).value).toBeCloseTo(value, 20)
  })
  it('reads a prefix alone with the base unit, and a unit as typed', () => {
    expect(readEntry('915M', settingsFieldOf('frequencyHz')).value).toBeCloseTo(915e6, 3)
    expect(readEntry('2.45 GHz', settingsFieldOf('frequencyHz')).value).toBeCloseTo(2.45e9, 3)
    expect(readEntry('1.2 µH', entryFieldOf('L', 'value')).value).toBeCloseTo(1.2e-6, 20)
    expect(readEntry('1k', entryFieldOf('R', 'value')).value).toBe(1000)
  })
  it('says the unit in the placeholder', () => {
    expect(placeholderOf(settingsFieldOf('frequencyHz'))).toBe('number in MHz')
    expect(placeholderOf(entryFieldOf('L', 'value'))).toBe('number in nH')
    expect(placeholderOf(entryFieldOf('C', 'value'))).toBe('number in pF')
    expect(placeholderOf(settingsFieldOf('z0'))).toBe('number in Ω')
  })
})

describe('readEntry: implausible values are kept with a warning', () => {
  it.each([
    ['frequencyHz', '915 Hz', /below the usual 1 kHz/],
    ['frequencyHz', '2 THz', /above the usual/],
    ['z0', '0.5', /below the usual 1 Ω–1 kΩ/],
    ['z0', '2k', /above the usual 1 Ω–1 kΩ/],
  ] as const)('settings %s %j', (field, text, warning) => {
    const got = settingsEntry(DEFAULT_SETTINGS, field, text)
    expect(got.warning).toMatch(warning)
    expect(Object.keys(got.patch)).toEqual([field])
  })
  it.each([
    ['L', '50 pH', /below the usual 100 pH–10 µH/],
    ['L', '22 µH', /above the usual/],
    ['C', '0.05 pF', /below the usual 100 fF–1 µF/],
    ['C', '2 µF', /above the usual/],
    ['C', '1e-30 F', /below the usual/],
  ] as const)('a %s part %j', (kind, text, warning) => {
    expect(readFieldValue(kind, 'value', text).warning).toMatch(warning)
  })
  it('gives no warning inside the usual range, nor on the edges', () => {
    expect(settingsEntry(DEFAULT_SETTINGS, 'frequencyHz', '915').warning).toBeUndefined()
    expect(settingsEntry(DEFAULT_SETTINGS, 'z0', '1k').warning).toBeUndefined()
    expect(readFieldValue('L', 'value', '0.1').warning).toBeUndefined()
    expect(readFieldValue('C', 'value', '1 µF').warning).toBeUndefined()
    expect(terminalEntry({ kind: 'rlc', topology: 'series', r: 5 }, 'l', '10 µH').warning).toBeUndefined()
  })
  it('warns on a terminal part outside the range too', () => {
    expect(terminalEntry({ kind: 'rlc', topology: 'series', r: 5 }, 'c', '5 F').warning).toMatch(/above the usual/)
  })
})

describe('power, ratings, Q and tolerance', () => {
  it('reads watts in the dBm field and dBm in the W field', () => {
    expect(parsePowerW('3 W', 'dBm')).toBeCloseTo(3, 12)
    expect(parsePowerW('500 mW', 'dBm')).toBeCloseTo(0.5, 12)
    expect(parsePowerW('30', 'dBm')).toBeCloseTo(1, 12)
    expect(parsePowerW('-10', 'dBm')).toBeCloseTo(1e-4, 15)
    expect(parsePowerW('27 dBm', 'W')).toBeCloseTo(0.501187, 6)
    expect(parsePowerW('0.5', 'W')).toBe(0.5)
    expect(() => parsePowerW('3 V', 'dBm')).toThrow(/Source power takes a power.*a voltage/)
  })
  it('reads ratings in V and A only', () => {
    expect(parseRating('50', 'V')).toBe(50)
    expect(parseRating('300m', 'A')).toBeCloseTo(0.3, 15)
    expect(() => parseRating('2 A', 'V')).toThrow(/takes a voltage.*a current/)
    expect(() => parseRating('2 V', 'A')).toThrow(/takes a current.*a voltage/)
  })
  it('reads Q as a plain number', () => {
    expect(parseQ('40')).toBe(40)
    expect(() => parseQ('40 nH')).toThrow(/Q takes a plain number.*an inductance/)
  })
  it('reads a bare tolerance as a percentage and an absolute one in the part quantity', () => {
    expect(parseTolerance('5', 'C')).toEqual({ tolerance: 0.05, toleranceAbs: undefined })
    expect(parseTolerance('0.1p', 'C').toleranceAbs).toBeCloseTo(0.1e-12, 25)
    expect(() => parseTolerance('0.1 nH', 'C')).toThrow(/capacitance.*an inductance/)
    expect(() => parseTolerance('5', 'line')).toThrow(/Only inductors/)
  })
})
