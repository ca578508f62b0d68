// Frame types of the live connection. 0, 1, 2 and 3 are the y-protocols messages that y-websocket
// speaks; ACCESS_NOTICE is our own: the server tells each peer whether it may edit, so a reviewer's
// client can show read-only instead of silently losing its edits.
import * as encoding from 'lib0/encoding'
import * as decoding from 'lib0/decoding'

export const MESSAGE_SYNC = 0
export const MESSAGE_AWARENESS = 1
export const MESSAGE_AUTH = 2
export const MESSAGE_QUERY_AWARENESS = 3
export const MESSAGE_ACCESS_NOTICE = 100

export type LiveRole = 'admin' | 'designer' | 'reviewer'

export interface AccessNotice {
  readOnly: boolean
  role: LiveRole
  /** Set when the server has just dropped document changes from this peer. */
  dropped?: boolean
}

export function encodeAccessNotice(notice: AccessNotice): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, MESSAGE_ACCESS_NOTICE)
  encoding.writeVarString(encoder, JSON.stringify(notice))
  return encoding.toUint8Array(encoder)
}

/** Reads the notice body after the type byte; a malformed body reads as read-only (the safe side). */
export function readAccessNotice(decoder: decoding.Decoder): AccessNotice {
  try {
    const raw = JSON.parse(decoding.readVarString(decoder)) as Partial<AccessNotice>
    const role: LiveRole = raw.role === 'admin' || raw.role === 'designer' ? raw.role : 'reviewer'
    return { readOnly: raw.readOnly !== false, role, dropped: raw.dropped === true }
  }
  catch {
    return { readOnly: true, role: 'reviewer' }
  }
}

/** Close codes. 4400–4499 tell y-websocket not to reconnect; others are retried with back-off. */
export const CLOSE_MESSAGE_TOO_BIG = 1009
export const CLOSE_POLICY = 1008
export const CLOSE_ROLE_CHANGED = 4001
export const CLOSE_LOAD_FAILED = 4500
export const CLOSE_SHUTDOWN = 1012
export const CLOSE_MALFORMED = 4400
export const CLOSE_ACCESS_REVOKED = 4403
export const CLOSE_BOARD_GONE = 4404
/** The board's document is at its size cap; the edit that would pass it is refused. */
export const CLOSE_DOCUMENT_TOO_LARGE = 4413

/** Frames above this size close the connection. */
export const MAX_FRAME_BYTES = 1024 * 1024
/** Frames a peer may send before its room has loaded. */
export const MAX_FRAMES_BEFORE_READY = 100
