import { describe, expect, it } from 'vitest'
import { formatEng, parseEng } from '../../../shared/rf/index'

describe('formatEng', () => {
  it.each([
    [4.7e-12, 'F', '4.7 pF'],
    [12e-9, 'H', '12 nH'],
    [2.45e9, 'Hz', '2.45 GHz'],
    [915e6, 'Hz', '915 MHz'],
    [50, 'Ω', '50 Ω'],
    [2.2e-6, 'H', '2.2 µH'],
    [1.5e-15, 'F', '1.5 fF'],
    [0.0331, 'S', '33.1 mS'],
    [4700, 'Ω', '4.7 kΩ'],
    [1.23456e-9, 'H', '1.23 nH'],
    [999.96, 'Ω', '1 kΩ'],
    [-3.3e-9, 'H', '-3.3 nH'],
    [0, 'F', '0 F'],
    [Infinity, 'Ω', '∞ Ω'],
    [1e-18, 'F', '0.001 fF'],
  ])('%s %s → %s', (v, unit, text) => expect(formatEng(v, unit)).toBe(text))

  it('takes the number of significant figures', () => {
    expect(formatEng(38.98484e-9, 'H', 5)).toBe('38.985 nH')
    expect(() => formatEng(NaN, 'F')).toThrow(/value/)
  })
})

describe('parseEng', () => {
  it.each([
    ['4.7p', 4.7e-12], ['12n', 12e-9], ['2.45G', 2.45e9], ['50', 50], ['4.7 pF', 4.7e-12],
    ['1e-12', 1e-12], ['2.2u', 2.2e-6], ['2.2µ', 2.2e-6], ['2.2μ', 2.2e-6], ['10 kΩ', 1e4],
    ['915 MHz', 915e6], ['  33  ', 33], ['.5n', 0.5e-9], ['-1.5m', -1.5e-3], ['1.2e3k', 1.2e6],
    ['68 nH', 68e-9], ['3 mH', 3e-3], ['50 ohm', 50], ['5 F', 5],
  ])('%s → %s', (text, value) => expect(parseEng(text)).toBe(value))

  it.each([
    ['', /empty/],
    ['abc', /does not start with a number/],
    ['1k5', /digits after the prefix "k"/],
    ['4.7 PF', /unknown prefix or unit "PF"/],
    ['3 pX', /unknown unit "X"/],
    ['4.7.1', /unknown prefix or unit/],
    ['1e999', /too large/],
  ])('rejects %j with a message saying what is wrong', (text, message) => {
    expect(() => parseEng(text)).toThrow(message)
  })

  it('reads back what formatEng writes', () => {
    for (const v of [4.7e-12, 1.8e-9, 2.45e9, 50, 0.0331, 470e3]) expect(parseEng(formatEng(v, 'F'))).toBeCloseTo(v, 20)
  })
})
