import { describe, expect, it } from 'vitest'
import {
  ValueEntryError, elementLabel, formatField, mainFieldOf, parseFieldValue, withFieldValue,
} from '../../../shared/board/element-values'

describe('parseFieldValue', () => {
  it.each([
    ['C', 'value', '4.7p', 4.7e-12],
    ['L', 'value', '12n', 12e-9],
    ['L', 'value', '2.2 nH', 2.2e-9],
    ['C', 'value', '1.5pF', 1.5e-12],
    ['R', 'value', '1k', 1000],
    ['R', 'value', '50 Ω', 50],
    ['R', 'value', '75 ohm', 75],
    ['line', 'deg', '45°', 45],
    ['stub', 'deg', '0', 0],
    ['line', 'z0', '70.7', 70.7],
    ['xfmr', 'ratio', '2:1', 2],
  ] as const)('reads %s %s %j', (kind, field, text, expected) => {
    expect(parseFieldValue(kind, field, text)).toBeCloseTo(expected, 20)
  })

  it.each([
    ['C', 'value', '', /Type a value/],
    ['C', 'value', 'abc', /does not start with a number/],
    ['C', 'value', '4.7q', /unknown prefix/],
    ['C', 'value', '-1p', /greater than zero/],
    ['L', 'value', '0', /greater than zero/],
    ['line', 'deg', '-5', /cannot be negative/],
    ['line', 'z0', '0', /line impedance must be greater than zero/],
    ['xfmr', 'ratio', '0', /turns ratio/],
    ['R', 'value', '1k5', /1\.5k/],
  ] as const)('refuses %s %s %j with a message', (kind, field, text, message) => {
    expect(() => parseFieldValue(kind, field, text)).toThrow(ValueEntryError)
    expect(() => parseFieldValue(kind, field, text)).toThrow(message)
  })
})

describe('fields and labels', () => {
  it('names the field a tile edits', () => {
    expect(mainFieldOf('L')).toBe('value')
    expect(mainFieldOf('stub')).toBe('deg')
    expect(mainFieldOf('xfmr')).toBe('ratio')
  })
  it('formats each kind in its own unit', () => {
    expect(formatField({ kind: 'C', placement: 'shunt', value: 4.7e-12 }, 'value')).toBe('4.7 pF')
    expect(formatField({ kind: 'line', z0: 50, deg: 33.333333 }, 'deg')).toBe('33.33°')
    expect(formatField({ kind: 'xfmr', ratio: 2 }, 'ratio')).toBe('2:1')
  })
  it('sets a field only where the kind has it', () => {
    const line = { kind: 'line', z0: 50, deg: 10 } as const
    expect(withFieldValue(line, 'deg', 20)).toEqual({ kind: 'line', z0: 50, deg: 20 })
    expect(withFieldValue(line, 'value', 20)).toBe(line)
  })
  it('labels elements', () => {
    expect(elementLabel({ kind: 'L', placement: 'series' })).toBe('series L')
    expect(elementLabel({ kind: 'stub', placement: 'shunt', end: 'open' })).toBe('shunt open stub')
  })
})
