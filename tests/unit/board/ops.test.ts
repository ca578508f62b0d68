import { beforeEach, describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import {
  addElement, moveElement, removeElement, replaceBoard, replaceLadder, setLocked, setTerminal,
  updateElement, updateSettings,
} from '../../../shared/board/ops'
import {
  ORIGIN_LOAD, ORIGIN_LOCAL, ORIGIN_REMOTE, ORIGIN_RESTORE, applyBoardState, createBoardDoc,
  encodeBoardState, readBoard,
} from '../../../shared/board/ydoc'
import { DEFAULT_SETTINGS, type BoardElement } from '../../../shared/board/schema'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'

const ladder: BoardElement[] = [
  { id: 'l1', kind: 'L', placement: 'series', value: 10e-9 },
  { id: 'c1', kind: 'C', placement: 'shunt', value: 3.9e-12 },
  { id: 'r1', kind: 'R', placement: 'series', value: 5 },
]

let doc: Y.Doc
let origins: unknown[]
beforeEach(() => {
  doc = createBoardDoc({ settings: DEFAULT_SETTINGS, elements: ladder })
  origins = []
  doc.on('afterTransaction', (tr: Y.Transaction) => {
    // Count only transactions that changed something.
    if (tr.changed.size > 0) origins.push(tr.origin)
  })
})
const ids = () => readBoard(doc).elements.map(e => e.id)

describe('every op is one transaction with the named origin', () => {
  const cases: [string, (origin?: unknown) => void, () => void][] = [
    ['addElement', o => addElement(doc, { kind: 'xfmr', ratio: 2, id: 'x1' }, 1, o), () => expect(ids()).toEqual(['l1', 'x1', 'c1', 'r1'])],
    ['removeElement', o => removeElement(doc, 'c1', o), () => expect(ids()).toEqual(['l1', 'r1'])],
    ['moveElement', o => moveElement(doc, 'l1', 2, o), () => expect(ids()).toEqual(['c1', 'r1', 'l1'])],
    ['updateElement', o => updateElement(doc, 'c1', { value: 4.7e-12, q: 80 }, o), () => {
      expect(readBoard(doc).elements[1]).toEqual({ id: 'c1', kind: 'C', placement: 'shunt', value: 4.7e-12, q: 80 })
    }],
    ['setLocked', o => setLocked(doc, 'r1', true, o), () => expect(readBoard(doc).elements[2]!.locked).toBe(true)],
    ['replaceLadder', o => replaceLadder(doc, [{ kind: 'C', placement: 'series', value: 1e-12 }, { kind: 'L', placement: 'shunt', value: 2e-9 }], o), () => {
      expect(readBoard(doc).elements.map(e => e.kind)).toEqual(['C', 'L'])
    }],
    ['updateSettings', o => updateSettings(doc, { z0: 75, bandPoints: 51 }, o), () => {
      expect(readBoard(doc).settings.z0).toBe(75)
      expect(readBoard(doc).settings.bandPoints).toBe(51)
    }],
    ['setTerminal', o => setTerminal(doc, 'source', { kind: 'impedance', z: { re: 30, im: 10 } }, o), () => {
      expect(readBoard(doc).settings.source).toEqual({ kind: 'impedance', z: { re: 30, im: 10 } })
    }],
    ['replaceBoard', o => replaceBoard(doc, DEMO_BOARDS[1]!, o), () => {
      expect(readBoard(doc).elements).toEqual(DEMO_BOARDS[1]!.elements)
      expect(readBoard(doc).settings).toEqual(DEMO_BOARDS[1]!.settings)
    }],
  ]

  it.each(cases)('%s defaults to ORIGIN_LOCAL', (_name, run, check) => {
    run()
    check()
    expect(origins).toEqual([ORIGIN_LOCAL])
    expect(readBoard(doc).problems).toEqual([])
  })

  it.each(cases)('%s carries a given origin', (_name, run) => {
    run(ORIGIN_RESTORE)
    expect(origins).toEqual([ORIGIN_RESTORE])
  })
})

describe('refused edits leave the document untouched', () => {
  const refused: [string, () => void][] = [
    ['a negative value', () => updateElement(doc, 'c1', { value: -1 })],
    ['a NaN value', () => updateElement(doc, 'c1', { value: Number.NaN })],
    ['a changed kind', () => updateElement(doc, 'c1', { kind: 'L' })],
    ['a changed id', () => updateElement(doc, 'c1', { id: 'zz' })],
    ['an unknown id', () => updateElement(doc, 'nope', { value: 1 })],
    ['removing an unknown id', () => removeElement(doc, 'nope')],
    ['a duplicate id', () => addElement(doc, { id: 'l1', kind: 'L', placement: 'shunt', value: 1e-9 })],
    ['an invalid element', () => addElement(doc, { kind: 'line', z0: -50, deg: 10 })],
    ['settings with start above stop', () => updateSettings(doc, { bandStartHz: 5e9 })],
    ['a Z0 load', () => setTerminal(doc, 'load', { kind: 'z0' })],
    ['a ladder with repeated ids', () => replaceLadder(doc, [ladder[0]!, ladder[0]!])],
  ]
  it.each(refused)('refuses %s', (_label, run) => {
    const before = encodeBoardState(doc)
    expect(run).toThrow()
    expect(origins).toEqual([])
    expect(encodeBoardState(doc)).toEqual(before)
  })
})

describe('details', () => {
  it('addElement appends at the source end by default and makes an id', () => {
    const id = addElement(doc, { kind: 'stub', end: 'short', placement: 'shunt', z0: 50, deg: 40 })
    expect(id).toMatch(/^[0-9a-f-]{32,36}$/)
    expect(ids()).toEqual(['l1', 'c1', 'r1', id])
  })

  it('updateElement with undefined removes an optional field', () => {
    updateElement(doc, 'c1', { q: 50 })
    updateElement(doc, 'c1', { q: undefined })
    expect(readBoard(doc).elements[1]).not.toHaveProperty('q')
  })

  it('moveElement to the same place changes nothing', () => {
    moveElement(doc, 'c1', 1)
    expect(origins).toEqual([])
  })

  it('setLocked false removes the flag', () => {
    setLocked(doc, 'l1', true)
    setLocked(doc, 'l1', false)
    expect(readBoard(doc).elements[0]).not.toHaveProperty('locked')
  })
})

describe('Y.UndoManager tracking ORIGIN_LOCAL', () => {
  function undoManagerOf(d: Y.Doc) {
    return new Y.UndoManager([d.getMap('board'), d.getArray('elements')], {
      trackedOrigins: new Set([ORIGIN_LOCAL]),
      captureTimeout: 0,
    })
  }

  it('undoes and redoes local ops one step each', () => {
    const undo = undoManagerOf(doc)
    updateElement(doc, 'c1', { value: 4.7e-12 })
    moveElement(doc, 'r1', 0)
    expect(ids()).toEqual(['r1', 'l1', 'c1'])
    undo.undo()
    expect(ids()).toEqual(['l1', 'c1', 'r1'])
    expect(readBoard(doc).elements[1]).toMatchObject({ value: 4.7e-12 })
    undo.undo()
    expect(readBoard(doc).elements[1]).toMatchObject({ value: 3.9e-12 })
    undo.redo()
    expect(readBoard(doc).elements[1]).toMatchObject({ value: 4.7e-12 })
    expect(undo.undoStack.length).toBe(1)
  })

  it('does not undo remote, load or restore transactions', () => {
    const undo = undoManagerOf(doc)
    updateElement(doc, 'c1', { value: 4.7e-12 }, ORIGIN_REMOTE)
    addElement(doc, { id: 'x1', kind: 'xfmr', ratio: 3 }, undefined, ORIGIN_LOAD)
    replaceBoard(doc, DEMO_BOARDS[2]!, ORIGIN_RESTORE)
    expect(undo.undoStack.length).toBe(0)
    undo.undo()
    expect(readBoard(doc).elements).toEqual(DEMO_BOARDS[2]!.elements)
  })

  it('undoes a local edit without rewinding a remote one made after it', () => {
    const undo = undoManagerOf(doc)
    updateElement(doc, 'l1', { value: 12e-9 })
    // A colleague's update arriving through the provider.
    const other = new Y.Doc()
    applyBoardState(other, encodeBoardState(doc))
    updateElement(other, 'c1', { value: 5.6e-12 })
    applyBoardState(doc, encodeBoardState(other), ORIGIN_REMOTE)
    undo.undo()
    expect(readBoard(doc).elements[0]).toMatchObject({ value: 10e-9 })
    expect(readBoard(doc).elements[1]).toMatchObject({ value: 5.6e-12 })
  })
})
