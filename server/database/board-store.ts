// Boards in SQLite: the live Yjs state is the source of truth; the JSON a client sees is always
// read from it (boardFromState), never rebuilt the other way once a state exists.
import { randomUUID } from 'node:crypto'
import * as Y from 'yjs'
import { Op, type Sequelize, type Transaction } from 'sequelize'
import { modelsFor, type BoardInstance, type BoardSummary } from '../models'
import { DEFAULT_SETTINGS, TYPICAL_PART_Q, type BoardContent, type BoardSnapshot } from '../../shared/board/schema'
import { applyBoardState, boardFromState, createBoardDoc, encodeBoardState } from '../../shared/board/ydoc'
import { replaceBoard } from '../../shared/board/ops'
import { liveBridge } from './live-bridge'

/**
 * A new blank board. It starts with finite Q (typical small RF chip parts: L 40, C 200 — common
 * practice) so losses show from the first element; DEFAULT_SETTINGS stays lossless because it also
 * fills keys an older document lacks, and those boards keep their values.
 */
export const BLANK_BOARD: BoardContent = { settings: { ...DEFAULT_SETTINGS, defaultQ: { ...TYPICAL_PART_Q } }, elements: [] }

export function summarize(snapshot: BoardContent): BoardSummary {
  const { z0, frequencyHz, bandStartHz, bandStopHz, bandPoints } = snapshot.settings
  return { z0, frequencyHz, bandStartHz, bandStopHz, bandPoints, elementCount: snapshot.elements.length }
}

/** The content a snapshot or template keeps as readable JSON beside its Yjs state. */
export function contentJson(snapshot: BoardSnapshot): string {
  return JSON.stringify({ settings: snapshot.settings, elements: snapshot.elements })
}

export function stateBytes(row: { state: Buffer }): Uint8Array {
  return new Uint8Array(row.state.buffer, row.state.byteOffset, row.state.byteLength)
}

/** The board's JSON as the REST API answers it. */
export function boardJson(board: BoardInstance, workspaceSlug: string, state: Uint8Array = stateBytes(board)) {
  const { settings, elements } = boardFromState(state)
  return { id: board.id, name: board.name, workspace: workspaceSlug, settings, elements, updatedAt: board.updatedAt.toISOString() }
}
export type BoardJson = ReturnType<typeof boardJson>

export async function createBoardRow(
  sequelize: Sequelize,
  input: { id?: string, workspaceId: number, name: string, createdBy: number | null, state?: Uint8Array, content?: BoardContent },
  transaction?: Transaction,
): Promise<BoardInstance> {
  const { Board } = modelsFor(sequelize)
  let state = input.state
  if (!state) {
    const doc = createBoardDoc(input.content ?? BLANK_BOARD)
    state = encodeBoardState(doc)
    doc.destroy()
  }
  return Board.create({
    id: input.id ?? randomUUID(),
    workspaceId: input.workspaceId,
    name: input.name.trim(),
    state: Buffer.from(state),
    summary: JSON.stringify(summarize(boardFromState(state))),
    createdBy: input.createdBy,
  }, { transaction })
}

/**
 * Stores a full state (and its listing summary); used by restores and by the live rooms. The write
 * merges with what is stored, inside one transaction holding the row (FOR UPDATE on PostgreSQL;
 * SQLite has one writer): with several nodes each saves its own copy of a board, and a copy that
 * missed another node's latest edit must not write it away (Yjs states merge without loss). The
 * update-log rows up to `coveredLogId` are merged in too and dropped in the same transaction:
 * they may hold another node's updates that this copy has not seen, and a crash between the two
 * steps never loses or half-writes anything.
 */
export async function saveBoardState(sequelize: Sequelize, boardId: string, state: Uint8Array, coveredLogId = 0): Promise<void> {
  const { Board, BoardUpdate } = modelsFor(sequelize)
  await sequelize.transaction(async (transaction) => {
    const row = await Board.findByPk(boardId, { attributes: ['id', 'state'], transaction, lock: transaction.LOCK.UPDATE })
    if (!row) return
    const covered = coveredLogId > 0
      ? await BoardUpdate.findAll({ where: { boardId, id: { [Op.lte]: coveredLogId } }, attributes: ['id', 'data'], order: [['id', 'ASC']], transaction })
      : []
    const merged = mergeStates([stateBytes(row), ...covered.map(update => stateBytes({ state: update.data })), state])
    await Board.update(
      { state: Buffer.from(merged), summary: JSON.stringify(summarize(boardFromState(merged))), updatedAt: new Date() },
      { where: { id: boardId }, transaction },
    )
    if (covered.length) await BoardUpdate.destroy({ where: { boardId, id: { [Op.lte]: coveredLogId } }, transaction })
  })
}

/** The union of Yjs states, re-encoded from one document so deleted content is collected. */
export function mergeStates(states: Uint8Array[]): Uint8Array {
  const doc = new Y.Doc()
  try {
    for (const state of states) applyBoardState(doc, state)
    return encodeBoardState(doc)
  }
  finally {
    doc.destroy()
  }
}

/** Appends one batch of accepted live updates to the board's log; answers the row's id. */
export async function appendBoardUpdate(sequelize: Sequelize, boardId: string, update: Uint8Array): Promise<number> {
  const { BoardUpdate } = modelsFor(sequelize)
  const row = await BoardUpdate.create({ boardId, data: Buffer.from(update) })
  return row.id
}

export interface StoredBoardState {
  /** boards.state with every logged update merged in. */
  state: Uint8Array
  /** The id of the last logged update merged in (0 when the log was empty). */
  logId: number
}

/** The stored state with the update log merged in (what a crash left is all there). */
export async function loadStoredBoard(sequelize: Sequelize, boardId: string): Promise<StoredBoardState | null> {
  const { Board, BoardUpdate } = modelsFor(sequelize)
  const board = await Board.findByPk(boardId, { attributes: ['id', 'state'] })
  if (!board) return null
  const log = await BoardUpdate.findAll({ where: { boardId }, attributes: ['id', 'data'], order: [['id', 'ASC']] })
  const state = stateBytes(board)
  if (log.length === 0) return { state, logId: 0 }
  return { state: Y.mergeUpdates([state, ...log.map(row => stateBytes({ state: row.data }))]), logId: log[log.length - 1]!.id }
}

export async function loadBoardState(sequelize: Sequelize, boardId: string): Promise<Uint8Array | null> {
  return (await loadStoredBoard(sequelize, boardId))?.state ?? null
}

/**
 * Replaces the board's content as one forward change with the given origin (ORIGIN_RESTORE for a
 * restore). With a live server registered, it edits the room's document (connected editors see it
 * at once and the room saves it); else it edits the stored state and saves.
 */
export async function replaceBoardContent(sequelize: Sequelize, boardId: string, content: BoardContent, origin: unknown): Promise<void> {
  const bridge = liveBridge()
  if (bridge) {
    await bridge.editBoard(boardId, doc => replaceBoard(doc, content, origin))
    return
  }
  const stored = await loadBoardState(sequelize, boardId)
  if (!stored) return
  const doc = new Y.Doc()
  try {
    applyBoardState(doc, stored)
    replaceBoard(doc, content, origin)
    await saveBoardState(sequelize, boardId, encodeBoardState(doc))
  }
  finally {
    doc.destroy()
  }
}

/** The present state of a board: the live room's document if one is open, else the stored one. */
export async function currentBoardState(sequelize: Sequelize, boardId: string): Promise<Uint8Array | null> {
  const live = liveBridge()?.openDoc(boardId)
  return live ? encodeBoardState(live) : loadBoardState(sequelize, boardId)
}
