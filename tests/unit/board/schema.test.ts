import { describe, expect, it } from 'vitest'
import {
  BoardElementSchema, BoardSettingsSchema, DEFAULT_SETTINGS, LoadTerminalSchema, TerminalSchema,
} from '../../../shared/board/schema'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'

describe('BoardElementSchema', () => {
  const good = [
    { id: 'a', kind: 'L', placement: 'series', value: 10e-9 },
    { id: 'b', kind: 'C', placement: 'shunt', value: 4.7e-12, q: 200, tolerance: 0.05, locked: true },
    { id: 'c', kind: 'R', placement: 'shunt', value: 1000 },
    { id: 'd', kind: 'line', z0: 50, deg: 30, fRef: 1e9 },
    { id: 'e', kind: 'line', z0: 75, deg: 0 },
    { id: 'f', kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 45 },
    { id: 'g', kind: 'stub', end: 'short', placement: 'series', z0: 60, deg: 90, fRef: 2e9 },
    { id: 'h', kind: 'xfmr', ratio: 2 },
  ]
  it.each(good)('accepts $kind $id', (element) => {
    expect(BoardElementSchema.safeParse(element).success).toBe(true)
  })

  const bad: [string, unknown][] = [
    ['no id', { kind: 'L', placement: 'series', value: 1e-9 }],
    ['empty id', { id: '', kind: 'L', placement: 'series', value: 1e-9 }],
    ['negative value', { id: 'a', kind: 'C', placement: 'shunt', value: -1e-12 }],
    ['zero value', { id: 'a', kind: 'R', placement: 'series', value: 0 }],
    ['NaN value', { id: 'a', kind: 'L', placement: 'series', value: Number.NaN }],
    ['infinite value', { id: 'a', kind: 'L', placement: 'series', value: Infinity }],
    ['unknown placement', { id: 'a', kind: 'L', placement: 'parallel', value: 1e-9 }],
    ['tolerance of 1', { id: 'a', kind: 'L', placement: 'series', value: 1e-9, tolerance: 1 }],
    ['unknown kind', { id: 'a', kind: 'diode', value: 1 }],
    ['line without z0', { id: 'a', kind: 'line', deg: 10 }],
    ['stub with bad end', { id: 'a', kind: 'stub', end: 'shorted', placement: 'shunt', z0: 50, deg: 10 }],
    ['transformer ratio 0', { id: 'a', kind: 'xfmr', ratio: 0 }],
    ['value as string', { id: 'a', kind: 'L', placement: 'series', value: '10n' }],
  ]
  it.each(bad)('refuses %s', (_label, element) => {
    expect(BoardElementSchema.safeParse(element).success).toBe(false)
  })
})

describe('terminals', () => {
  it('lets a source be z0 but not a load', () => {
    expect(TerminalSchema.safeParse({ kind: 'z0' }).success).toBe(true)
    expect(LoadTerminalSchema.safeParse({ kind: 'z0' }).success).toBe(false)
  })
  it('needs at least one part in an R-L-C model', () => {
    expect(TerminalSchema.safeParse({ kind: 'rlc', topology: 'series' }).success).toBe(false)
    expect(TerminalSchema.safeParse({ kind: 'rlc', topology: 'parallel', r: 200, c: 1e-12 }).success).toBe(true)
  })
  it('refuses a negative resistance', () => {
    expect(TerminalSchema.safeParse({ kind: 'impedance', z: { re: -5, im: 0 } }).success).toBe(false)
  })
})

describe('BoardSettingsSchema', () => {
  it('accepts the defaults and every demo board', () => {
    expect(BoardSettingsSchema.safeParse(DEFAULT_SETTINGS).success).toBe(true)
    for (const board of DEMO_BOARDS) {
      expect(BoardSettingsSchema.safeParse(board.settings).success, board.id).toBe(true)
      for (const e of board.elements) expect(BoardElementSchema.safeParse(e).success, e.id).toBe(true)
    }
  })
  it.each([
    ['band start above stop', { bandStartHz: 2e9, bandStopHz: 1e9 }],
    ['one band point', { bandPoints: 1 }],
    ['fractional band points', { bandPoints: 10.5 }],
    ['too many band points', { bandPoints: 2002 }],
    ['zero Z0', { z0: 0 }],
    ['spec f1 above f2', { spec: { minReturnLossDb: 10, f1Hz: 2e9, f2Hz: 1e9 } }],
    ['unknown snap series', { snapSeries: 'E6' }],
    ['wrong schema version', { schemaVersion: 2 }],
  ])('refuses %s', (_label, patch) => {
    expect(BoardSettingsSchema.safeParse({ ...DEFAULT_SETTINGS, ...patch }).success).toBe(false)
  })
})

describe('demo boards', () => {
  it('have the fixed readable ids, unique element ids, and belong to brackwater', () => {
    expect(DEMO_BOARDS.map(b => b.id)).toEqual(['brackwater-915-antenna', 'brackwater-gateway-2g4', 'brackwater-868-lna'])
    const ids = DEMO_BOARDS.flatMap(b => b.elements.map(e => e.id))
    expect(new Set(ids).size).toBe(ids.length)
    for (const b of DEMO_BOARDS) expect(b.workspace).toBe('brackwater')
  })
})
