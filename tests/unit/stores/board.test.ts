import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import * as Y from 'yjs'
import { useBoardStore } from '../../../stores/board'
import { useBoardDoc } from '../../../composables/useBoardDoc'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'
import { ORIGIN_REMOTE, applyBoardState, encodeBoardState, readBoard } from '../../../shared/board/ydoc'
import { updateElement } from '../../../shared/board/ops'

type C = { re: number, im: number }
const add = (a: C, b: C): C => ({ re: a.re + b.re, im: a.im + b.im })
const inv = (a: C): C => { const d = a.re * a.re + a.im * a.im; return { re: a.re / d, im: -a.im / d } }
function expectClose(actual: C, expected: C, tol = 1e-9) {
  const scale = Math.max(1, Math.hypot(expected.re, expected.im))
  expect(Math.hypot(actual.re - expected.re, actual.im - expected.im) / scale).toBeLessThan(tol)
}

const antenna = DEMO_BOARDS.find(b => b.id === 'brackwater-915-antenna')!
const lna = DEMO_BOARDS.find(b => b.id === 'brackwater-868-lna')!

let store: ReturnType<typeof useBoardStore>
beforeEach(() => {
  setActivePinia(createPinia())
  store = useBoardStore()
  store.openBoard(antenna)
})
const docSnapshot = () => readBoard(useBoardDoc().doc!)

describe('opening a board', () => {
  it('reads settings and elements from the document', () => {
    expect(store.isLoaded).toBe(true)
    expect(store.boardId).toBe('brackwater-915-antenna')
    expect(store.settings).toEqual(antenna.settings)
    expect(store.elements).toEqual(antenna.elements)
    expect(store.problems).toEqual([])
    expect(store.canUndo).toBe(false)
  })

  it('traces the ladder at the design frequency (checked by hand-written complex arithmetic)', () => {
    const w = 2 * Math.PI * 915e6
    const xl = w * 10e-9
    // Series L with Q 45: ESR = X/Q; then shunt C adds jωC to the admittance.
    const afterL = add({ re: 18, im: -32 }, { re: xl / 45, im: xl })
    const afterC = inv(add(inv(afterL), { re: 0, im: w * 3.9e-12 }))
    expect(store.traceAtDesign).toHaveLength(3)
    expectClose(store.traceAtDesign[0]!, { re: 18, im: -32 })
    expectClose(store.traceAtDesign[1]!, afterL)
    expectClose(store.traceAtDesign[2]!, afterC)
    const g = store.endpointChartGamma
    const expected = { re: 0, im: 0 }
    const num = add(afterC, { re: -50, im: 0 })
    const den = inv(add(afterC, { re: 50, im: 0 }))
    expected.re = num.re * den.re - num.im * den.im
    expected.im = num.re * den.im + num.im * den.re
    expectClose(g, expected)
    expect(store.endpointReadout.returnLossDb).toBeCloseTo(-20 * Math.log10(Math.hypot(expected.re, expected.im)), 9)
  })

  it('sets the goal to z0 for a Z0 source and to the conjugate of a complex source', () => {
    expectClose(store.goal, { re: 50, im: 0 })
    store.openBoard(lna)
    expectClose(store.goal, { re: 42, im: -9 })
  })

  it('sweeps the band: one point per frequency, from start to stop', () => {
    expect(store.bandFrequencies).toHaveLength(antenna.settings.bandPoints)
    expect(store.bandFrequencies[0]).toBe(880e6)
    expect(store.bandFrequencies.at(-1)).toBe(950e6)
    expect(store.bandSweep).toHaveLength(antenna.settings.bandPoints)
    const k = store.bandFrequencies.findIndex(f => Math.abs(f - 915e6) < 1)
    expect(k).toBeGreaterThan(0)
    expectClose(store.bandSweep[k]!, store.endPoint, 1e-9)
    const inSpec = store.bandFrequencies
      .map((f, i) => [f, store.bandReturnLossDb[i]!] as const)
      .filter(([f]) => f >= 902e6 && f <= 928e6)
    const worst = Math.min(...inSpec.map(([, rl]) => rl))
    expect(store.bandVerdict.worstReturnLossDb).toBeCloseTo(worst, 12)
    expect(store.bandVerdict.isPass).toBe(worst >= 10)
  })
})

describe('ladder edits', () => {
  it('adds from the palette, selects it, and undoes in one step', () => {
    const id = store.addFromPalette('shunt-L')!
    expect(store.elements.map(e => e.id)).toEqual(['ant-l1', 'ant-c1', id])
    expect(store.selectedId).toBe(id)
    expect(store.canUndo).toBe(true)
    store.undo()
    expect(store.elements.map(e => e.id)).toEqual(['ant-l1', 'ant-c1'])
    expect(store.canRedo).toBe(true)
    store.redo()
    expect(store.elements.map(e => e.id)).toEqual(['ant-l1', 'ant-c1', id])
  })

  it('moves, locks and removes elements through the document', () => {
    store.moveElement('ant-c1', 0)
    expect(docSnapshot().elements.map(e => e.id)).toEqual(['ant-c1', 'ant-l1'])
    store.setLocked('ant-c1', true)
    expect(store.elements[0]!.locked).toBe(true)
    store.removeElement('ant-l1')
    expect(store.elements.map(e => e.id)).toEqual(['ant-c1'])
  })

  it('takes typed values with SI prefixes', () => {
    expect(store.setElementField('ant-c1', 'value', '4.7p')).toBeNull()
    expect(store.elements[1]).toMatchObject({ value: 4.7e-12 })
    expect(store.setElementField('ant-l1', 'value', '12 nH')).toBeNull()
    expect(docSnapshot().elements[0]).toMatchObject({ value: 12e-9 })
  })

  it.each(['abc', '', '-4.7p', '0', '4.7q'])('refuses %j with a message and leaves the document untouched', (text) => {
    const before = encodeBoardState(useBoardDoc().doc!)
    const message = store.setElementField('ant-c1', 'value', text)
    expect(message).toEqual(expect.any(String))
    expect(message!.length).toBeGreaterThan(3)
    expect(encodeBoardState(useBoardDoc().doc!)).toEqual(before)
    expect(store.elements[1]).toMatchObject({ value: 3.9e-12 })
    expect(store.canUndo).toBe(false)
  })

  it('refuses settings that do not validate, with a message', () => {
    const message = store.updateSettings({ bandStartHz: 5e9 })
    expect(message).toMatch(/band/i)
    expect(store.settings.bandStartHz).toBe(880e6)
  })

  it('refuses every edit on a read-only board', () => {
    store.openBoard(antenna, { readOnly: true })
    expect(store.removeElement('ant-l1')).toMatch(/read-only/)
    expect(store.beginDrag('ant-c1')).toBe(false)
    expect(store.elements).toHaveLength(2)
  })
})

describe('dragging', () => {
  it('changes only the draft while dragging and commits one undo step', () => {
    store.openBoard({ ...antenna, settings: { ...antenna.settings, snapSeries: 'none' } })
    const before = encodeBoardState(useBoardDoc().doc!)
    const endBefore = store.endPoint
    expect(store.beginDrag('ant-c1')).toBe(true)
    store.dragTo(4.4e-12)
    expect(store.effectiveElements[1]).toMatchObject({ value: 4.4e-12 })
    expect(store.elements[1]).toMatchObject({ value: 3.9e-12 })
    expect(store.endPoint).not.toEqual(endBefore)
    expect(encodeBoardState(useBoardDoc().doc!)).toEqual(before)
    store.dragTo(4.6e-12)
    expect(store.commitDrag()).toBeNull()
    expect(store.draft).toBeNull()
    expect(docSnapshot().elements[1]).toMatchObject({ value: 4.6e-12 })
    store.undo()
    expect(store.elements[1]).toMatchObject({ value: 3.9e-12 })
    expect(store.canUndo).toBe(false)
  })

  it('keeps a shunt C drag on its constant-conductance circle', () => {
    const before = store.traceAtDesign[1]!
    const conductance = (z: C) => inv(z).re
    store.beginDrag('ant-c1')
    for (const v of [1e-12, 3e-12, 8e-12]) {
      store.dragTo(v)
      expect(Math.abs(conductance(store.endPoint) - conductance(before))).toBeLessThan(1e-12)
    }
    store.cancelDrag()
  })

  it('cancelDrag leaves the document as it was and records nothing', () => {
    store.beginDrag('ant-l1')
    store.dragTo(20e-9)
    store.cancelDrag()
    expect(store.effectiveElements).toEqual(store.elements)
    expect(store.canUndo).toBe(false)
  })

  it('snaps the draft to the snap series', () => {
    expect(store.settings.snapSeries).toBe('E12')
    store.beginDrag('ant-c1')
    store.dragTo(4.4e-12)
    // E12 decade: … 3.9, 4.7 … — 4.4 lies nearer 4.7 on a linear or a log scale.
    expect(store.draft!.value).toBeCloseTo(4.7e-12, 20)
  })

  it('refuses to drag a locked element or a transformer', () => {
    store.setLocked('ant-c1', true)
    expect(store.beginDrag('ant-c1')).toBe(false)
    const id = store.addFromPalette('xfmr')!
    expect(store.beginDrag(id)).toBe(false)
    expect(store.draft).toBeNull()
  })
})

describe('solutions and remote edits', () => {
  it('lists L-network matches that end at the goal, and applies one as a single undo step', () => {
    const lSolutions = store.solutions.filter(s => s.family === 'L')
    expect(lSolutions.length).toBeGreaterThan(0)
    for (const s of lSolutions) expect(s.returnLossDb).toBeGreaterThan(40)
    const chosen = lSolutions[0]!
    store.setPreview(chosen.elements)
    expect(store.preview).toHaveLength(chosen.elements.length)
    expect(store.previewTrace).toHaveLength(chosen.elements.length + 1)
    store.applySolution(chosen.elements)
    expect(store.preview).toBeNull()
    expect(store.elements.map(e => e.kind)).toEqual(chosen.elements.map(e => e.kind))
    expect(store.endpointReadout.returnLossDb).toBeGreaterThan(40)
    store.undo()
    expect(store.elements).toEqual(antenna.elements)
  })

  it('shows a colleague\'s edit but does not undo it', () => {
    const doc = useBoardDoc().doc!
    const other = new Y.Doc()
    applyBoardState(other, encodeBoardState(doc))
    updateElement(other, 'ant-l1', { value: 8.2e-9 })
    applyBoardState(doc, encodeBoardState(other), ORIGIN_REMOTE)
    expect(store.elements[0]).toMatchObject({ value: 8.2e-9 })
    expect(store.canUndo).toBe(false)
    store.undo()
    expect(store.elements[0]).toMatchObject({ value: 8.2e-9 })
  })
})

describe('finite Q', () => {
  it('sets, refuses and removes the Q of an L or C', () => {
    expect(store.setElementQ('ant-c1', '80')).toBeNull()
    expect(store.elements[1]).toMatchObject({ q: 80 })
    expect(store.setElementQ('ant-c1', '-3')).toMatch(/Q must be greater than zero/)
    expect(store.elements[1]).toMatchObject({ q: 80 })
    expect(store.setElementQ('ant-l1', '')).toBeNull()
    expect(store.elements[0]).not.toHaveProperty('q')
    // A lossy C moves the end point off the lossless one: finite Q adds series resistance.
    const lossless = store.endPoint
    store.setElementQ('ant-c1', '5')
    expect(store.endPoint).not.toEqual(lossless)
  })
})

describe('secondary results during a drag', () => {
  afterEach(() => { vi.useRealTimers() })
  const valueOf = (ladder: readonly { id: string }[], id: string) => (ladder.find(e => e.id === id) as { value: number }).value

  it('follow the draft at a lower rate, and exactly on commit', () => {
    vi.useFakeTimers()
    const before = valueOf(store.settledElements, 'ant-c1')
    expect(store.beginDrag('ant-c1')).toBe(true)
    store.dragTo(5.6e-12) // an E12 value: the antenna board snaps to E12
    // The live ladder has the draft at once; the parts list still shows the committed value.
    expect(valueOf(store.effectiveElements, 'ant-c1')).toBeCloseTo(5.6e-12, 20)
    expect(valueOf(store.settledElements, 'ant-c1')).toBe(before)
    expect(store.partsList.find(r => r.id === 'ant-c1')?.exactValue).toBe(before)
    vi.advanceTimersByTime(200)
    expect(valueOf(store.settledElements, 'ant-c1')).toBeCloseTo(5.6e-12, 20)
    store.dragTo(6.8e-12)
    store.commitDrag()
    // On release nothing lags: every panel reads the committed ladder.
    expect(valueOf(store.settledElements, 'ant-c1')).toBe(valueOf(store.elements, 'ant-c1'))
    expect(store.settledElements).toBe(store.elements)
  })

  it('catch up once the pointer rests, and at least every half second while it keeps moving', () => {
    vi.useFakeTimers()
    const committed = valueOf(store.settledElements, 'ant-c1')
    store.beginDrag('ant-c1')
    const seen = new Set<number>()
    // A 60 Hz drag for 0.9 s through E12 values: nothing settles before 0.5 s, something by then.
    const values = [3.9e-12, 4.7e-12, 5.6e-12, 6.8e-12, 8.2e-12]
    for (let t = 0; t < 900; t += 16) {
      store.dragTo(values[Math.floor(t / 16) % values.length]!)
      vi.advanceTimersByTime(16)
      if (t < 480) expect(valueOf(store.settledElements, 'ant-c1'), `at ${t} ms`).toBe(committed)
      seen.add(valueOf(store.settledElements, 'ant-c1'))
    }
    expect(seen.size).toBeGreaterThan(1)
    // At rest it catches up with the draft itself.
    vi.advanceTimersByTime(130)
    expect(valueOf(store.settledElements, 'ant-c1')).toBe(store.draft!.value)
  })

  it('keep the band for markers and the snap-all "now" row settled, while the live band follows each move', () => {
    vi.useFakeTimers()
    const settledBefore = store.settledBandReturnLossDb
    const liveBefore = store.bandReturnLossDb
    expect(settledBefore).toEqual(liveBefore)
    store.beginDrag('ant-c1')
    store.dragTo(8.2e-12)
    // The live band moved at once; the settled one is the committed ladder's until the timer fires.
    expect(store.bandReturnLossDb).not.toEqual(liveBefore)
    expect(store.settledBandReturnLossDb).toEqual(settledBefore)
    vi.advanceTimersByTime(200)
    expect(store.settledBandReturnLossDb).toEqual(store.bandReturnLossDb)
    expect(store.settledBandVerdict).toEqual(store.bandVerdict)
    store.commitDrag()
    expect(store.settledBandReturnLossDb).toBe(store.bandReturnLossDb)
  })
})
