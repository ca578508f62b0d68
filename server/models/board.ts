import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

import type { BoardListEntry, BoardSummary } from '../../shared/types/api'

export type { BoardListEntry, BoardListItem, BoardPresence, BoardSummary } from '../../shared/types/api'

export interface BoardRow {
  id: string
  workspaceId: number
  name: string
  /** The whole document as one Yjs update (Y.encodeStateAsUpdate). */
  state: Buffer
  /** JSON text of a BoardSummary. */
  summary: string
  createdBy: number | null
  createdAt: Date
  updatedAt: Date
}
export type BoardInstance = Model<BoardRow, Optional<BoardRow, 'createdBy' | 'createdAt' | 'updatedAt'>> & BoardRow

export function defineBoard(sequelize: Sequelize) {
  return sequelize.define<BoardInstance>('Board', {
    id: { type: DataTypes.STRING(100), primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    state: { type: DataTypes.BLOB, allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    createdBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'boards', underscored: true })
}

export function serializeBoardListEntry(board: BoardRow): BoardListEntry {
  const summary = JSON.parse(board.summary) as BoardSummary
  return { id: board.id, name: board.name, ...summary, updatedAt: board.updatedAt.toISOString() }
}
