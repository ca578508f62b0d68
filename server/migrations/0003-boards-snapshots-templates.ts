import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// Boards hold their live Yjs state (one full update) plus a small JSON summary for listings;
// snapshots and templates keep a frozen copy of a state with its readable JSON beside it.
export const migration: Migration = {
  name: '0003-boards-snapshots-templates',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('boards', {
        id: { type: DataTypes.STRING(100), primaryKey: true },
        workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
        name: { type: DataTypes.STRING(120), allowNull: false },
        state: { type: DataTypes.BLOB, allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        created_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('boards', ['workspace_id'], { transaction })
      await qi.createTable('snapshots', {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        board_id: { type: DataTypes.STRING(100), allowNull: false, references: { model: 'boards', key: 'id' }, onDelete: 'CASCADE' },
        label: { type: DataTypes.STRING(120), allowNull: false },
        author_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        state: { type: DataTypes.BLOB, allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('snapshots', ['board_id', 'created_at'], { transaction })
      await qi.createTable('templates', {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
        snapshot_id: { type: DataTypes.STRING(36), allowNull: true, references: { model: 'snapshots', key: 'id' }, onDelete: 'SET NULL' },
        name: { type: DataTypes.STRING(120), allowNull: false },
        state: { type: DataTypes.BLOB, allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        published_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('templates', ['workspace_id'], { transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('templates')
    await qi.dropTable('snapshots')
    await qi.dropTable('boards')
  },
}
