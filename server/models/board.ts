import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

/** What a listing needs without decoding the Yjs state; rewritten whenever the state is saved. */
export interface BoardSummary {
  z0: number
  frequencyHz: number
  bandStartHz: number
  bandStopHz: number
  bandPoints: number
  elementCount: number
}

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

export interface BoardListEntry extends BoardSummary { id: string, name: string, updatedAt: string }
/** Someone who has a board open now (server-stamped name and colour; never stored). */
export interface BoardPresence { userId: number, name: string, colour: string }
export type BoardListItem = BoardListEntry & { present: BoardPresence[] }

export function serializeBoardListEntry(board: BoardRow): BoardListEntry {
  const summary = JSON.parse(board.summary) as BoardSummary
  return { id: board.id, name: board.name, ...summary, updatedAt: board.updatedAt.toISOString() }
}
