import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// The update log of live boards: accepted Yjs updates are appended here in small batches within a
// fraction of a second, so a crash loses at most that much; the room compacts them into
// boards.state in the background and a load merges state + log.
export const migration: Migration = {
  name: '0005-board-updates',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('board_updates', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        board_id: { type: DataTypes.STRING(100), allowNull: false, references: { model: 'boards', key: 'id' }, onDelete: 'CASCADE' },
        data: { type: DataTypes.BLOB, allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('board_updates', ['board_id', 'id'], { transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('board_updates')
  },
}
