// Building and reading y-protocols frames for the room logic. Each frame starts with a varUint
// type (0 sync, 1 awareness, 2 auth, 3 query-awareness); ours (100) is the access notice.
import * as Y from 'yjs'
import * as encoding from 'lib0/encoding'
import * as syncProtocol from 'y-protocols/sync'
import * as awarenessProtocol from 'y-protocols/awareness'
import { MESSAGE_AWARENESS, MESSAGE_SYNC } from '../../../shared/live/protocol'

export function syncStep1Frame(doc: Y.Doc): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, MESSAGE_SYNC)
  syncProtocol.writeSyncStep1(encoder, doc)
  return encoding.toUint8Array(encoder)
}

export function syncStep2Frame(doc: Y.Doc, stateVector: Uint8Array): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, MESSAGE_SYNC)
  syncProtocol.writeSyncStep2(encoder, doc, stateVector)
  return encoding.toUint8Array(encoder)
}

/** A sync step 2 frame around an already encoded update (answers from the room's cache). */
export function syncStep2FrameOf(update: Uint8Array): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, MESSAGE_SYNC)
  encoding.writeVarUint(encoder, syncProtocol.messageYjsSyncStep2)
  encoding.writeVarUint8Array(encoder, update)
  return encoding.toUint8Array(encoder)
}

export function syncUpdateFrame(update: Uint8Array): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, MESSAGE_SYNC)
  syncProtocol.writeUpdate(encoder, update)
  return encoding.toUint8Array(encoder)
}

export function awarenessFrame(awareness: awarenessProtocol.Awareness, clientIds: number[]): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, MESSAGE_AWARENESS)
  encoding.writeVarUint8Array(encoder, awarenessProtocol.encodeAwarenessUpdate(awareness, clientIds))
  return encoding.toUint8Array(encoder)
}

/** True when a Yjs update inserts or deletes anything (an empty step 2 is two zero bytes). */
export function updateHasContent(update: Uint8Array): boolean {
  const { structs, ds } = Y.decodeUpdate(update)
  return structs.length > 0 || ds.clients.size > 0
}
