// The JSON shapes the REST API answers and the pages read: one definition for both sides, so
// client code never imports server modules. The server's serialisers return these types.
import type { BoardContent } from '../board/schema'
import type { Role } from '../accounts/fields'

/** A board as the live page opens it (GET /api/boards/:id). */
export interface BoardRecordInput extends BoardContent {
  id: string
  name: string
  workspace?: string
}

/** What a listing needs without decoding the Yjs state; rewritten whenever the state is saved. */
export interface BoardSummary {
  z0: number
  frequencyHz: number
  bandStartHz: number
  bandStopHz: number
  bandPoints: number
  elementCount: number
}

export interface BoardListEntry extends BoardSummary { id: string, name: string, updatedAt: string }
/** Someone who has a board open now (server-stamped name and colour; never stored). */
export interface BoardPresence { userId: number, name: string, colour: string }
export type BoardListItem = BoardListEntry & { present: BoardPresence[] }

export interface PublicMember { userId: number, name: string, email: string, role: Role, since: string }

export interface PublicTemplate {
  id: string
  name: string
  snapshotId: string | null
  publishedBy: { id: number, name: string } | null
  createdAt: string
  settings: BoardContent['settings']
  elements: BoardContent['elements']
}
