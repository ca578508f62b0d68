import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { useBoardStore } from '../../../stores/board'
import { useRealPartsStore } from '../../../stores/realParts'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'
import { elementStress, lossesAt, runMonteCarlo } from '../../../shared/rf/index'

const antenna = DEMO_BOARDS.find(b => b.id === 'brackwater-915-antenna')!
let board: ReturnType<typeof useBoardStore>
let parts: ReturnType<typeof useRealPartsStore>

beforeEach(() => {
  setActivePinia(createPinia())
  board = useBoardStore()
  board.openBoard(antenna)
  parts = useRealPartsStore()
})

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b)

describe('the real-parts store on the 915 MHz antenna board', () => {
  it('applies the board default Q to parts without their own, in the trace and the losses', () => {
    const lossless = board.traceAtDesign.at(-1)!
    const before = parts.lossesAtDesign!.efficiency
    expect(parts.setDefaultQ('C', '50')).toBeNull()
    expect(board.settings.defaultQ).toEqual({ C: 50 })
    expect(board.traceAtDesign.at(-1)).not.toEqual(lossless)
    expect(parts.lossesAtDesign!.efficiency).toBeLessThan(before)
    // ant-l1 keeps its own Q of 45; the C now has 50.
    expect(board.analysisLadder.map(e => (e as { q?: number }).q)).toEqual([45, 50])
    expect(parts.setDefaultQ('C', '')).toBeNull()
    expect(board.settings.defaultQ).toBeUndefined()
  })

  it('stress follows the source power typed in dBm and agrees with elementStress', () => {
    parts.powerUnit = 'dBm'
    expect(parts.setSourcePower('30')).toBeNull()
    expect(board.settings.sourcePowerW).toBeCloseTo(1, 12)
    const direct = elementStress({ frequency: 915e6, load: { re: 18, im: -32 }, source: { re: 50, im: 0 }, powerW: 1, elements: antenna.elements })
    expect(rel(parts.stressById['ant-c1']!.voltageRms, direct.elements[1]!.voltageRms)).toBeLessThan(1e-12)
    expect(rel(parts.stressById['ant-l1']!.currentRms, direct.elements[0]!.currentRms)).toBeLessThan(1e-12)
    expect(parts.setSourcePower('no')).toMatch(/number/)
  })

  it('flags a part beyond its rating and clears the flag when the rating is removed', () => {
    const v = parts.stressById['ant-c1']!.voltageRms
    expect(parts.setRating('ant-c1', 'vRatingV', String(v / 2))).toBeNull()
    expect(parts.overRatingIds).toEqual(['ant-c1'])
    expect(parts.setRating('ant-c1', 'vRatingV', '')).toBeNull()
    expect(parts.overRatingIds).toEqual([])
  })

  it('snap all sets every part to the chosen series in one undo step, with the verdict before and after', () => {
    board.updateElement('ant-c1', { value: 3.7e-12 })
    board.updateElement('ant-l1', { value: 10.4e-9 })
    parts.snapSeries = 'E12'
    const preview = parts.snapPreview.value!
    expect(preview.changed).toBe(2)
    expect(preview.after.worstReturnLossDb).not.toBe(preview.before.worstReturnLossDb)
    expect(parts.snapAll()).toBeNull()
    expect(board.elements.map(e => (e as { value: number }).value)).toEqual([10e-9, 3.9e-12])
    expect(board.bandVerdict.worstReturnLossDb).toBeCloseTo(preview.after.worstReturnLossDb!, 9)
    board.undo()
    expect(board.elements.map(e => (e as { value: number }).value)).toEqual([10.4e-9, 3.7e-12])
  })

  it('gives the Monte Carlo plain input whose nominal run matches the board band', () => {
    const input = parts.monteCarloInput()
    expect(() => structuredClone(input)).not.toThrow()
    const r = runMonteCarlo({ ...input, trials: 50 })
    expect(rel(r.nominalWorstReturnLossDb, board.bandVerdict.worstReturnLossDb!)).toBeLessThan(1e-9)
    expect(parts.tolerancedCount).toBe(2)
  })

  it('reports losses over the spec band no better than at its best point', () => {
    const s = parts.bandLossSummary!
    const atDesign = lossesAt({ frequency: 915e6, load: { re: 18, im: -32 }, source: { re: 50, im: 0 }, elements: antenna.elements })
    expect(s.lowest!.efficiency).toBeLessThanOrEqual(atDesign.efficiency + 1e-12)
    expect(s.highest!.insertionLossDb).toBeGreaterThanOrEqual(atDesign.insertionLossDb - 1e-12)
  })
})
