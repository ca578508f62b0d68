import { DataTypes } from 'sequelize'
import type { Migration } from './types'

// The workspace parts library: each real L or C part the team may use, with its model or its
// maker's fixture measurement (JSON text), its ratings and whether it is stocked. Plain types only
// (DOUBLE, BOOLEAN, TEXT), so the same migration runs on SQLite and PostgreSQL.
export const migration: Migration = {
  name: '0010-parts-library',
  async up(qi, sequelize) {
    await sequelize.transaction(async (transaction) => {
      await qi.createTable('parts', {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
        part_id: { type: DataTypes.STRING(64), allowNull: false },
        kind: { type: DataTypes.STRING(1), allowNull: false },
        value: { type: DataTypes.DOUBLE, allowNull: false },
        tolerance: { type: DataTypes.DOUBLE, allowNull: true },
        v_rating_v: { type: DataTypes.DOUBLE, allowNull: true },
        i_rating_a: { type: DataTypes.DOUBLE, allowNull: true },
        q: { type: DataTypes.DOUBLE, allowNull: true },
        model: { type: DataTypes.TEXT, allowNull: true },
        measured: { type: DataTypes.TEXT, allowNull: true },
        stocked: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        description: { type: DataTypes.STRING(200), allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      }, { transaction })
      await qi.addIndex('parts', ['workspace_id', 'part_id'], { unique: true, name: 'parts_workspace_part_id', transaction })
    })
  },
  async down(qi) {
    await qi.dropTable('parts')
  },
}
