import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

export interface PasswordResetRow {
  id: number
  userId: number
  tokenHash: string
  expiresAt: Date
  usedAt: Date | null
  createdAt: Date
  updatedAt: Date
}
export type PasswordResetInstance = Model<PasswordResetRow, Optional<PasswordResetRow, 'id' | 'usedAt' | 'createdAt' | 'updatedAt'>> & PasswordResetRow

export function definePasswordReset(sequelize: Sequelize) {
  return sequelize.define<PasswordResetInstance>('PasswordReset', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'password_resets', underscored: true })
}
