// Where board documents come from. For now the demo boards, each passed through the same Yjs
// round trip a stored board takes (createBoardDoc → encode → boardFromState), so the answer has
// exactly the shape a stored document reads back as. The database-backed version replaces only
// the body of loadBoard.
import { DEMO_BOARDS } from '#shared/board/demo-boards'
import { boardFromState, createBoardDoc, encodeBoardState } from '#shared/board/ydoc'
import type { BoardElement, BoardSettings } from '#shared/board/schema'

export interface BoardRecord {
  id: string
  name: string
  workspace: string
  settings: BoardSettings
  elements: BoardElement[]
  updatedAt: string
}

// The demo fixtures are as old as this server process.
const FIXTURES_LOADED_AT = new Date().toISOString()

/** The board as plain JSON, or null when there is no board with that id. */
export async function loadBoard(id: string): Promise<BoardRecord | null> {
  const demo = DEMO_BOARDS.find(b => b.id === id)
  if (!demo) return null
  const doc = createBoardDoc(demo)
  const { settings, elements } = boardFromState(encodeBoardState(doc))
  doc.destroy()
  return { id: demo.id, name: demo.name, workspace: demo.workspace, settings, elements, updatedAt: FIXTURES_LOADED_AT }
}
