import { describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import {
  ORIGIN_LOAD, applyBoardState, boardFromState, boardMap, createBoardDoc, elementsArray,
  encodeBoardState, readBoard,
} from '../../../shared/board/ydoc'
import { DEFAULT_SETTINGS, type BoardElement } from '../../../shared/board/schema'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'

const ladder: BoardElement[] = [
  { id: 'l1', kind: 'L', placement: 'series', value: 10e-9, q: 45 },
  { id: 'c1', kind: 'C', placement: 'shunt', value: 3.9e-12, locked: true },
  { id: 't1', kind: 'line', z0: 75, deg: 30, fRef: 915e6 },
]

describe('createBoardDoc → encodeBoardState → boardFromState', () => {
  it.each(DEMO_BOARDS)('round-trips $id', (board) => {
    const doc = createBoardDoc(board)
    const snapshot = boardFromState(encodeBoardState(doc))
    expect(snapshot.problems).toEqual([])
    expect(snapshot.settings).toEqual(board.settings)
    expect(snapshot.elements).toEqual(board.elements)
  })

  it('keeps the element order from load to source and the Y.Doc layout', () => {
    const doc = createBoardDoc({ settings: DEFAULT_SETTINGS, elements: ladder })
    expect(elementsArray(doc).toArray().every(m => m instanceof Y.Map)).toBe(true)
    expect(elementsArray(doc).toArray().map(m => m.get('id'))).toEqual(['l1', 'c1', 't1'])
    // Terminals are stored as plain JSON values, not nested Y types.
    expect(boardMap(doc).get('load')).toEqual(DEFAULT_SETTINGS.load)
    expect(boardMap(doc).get('load')).not.toBeInstanceOf(Y.AbstractType)
  })

  it('writes the whole board in one ORIGIN_LOAD transaction', () => {
    // Observe a second doc that receives the update, to count transactions and their origins.
    const source = createBoardDoc({ settings: DEFAULT_SETTINGS, elements: ladder })
    const target = new Y.Doc()
    const origins: unknown[] = []
    target.on('afterTransaction', tr => origins.push(tr.origin))
    applyBoardState(target, encodeBoardState(source))
    expect(origins).toEqual([ORIGIN_LOAD])
    expect(readBoard(target).elements).toEqual(ladder)
  })
})

describe('readBoard reports bad entries in problems without throwing', () => {
  function docWith(mutate: (doc: Y.Doc) => void): Y.Doc {
    const doc = createBoardDoc({ settings: DEFAULT_SETTINGS, elements: ladder })
    doc.transact(() => mutate(doc))
    return doc
  }

  it('reads an empty document as defaults, listing every missing key', () => {
    const snapshot = readBoard(new Y.Doc())
    expect(snapshot.settings).toEqual(DEFAULT_SETTINGS)
    expect(snapshot.elements).toEqual([])
    expect(snapshot.problems.length).toBe(Object.keys(DEFAULT_SETTINGS).length)
    expect(snapshot.problems.join('\n')).toContain('settings.z0 is missing')
  })

  it('replaces a bad setting with its default and names it', () => {
    const doc = docWith(d => boardMap(d).set('z0', -50))
    const snapshot = readBoard(doc)
    expect(snapshot.settings.z0).toBe(DEFAULT_SETTINGS.z0)
    expect(snapshot.problems).toHaveLength(1)
    expect(snapshot.problems[0]).toMatch(/settings\.z0 is invalid/)
  })

  it('falls back to the default band when start is not below stop', () => {
    const doc = docWith((d) => { boardMap(d).set('bandStartHz', 3e9); boardMap(d).set('bandStopHz', 2e9) })
    const snapshot = readBoard(doc)
    expect(snapshot.settings.bandStartHz).toBeLessThan(snapshot.settings.bandStopHz)
    expect(snapshot.problems.join()).toMatch(/band start/)
  })

  it('skips a bad element and keeps the rest', () => {
    const doc = docWith((d) => {
      const bad = new Y.Map<unknown>()
      bad.set('id', 'x'); bad.set('kind', 'C'); bad.set('placement', 'shunt'); bad.set('value', 'lots')
      elementsArray(d).insert(1, [bad])
    })
    const snapshot = readBoard(doc)
    expect(snapshot.elements.map(e => e.id)).toEqual(['l1', 'c1', 't1'])
    expect(snapshot.problems).toHaveLength(1)
    expect(snapshot.problems[0]).toMatch(/elements\[1\] is invalid.*value/)
  })

  it('skips entries that are not maps, and repeated ids', () => {
    const doc = docWith((d) => {
      const arr = elementsArray(d) as unknown as Y.Array<unknown>
      arr.push([42])
      const copy = new Y.Map<unknown>()
      for (const [k, v] of Object.entries(ladder[0]!)) copy.set(k, v)
      arr.push([copy])
    })
    const snapshot = readBoard(doc)
    expect(snapshot.elements.map(e => e.id)).toEqual(['l1', 'c1', 't1'])
    expect(snapshot.problems).toHaveLength(2)
    expect(snapshot.problems[0]).toMatch(/elements\[3\] is not an element map/)
    expect(snapshot.problems[1]).toMatch(/repeats id l1/)
  })

  it('never throws on an unknown terminal kind', () => {
    const doc = docWith(d => boardMap(d).set('load', { kind: 'hologram', sizeMm: 3 }))
    const snapshot = readBoard(doc)
    expect(snapshot.settings.load).toEqual(DEFAULT_SETTINGS.load)
    expect(snapshot.problems[0]).toMatch(/settings\.load is invalid/)
  })
})
