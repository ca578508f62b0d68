// An amplifier board in the document: the device key and the two side ladders, added so that every
// older board, snapshot and template reads exactly as before; edits, live merge and restore.
import { describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import {
  applyBoardState, boardFromState, createBoardDoc, encodeBoardState, readBoard, sideArray,
} from '../../../shared/board/ydoc'
import { replaceBoard } from '../../../shared/board/ops'
import { replaceSide, setDevice, updateSideElement } from '../../../shared/board/amplifier-ops'
import { DEFAULT_SETTINGS, type BoardElement } from '../../../shared/board/schema'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'

const input: BoardElement[] = [
  { id: 'in-c', kind: 'C', placement: 'shunt', value: 2.2e-12 },
  { id: 'in-l', kind: 'L', placement: 'series', value: 12e-9, q: 40 },
]
const output: BoardElement[] = [{ id: 'out-l', kind: 'L', placement: 'shunt', value: 27e-9 }]
const device = { uploadId: 'up-1', fileName: 'invented-phemt.s2p' }

/** A document as a board made before amplifier boards was written: settings and elements only. */
function olderBoardState(): Uint8Array {
  const doc = new Y.Doc()
  doc.transact(() => {
    for (const [k, v] of Object.entries(DEMO_BOARDS[0]!.settings)) doc.getMap('board').set(k, structuredClone(v))
    const array = doc.getArray<Y.Map<unknown>>('elements')
    for (const e of DEMO_BOARDS[0]!.elements) {
      const m = new Y.Map<unknown>()
      for (const [k, v] of Object.entries(e)) if (v !== undefined) m.set(k, v)
      array.push([m])
    }
  })
  return Y.encodeStateAsUpdate(doc)
}

describe('amplifier boards in the document', () => {
  it('an older board opens unchanged: no device, no sides, no problems', () => {
    const snapshot = boardFromState(olderBoardState())
    expect(snapshot).toEqual({ settings: DEMO_BOARDS[0]!.settings, elements: DEMO_BOARDS[0]!.elements, problems: [] })
    expect('inputSide' in snapshot).toBe(false)
  })

  it('an older board becomes an amplifier board by adding a device and sides, its ladder untouched', () => {
    const doc = new Y.Doc()
    applyBoardState(doc, olderBoardState())
    setDevice(doc, device)
    replaceSide(doc, 'inputSide', input)
    replaceSide(doc, 'outputSide', output)
    const snapshot = readBoard(doc)
    expect(snapshot.problems).toEqual([])
    expect(snapshot.settings.device).toEqual(device)
    expect(snapshot.elements).toEqual(DEMO_BOARDS[0]!.elements)
    expect(snapshot.inputSide).toEqual(input)
    expect(snapshot.outputSide).toEqual(output)
  })

  it('edits on one client reach another through Yjs updates (live co-editing)', () => {
    const a = createBoardDoc({ settings: { ...DEFAULT_SETTINGS, device }, elements: [], inputSide: input, outputSide: output })
    const b = new Y.Doc()
    applyBoardState(b, encodeBoardState(a))
    a.on('update', (u: Uint8Array) => applyBoardState(b, u))
    updateSideElement(a, 'inputSide', 'in-l', { value: 15e-9 })
    expect(readBoard(b).inputSide![1]!.value).toBe(15e-9)
    expect(() => updateSideElement(a, 'outputSide', 'in-l', { value: 1e-9 })).toThrow(/No element/)
    expect(() => updateSideElement(a, 'inputSide', 'in-l', { value: -1 })).toThrow(/Invalid element/)
  })

  it('restoring a passive snapshot clears the device and the sides; restoring an amplifier snapshot brings them back', () => {
    const amplifier = { settings: { ...DEFAULT_SETTINGS, device }, elements: [], inputSide: input, outputSide: output }
    const doc = createBoardDoc(amplifier)
    replaceBoard(doc, { settings: DEFAULT_SETTINGS, elements: [] })
    const passive = readBoard(doc)
    expect(passive.settings.device).toBeUndefined()
    expect(passive.inputSide).toBeUndefined()
    expect(sideArray(doc, 'inputSide').length).toBe(0)
    replaceBoard(doc, amplifier)
    const back = readBoard(doc)
    expect(back.settings.device).toEqual(device)
    expect(back.inputSide).toEqual(input)
    expect(back.outputSide).toEqual(output)
  })

  it('a bad side element is skipped and reported under its side', () => {
    const doc = createBoardDoc({ settings: { ...DEFAULT_SETTINGS, device }, elements: [], inputSide: input })
    doc.transact(() => {
      const m = new Y.Map<unknown>()
      m.set('id', 'bad'); m.set('kind', 'L'); m.set('placement', 'series'); m.set('value', -3)
      sideArray(doc, 'inputSide').push([m])
    })
    const snapshot = readBoard(doc)
    expect(snapshot.inputSide).toEqual(input)
    expect(snapshot.problems.some(p => p.startsWith('inputSide[2] is invalid'))).toBe(true)
  })
})
