import { describe, expect, it } from 'vitest'
import {
  formatPower, formatTolerance, parsePowerW, parseQ, parseRating, parseTolerance, plainCopy,
} from '../../../shared/board/real-parts'
import { BoardElementSchema } from '../../../shared/board/schema'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'
import { boardMap, createBoardDoc, readBoard } from '../../../shared/board/ydoc'
import { updateSettings } from '../../../shared/board/ops'

const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(b)))

describe('typed real-part entries', () => {
  it.each([
    ['0.5', 'W', 0.5], ['500m', 'W', 0.5], ['500 mW', 'W', 0.5], ['20', 'dBm', 0.1], ['30 dBm', 'W', 1], ['27 dBm', 'dBm', 10 ** -0.3],
  ] as const)('power %s (%s) is %f W', (text, unit, watts) => close(parsePowerW(text, unit), watts))

  it('refuses a power of zero, a negative one and nonsense', () => {
    expect(() => parsePowerW('0', 'W')).toThrow(/greater than zero/)
    expect(() => parsePowerW('-1', 'W')).toThrow(/greater than zero/)
    expect(() => parsePowerW('lots', 'W')).toThrow()
  })

  it('writes power back in either unit', () => {
    expect(formatPower(0.1, 'dBm')).toBe('20 dBm')
    expect(formatPower(0.1, 'W')).toBe('100 mW')
  })

  it('reads tolerances as a percentage or an absolute value, one replacing the other', () => {
    expect(parseTolerance('5%', 'C')).toEqual({ tolerance: 0.05, toleranceAbs: undefined })
    expect(parseTolerance('±2.5 %', 'L')).toEqual({ tolerance: 0.025, toleranceAbs: undefined })
    const abs = parseTolerance('±0.1 pF', 'C')
    expect(abs.tolerance).toBeUndefined()
    close(abs.toleranceAbs!, 0.1e-12)
    close(parseTolerance('0.2n', 'L').toleranceAbs!, 0.2e-9)
    expect(parseTolerance('', 'R')).toEqual({ tolerance: undefined, toleranceAbs: undefined })
    expect(() => parseTolerance('120%', 'C')).toThrow(/below 100/)
  })

  it('shows tolerances back as typed', () => {
    expect(formatTolerance({ id: 'a', kind: 'C', placement: 'shunt', value: 1e-12, toleranceAbs: 0.1e-12 })).toBe('±100 fF')
    expect(formatTolerance({ id: 'a', kind: 'C', placement: 'shunt', value: 1e-12, tolerance: 0.05 })).toBe('±5 %')
    expect(formatTolerance({ id: 'a', kind: 'line', z0: 50, deg: 10 })).toBe('')
  })

  it('reads ratings and Q, empty clearing them', () => {
    expect(parseRating('50 V', 'V')).toBe(50)
    close(parseRating('300m', 'A')!, 0.3)
    expect(parseRating('', 'V')).toBeUndefined()
    expect(parseQ('40')).toBe(40)
    expect(parseQ('')).toBeUndefined()
    expect(() => parseQ('-3')).toThrow(/greater than zero/)
  })

  it('makes plain copies that keep infinities and drop undefined fields', () => {
    const source = { a: [{ re: Infinity, im: 0 }], b: undefined, c: { d: 1 } }
    const copy = plainCopy(source)
    expect(copy).toEqual({ a: [{ re: Infinity, im: 0 }], c: { d: 1 } })
    expect(copy.a).not.toBe(source.a)
    expect(() => structuredClone(copy)).not.toThrow()
  })
})

describe('real-part fields in the board document', () => {
  const antenna = DEMO_BOARDS.find(b => b.id === 'brackwater-915-antenna')!

  it('an older document without defaultQ or sourcePowerW reads with no problem', () => {
    const snapshot = readBoard(createBoardDoc(antenna))
    expect(snapshot.problems).toEqual([])
    expect(snapshot.settings.defaultQ).toBeUndefined()
    expect('sourcePowerW' in snapshot.settings).toBe(false)
  })

  it('keeps defaultQ and sourcePowerW once set, and reports a bad one without using it', () => {
    const doc = createBoardDoc(antenna)
    updateSettings(doc, { defaultQ: { L: 40, C: 200 }, sourcePowerW: 0.5 })
    expect(readBoard(doc).settings.defaultQ).toEqual({ L: 40, C: 200 })
    expect(readBoard(doc).settings.sourcePowerW).toBe(0.5)
    doc.transact(() => boardMap(doc).set('defaultQ', { L: -1 }))
    const snapshot = readBoard(doc)
    expect(snapshot.settings.defaultQ).toBeUndefined()
    expect(snapshot.problems.join(' ')).toMatch(/settings\.defaultQ is invalid.*ignored/)
  })

  it('accepts an element with an absolute tolerance and ratings, and refuses negative ones', () => {
    const ok = BoardElementSchema.safeParse({ id: 'c', kind: 'C', placement: 'shunt', value: 1e-12, toleranceAbs: 0.1e-12, vRatingV: 50, iRatingA: 0.5 })
    expect(ok.success).toBe(true)
    expect(BoardElementSchema.safeParse({ id: 'c', kind: 'C', placement: 'shunt', value: 1e-12, vRatingV: -5 }).success).toBe(false)
    expect(BoardElementSchema.safeParse({ id: 'c', kind: 'C', placement: 'shunt', value: 1e-12, toleranceAbs: 0 }).success).toBe(false)
  })
})
