import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// One-time links sent by e-mail: workspace invitations and password resets. Only a SHA-256 of
// each token is stored, so a leaked database file does not hand out working links.
export const migration: Migration = {
  name: '0002-invitations-and-password-resets',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('invitations', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false },
        token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        invited_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        accepted_at: { type: DataTypes.DATE, allowNull: true },
        accepted_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('invitations', ['workspace_id'], { transaction })
      await qi.createTable('password_resets', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        used_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('password_resets')
    await qi.dropTable('invitations')
  },
}
