// The room logic talks to sockets and storage only through these shapes, so tests can drive it
// with a plain `ws` server and the Nitro route can wrap its peers in three lines.
import type { LiveRole } from '../../../shared/live/protocol'

export interface LiveSocket {
  send(data: Uint8Array): void
  close(code?: number, reason?: string): void
  /** Bytes queued for this peer and not yet handed to the network (ws bufferedAmount), if known. */
  bufferedAmount?(): number
  /** Ends the connection at once, dropping what is queued (for a peer that does not read). */
  terminate?(): void
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

/** A stored state with its update log merged in, and the id of the last log row merged. */
export interface LoadedState {
  state: Uint8Array
  logId: number
}

export interface BoardStateStore {
  /** The stored Yjs state of a board (with its logged updates merged), or null when there is no such board. */
  loadState(boardId: string): Promise<Uint8Array | LoadedState | null>
  /**
   * Overwrites the stored state with the whole document as one update; the log rows up to
   * `coveredLogId` are merged in it and may be dropped.
   */
  saveState(boardId: string, update: Uint8Array, coveredLogId?: number): Promise<void>
  /** Appends a batch of accepted updates to the board's log; answers the row's id. Without it, only full saves. */
  appendUpdate?(boardId: string, update: Uint8Array): Promise<number>
}

/** What one connection and one document may cost the server. */
export interface LiveLimits {
  /** Frames a connection may send per second, sustained… */
  framesPerSecond: number
  /** …and in one burst; past it the connection is closed (1008). */
  frameBurst: number
  /** Bytes queued towards a peer that is not reading; past it the connection is ended. */
  maxPendingSendBytes: number
  /** Encoded size of a board's document; an edit that would pass it is refused and its sender closed (4413). */
  maxDocBytes: number
}

export const DEFAULT_LIMITS: LiveLimits = {
  // A client sends at most ~20 presence frames a second (usePresence throttles to 50 ms) plus its
  // edits: 100 a second with bursts of 200 is several times what a person produces.
  framesPerSecond: 100,
  frameBurst: 200,
  // Four times the largest document, so a slow reader still gets a full sync.
  maxPendingSendBytes: 16 * 1024 * 1024,
  // A board of 100 elements with a long edit history encodes to well under 100 KB.
  maxDocBytes: 4 * 1024 * 1024,
}

export interface LiveTimings {
  /** Accepted updates reach the update log at most this long after they arrive (plus one write). */
  logIntervalMs: number
  /** A full save (compaction of the log into the state) follows edits by this much… */
  saveDebounceMs: number
  /** …and never later than this after the first change it covers. */
  saveMaxWaitMs: number
  /** Awareness states not renewed for this long are removed (clients renew every 15 s). */
  presenceMaxAgeMs: number
  /** A connection silent for this long is closed (half-open TCP). */
  idleCloseMs: number
  sweepIntervalMs: number
}

export const DEFAULT_TIMINGS: LiveTimings = {
  // Every accepted edit is in the update log within 200 ms plus one SQLite write, well inside the
  // promised 1 s of edits a SIGKILL may lose; the full state is rewritten 1.5 s after a quiet edit
  // and at least every 10 s under continuous editing (compaction only: nothing waits on it).
  logIntervalMs: 200,
  saveDebounceMs: 1500,
  saveMaxWaitMs: 10_000,
  presenceMaxAgeMs: 25_000,
  idleCloseMs: 45_000,
  sweepIntervalMs: 2000,
}
