// Snapshots: frozen copies of a board's Yjs state with a label and author; restoring one is a
// forward change to the live document, after keeping the present state as a snapshot of its own.
import { randomUUID } from 'node:crypto'
import { ORIGIN_RESTORE, boardFromState } from '#shared/board/ydoc'
import type { BoardContent } from '#shared/board/schema'
import type { BoardInstance, SnapshotInstance, UserInstance } from '../models'
import { contentJson, currentBoardState, replaceBoardContent } from '../database/board-store'

export async function takeSnapshot(board: BoardInstance, label: string, author: UserInstance): Promise<SnapshotInstance> {
  const sequelize = await useDb()
  const { Snapshot } = await useModels()
  const state = (await currentBoardState(sequelize, board.id))!
  return Snapshot.create({
    id: randomUUID(), boardId: board.id, label, authorId: author.id,
    state: Buffer.from(state), summary: contentJson(boardFromState(state)),
  })
}

/** Keeps the present state as a snapshot, then writes the snapshot's content as a new change. */
export async function restoreSnapshot(board: BoardInstance, snapshot: SnapshotInstance, user: UserInstance) {
  const kept = await takeSnapshot(board, `Before restoring "${snapshot.label}"`.slice(0, 120), user)
  const content = JSON.parse(snapshot.summary) as BoardContent
  await replaceBoardContent(await useDb(), board.id, content, ORIGIN_RESTORE)
  return kept
}

export function authorOf(snapshot: SnapshotInstance): { id: number, name: string } | null {
  return (snapshot as unknown as { author?: UserInstance | null }).author ?? null
}
