// Where board documents come from: the boards table, whose Yjs state is the source of truth.
// The JSON is always read from that state (boardFromState), so it has exactly the shape a live
// document reads back as.
import type { BoardElement, BoardSettings } from '#shared/board/schema'
import { boardJson, currentBoardState, loadBoardState, saveBoardState } from '../database/board-store'

export interface BoardRecord {
  id: string
  name: string
  workspace: string
  settings: BoardSettings
  elements: BoardElement[]
  updatedAt: string
}

/** The board as plain JSON (from the live room's document when one is open), or null. */
export async function loadBoard(id: string): Promise<BoardRecord | null> {
  const { Board, Workspace } = await useModels()
  const board = await Board.findByPk(id)
  const workspace = board && await Workspace.findByPk(board.workspaceId, { attributes: ['id', 'slug'] })
  if (!board || !workspace) return null
  const state = await currentBoardState(await useDb(), id)
  return boardJson(board, workspace.slug, state ?? undefined)
}

/** Storage for the live rooms: the stored state, and saving a new one (with its listing summary). */
export const boardStateStore = {
  async loadState(boardId: string): Promise<Uint8Array | null> {
    return loadBoardState(await useDb(), boardId)
  },
  async saveState(boardId: string, update: Uint8Array): Promise<void> {
    await saveBoardState(await useDb(), boardId, update)
  },
}
