// Edits of an amplifier board's device and its two networks (the input side and the output side),
// each validated first and written in one transaction with a named origin, like ops.ts.
import type * as Y from 'yjs'
import { AMPLIFIER_SIDES, type AmplifierSide, type DeviceRef } from './schema'
import { ORIGIN_LOCAL, boardMap, elementToYMap, sideArray } from './ydoc'
import { BoardEditError, newElementId, patchElementMap, validElement, type ElementPatch, type NewElement } from './ops'

function requireSide(side: AmplifierSide): AmplifierSide {
  if (!AMPLIFIER_SIDES.includes(side)) throw new BoardEditError(`No amplifier side ${String(side)}`)
  return side
}

/** Places a device (an uploaded .s2p) on the board, or removes it (null; the sides stay, unused). */
export function setDevice(doc: Y.Doc, device: DeviceRef | null, origin: unknown = ORIGIN_LOCAL): void {
  if (device && !(typeof device.uploadId === 'string' && device.uploadId && typeof device.fileName === 'string' && device.fileName)) {
    throw new BoardEditError('A device needs an uploadId and a fileName')
  }
  doc.transact(() => {
    if (device) boardMap(doc).set('device', { uploadId: device.uploadId, fileName: device.fileName })
    else boardMap(doc).delete('device')
  }, origin)
}

/** Replaces one side's whole network (a solver result) in one step. Elements without ids get one. */
export function replaceSide(doc: Y.Doc, side: AmplifierSide, elements: NewElement[], origin: unknown = ORIGIN_LOCAL): string[] {
  const valid = elements.map(e => validElement({ ...e, id: e.id ?? newElementId() }))
  if (new Set(valid.map(e => e.id)).size !== valid.length) throw new BoardEditError('Element ids must be unique')
  doc.transact(() => {
    const array = sideArray(doc, requireSide(side))
    if (array.length) array.delete(0, array.length)
    array.insert(0, valid.map(elementToYMap))
  }, origin)
  return valid.map(e => e.id)
}

/** Changes fields of one element of a side; the result must still be a valid element of its kind. */
export function updateSideElement(doc: Y.Doc, side: AmplifierSide, id: string, patch: ElementPatch, origin: unknown = ORIGIN_LOCAL): void {
  const array = sideArray(doc, requireSide(side))
  const map = array.toArray().find(m => m.get('id') === id)
  if (!map) throw new BoardEditError(`No element with id ${id} on the ${side}`)
  patchElementMap(doc, map, id, patch, origin)
}
