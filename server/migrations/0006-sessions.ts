import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// Server-side sessions: the sealed cookie names one row, so a session can be ended on the server
// (sign-out) and expires after a stated lifetime, whatever the browser keeps.
export const migration: Migration = {
  name: '0006-sessions',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('sessions', {
        // SHA-256 of the random id carried in the sealed cookie.
        id: { type: DataTypes.STRING(64), primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        revoked_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('sessions', ['user_id'], { transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('sessions')
  },
}
