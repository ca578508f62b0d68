import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// Measured files, the local mail catcher's messages, and failed sign-ins for rate limiting.
export const migration: Migration = {
  name: '0004-uploads-outbox-login-failures',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('uploads', {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
        board_id: { type: DataTypes.STRING(100), allowNull: true, references: { model: 'boards', key: 'id' }, onDelete: 'SET NULL' },
        file_name: { type: DataTypes.STRING(255), allowNull: false },
        size_bytes: { type: DataTypes.INTEGER, allowNull: false },
        parsed: { type: DataTypes.TEXT, allowNull: false },
        uploaded_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.createTable('outbox', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        // Set when the mail concerns one workspace, so only that workspace's admins can read it.
        workspace_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'workspaces', key: 'id' }, onDelete: 'SET NULL' },
        kind: { type: DataTypes.STRING(32), allowNull: true },
        mail_from: { type: DataTypes.STRING(320), allowNull: false },
        mail_to: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.STRING(500), allowNull: false },
        text_body: { type: DataTypes.TEXT, allowNull: false },
        html_body: { type: DataTypes.TEXT, allowNull: false },
        raw: { type: DataTypes.TEXT, allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.createTable('login_failures', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        scope: { type: DataTypes.STRING(16), allowNull: false },
        key: { type: DataTypes.STRING(320), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('login_failures', ['scope', 'key', 'created_at'], { transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('login_failures')
    await qi.dropTable('outbox')
    await qi.dropTable('uploads')
  },
}
