import { describe, expect, it } from 'vitest'
import { settingsPatchFor, terminalWithField } from '../../../shared/board/entry'
import { DEFAULT_SETTINGS } from '../../../shared/board/schema'

describe('terminalWithField', () => {
  it('edits R and X of a fixed impedance', () => {
    const t = { kind: 'impedance', z: { re: 18, im: -32 } } as const
    expect(terminalWithField(t, 'x', '-40')).toEqual({ kind: 'impedance', z: { re: 18, im: -40 } })
    expect(terminalWithField(t, 'r', '22 Ω')).toEqual({ kind: 'impedance', z: { re: 22, im: -32 } })
    expect(() => terminalWithField(t, 'r', '-1')).toThrow(/negative/)
    expect(() => terminalWithField(t, 'l', '1n')).toThrow(/only R and X/)
  })
  it('sets and removes parts of an R-L-C model', () => {
    const t = { kind: 'rlc', topology: 'series', r: 24, c: 2.55e-12 } as const
    expect(terminalWithField(t, 'l', '3.3n')).toEqual({ ...t, l: 3.3e-9 })
    expect(terminalWithField(t, 'c', '')).toEqual({ kind: 'rlc', topology: 'series', r: 24 })
    expect(() => terminalWithField({ kind: 'rlc', topology: 'series', r: 5 }, 'r', '')).toThrow(/at least one/)
    expect(() => terminalWithField(t, 'c', '0')).toThrow(/greater than zero/)
  })
})

describe('settingsPatchFor', () => {
  it.each([
    ['frequencyHz', '915M', { frequencyHz: 915e6 }],
    ['frequencyHz', '2.45 GHz', { frequencyHz: 2.45e9 }],
    ['z0', '75', { z0: 75 }],
    ['bandPoints', '201', { bandPoints: 201 }],
    ['bandStopHz', '1.2G', { bandStopHz: 1.2e9 }],
    ['minReturnLossDb', '14 dB', { spec: { ...DEFAULT_SETTINGS.spec, minReturnLossDb: 14 } }],
  ] as const)('reads %s %j', (field, text, patch) => {
    const got = settingsPatchFor(DEFAULT_SETTINGS, field, text)
    expect(Object.keys(got)).toEqual(Object.keys(patch))
    for (const [k, v] of Object.entries(patch)) {
      if (typeof v === 'number') expect((got as Record<string, number>)[k]).toBeCloseTo(v, 3)
      else expect((got as Record<string, unknown>)[k]).toEqual(v)
    }
  })
  it.each([
    ['bandPoints', '1.5', /whole number/],
    ['bandPoints', '3000', /2 to 2001/],
    ['bandStartHz', '2G', /below band stop/],
    ['bandStopHz', '100M', /above band start/],
    ['f1Hz', '1.1G', /spec start must be below/],
    ['z0', '-50', /greater than zero/],
    ['frequencyHz', 'soon', /Design frequency/],
  ] as const)('refuses %s %j', (field, text, message) => {
    expect(() => settingsPatchFor(DEFAULT_SETTINGS, field, text)).toThrow(message)
  })
})
