import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// The first tables: people, teams and who belongs where with which role.
export const migration: Migration = {
  name: '0001-users-and-workspaces',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('users', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        password_hash: { type: DataTypes.STRING(255), allowNull: false },
        session_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.createTable('workspaces', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.createTable('memberships', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
        role: { type: DataTypes.STRING(16), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('memberships', ['user_id', 'workspace_id'], { unique: true, transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('memberships')
    await qi.dropTable('workspaces')
    await qi.dropTable('users')
  },
}
