import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

/** One batch of accepted live updates of a board, not yet compacted into boards.state. */
export interface BoardUpdateRow {
  id: number
  boardId: string
  /** Yjs update (the batch merged with Y.mergeUpdates). */
  data: Buffer
  createdAt: Date
}
export type BoardUpdateInstance = Model<BoardUpdateRow, Optional<BoardUpdateRow, 'id' | 'createdAt'>> & BoardUpdateRow

export function defineBoardUpdate(sequelize: Sequelize) {
  return sequelize.define<BoardUpdateInstance>('BoardUpdate', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    boardId: { type: DataTypes.STRING(100), allowNull: false },
    data: { type: DataTypes.BLOB, allowNull: false },
    createdAt: DataTypes.DATE,
  }, { tableName: 'board_updates', underscored: true, updatedAt: false })
}
