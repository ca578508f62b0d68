// The room logic talks to sockets and storage only through these shapes, so tests can drive it
// with a plain `ws` server and the Nitro route can wrap its peers in three lines.
import type { LiveRole } from '../../../shared/live/protocol'

export interface LiveSocket {
  send(data: Uint8Array): void
  close(code?: number, reason?: string): void
}

/** Who is on the other end, fixed at upgrade time from the session and the membership. */
export interface LiveIdentity {
  userId: number
  name: string
  colour: string
  role: LiveRole
  workspaceId: number
  /** The hashed id of the session that opened the connection (sign-out closes exactly these). */
  sessionKey?: string
}

export interface BoardStateStore {
  /** The stored Yjs state of a board, or null when there is no such board. */
  loadState(boardId: string): Promise<Uint8Array | null>
  /** Overwrites the stored state with the whole document as one update. */
  saveState(boardId: string, update: Uint8Array): Promise<void>
}

export interface LiveTimings {
  saveDebounceMs: number
  saveMaxWaitMs: number
  /** Awareness states not renewed for this long are removed (clients renew every 15 s). */
  presenceMaxAgeMs: number
  /** A connection silent for this long is closed (half-open TCP). */
  idleCloseMs: number
  sweepIntervalMs: number
}

export const DEFAULT_TIMINGS: LiveTimings = {
  // A quiet edit is on disk about 1.5 s later, inside the promised 2 s.
  saveDebounceMs: 1500,
  saveMaxWaitMs: 10_000,
  presenceMaxAgeMs: 25_000,
  idleCloseMs: 45_000,
  sweepIntervalMs: 2000,
}
