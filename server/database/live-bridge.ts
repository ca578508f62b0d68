// How REST routes reach the live server without importing it: the live server registers itself
// here at start. Without one (scripts, tests of the database alone) routes work on stored state.
import type * as Y from 'yjs'
import type { Role } from '../models'

export interface LiveBridge {
  /** The open room's document, if someone has the board open. */
  openDoc(boardId: string): Y.Doc | undefined
  /** Runs a server-side edit on the board's live document and resolves once it is saved. */
  editBoard<T>(boardId: string, edit: (doc: Y.Doc) => T): Promise<T>
  /** A member's role changed (null: removed); their open sockets are refreshed or closed. */
  refreshRole?(userId: number, workspaceId: number, role: Role | null): unknown
  /** Closes every live socket of a user (their sessions have ended). */
  closeSocketsOf?(userId: number): unknown
  /** Closes the live sockets opened with one session (its hashed id), after sign-out. */
  closeSession?(sessionKey: string): unknown
  /** Closes every live socket of a deleted board, without saving its room again. */
  closeBoard?(boardId: string): unknown
  /** Who has the board open right now (name and colour from their accounts). */
  presentIn?(boardId: string): { userId: number, name: string, colour: string }[]
  /** The same for many boards at once, on every node (several nodes: through Redis). */
  presentInMany?(boardIds: string[]): Promise<Map<string, { userId: number, name: string, colour: string }[]>>
}

let bridge: LiveBridge | undefined

export function setLiveBridge(next: LiveBridge | undefined): void {
  bridge = next
}

export function liveBridge(): LiveBridge | undefined {
  return bridge
}
