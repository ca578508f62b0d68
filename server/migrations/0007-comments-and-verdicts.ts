import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// Review: comments (a thread's first comment carries the anchor; replies point at it through
// parent_id) and verdicts on snapshots. Only portable column types (PostgreSQL runs the same).
export const migration: Migration = {
  name: '0007-comments-and-verdicts',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('comments', {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        board_id: { type: DataTypes.STRING(100), allowNull: false, references: { model: 'boards', key: 'id' }, onDelete: 'CASCADE' },
        parent_id: { type: DataTypes.STRING(36), allowNull: true, references: { model: 'comments', key: 'id' }, onDelete: 'CASCADE' },
        author_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        body: { type: DataTypes.TEXT, allowNull: false },
        // point | element | frequency, or null for a thread about the whole board (and every reply).
        anchor_kind: { type: DataTypes.STRING(16), allowNull: true },
        gamma_re: { type: DataTypes.DOUBLE, allowNull: true },
        gamma_im: { type: DataTypes.DOUBLE, allowNull: true },
        element_id: { type: DataTypes.STRING(100), allowNull: true },
        frequency_hz: { type: DataTypes.DOUBLE, allowNull: true },
        resolved_at: { type: DataTypes.DATE, allowNull: true },
        resolved_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        edited_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('comments', ['board_id', 'created_at'], { transaction })
      await qi.addIndex('comments', ['parent_id'], { transaction })
      await qi.createTable('verdicts', {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        snapshot_id: { type: DataTypes.STRING(36), allowNull: false, references: { model: 'snapshots', key: 'id' }, onDelete: 'CASCADE' },
        giver_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        // approved | changes-requested
        verdict: { type: DataTypes.STRING(24), allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('verdicts', ['snapshot_id', 'created_at'], { transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('verdicts')
    await qi.dropTable('comments')
  },
}
