import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

/** One signed-in browser. `updatedAt` is when its lifetime was last extended by use. */
export interface SessionRow {
  id: string
  userId: number
  expiresAt: Date
  revokedAt: Date | null
  createdAt: Date
  updatedAt: Date
}
export type SessionInstance = Model<SessionRow, Optional<SessionRow, 'revokedAt' | 'createdAt' | 'updatedAt'>> & SessionRow

export function defineSession(sequelize: Sequelize) {
  return sequelize.define<SessionInstance>('Session', {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'sessions', underscored: true })
}
