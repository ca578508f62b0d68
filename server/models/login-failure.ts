import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

/**
 * One counted attempt against the account (`scope: 'account'`) or the client address; other limits
 * prefix the scope ('forgot-account', 'forgot-address').
 */
export interface LoginFailureRow {
  id: number
  scope: string
  key: string
  createdAt: Date
}
export type LoginFailureInstance = Model<LoginFailureRow, Optional<LoginFailureRow, 'id' | 'createdAt'>> & LoginFailureRow

export function defineLoginFailure(sequelize: Sequelize) {
  return sequelize.define<LoginFailureInstance>('LoginFailure', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    scope: { type: DataTypes.STRING(16), allowNull: false },
    key: { type: DataTypes.STRING(320), allowNull: false },
    createdAt: DataTypes.DATE,
  }, { tableName: 'login_failures', underscored: true, updatedAt: false })
}
