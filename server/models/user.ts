import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

export interface UserRow {
  id: number
  email: string
  name: string
  passwordHash: string
  /** Raised by sign-out-everywhere and password resets; sessions carrying an older one are refused. */
  sessionVersion: number
  createdAt: Date
  updatedAt: Date
}
export type UserInstance = Model<UserRow, Optional<UserRow, 'id' | 'sessionVersion' | 'createdAt' | 'updatedAt'>> & UserRow

export function defineUser(sequelize: Sequelize) {
  return sequelize.define<UserInstance>('User', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(255), allowNull: false },
    sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'users', underscored: true })
}

export interface PublicUser { id: number, email: string, name: string }

export function serializeUser(user: UserRow): PublicUser {
  return { id: user.id, email: user.email, name: user.name }
}

/** E-mail addresses compare case-insensitively; we store them lower-cased and trimmed. */
export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase()
}
