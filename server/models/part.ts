import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'
import type { LibraryPartRow } from '../../shared/library/part'

// One part of a workspace's parts library (migration 0010). `model` and `measured` hold JSON text.
export interface PartRow {
  id: number
  workspaceId: number
  partId: string
  kind: 'L' | 'C'
  value: number
  tolerance: number | null
  vRatingV: number | null
  iRatingA: number | null
  q: number | null
  model: string | null
  measured: string | null
  stocked: boolean
  description: string | null
  createdAt: Date
  updatedAt: Date
}
type Nullable = 'id' | 'tolerance' | 'vRatingV' | 'iRatingA' | 'q' | 'model' | 'measured' | 'description' | 'createdAt' | 'updatedAt'
export type PartInstance = Model<PartRow, Optional<PartRow, Nullable>> & PartRow

export function definePart(sequelize: Sequelize) {
  return sequelize.define<PartInstance>('Part', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    partId: { type: DataTypes.STRING(64), allowNull: false },
    kind: { type: DataTypes.STRING(1), allowNull: false },
    value: { type: DataTypes.DOUBLE, allowNull: false },
    tolerance: { type: DataTypes.DOUBLE, allowNull: true },
    vRatingV: { type: DataTypes.DOUBLE, allowNull: true, field: 'v_rating_v' },
    iRatingA: { type: DataTypes.DOUBLE, allowNull: true, field: 'i_rating_a' },
    q: { type: DataTypes.DOUBLE, allowNull: true },
    model: { type: DataTypes.TEXT, allowNull: true },
    measured: { type: DataTypes.TEXT, allowNull: true },
    stocked: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    description: { type: DataTypes.STRING(200), allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'parts', underscored: true })
}

/** The part as the API answers it: optional fields left out when empty. */
export function serializePart(p: PartRow): LibraryPartRow {
  const out: Record<string, unknown> = { partId: p.partId, kind: p.kind, value: p.value, stocked: Boolean(p.stocked) }
  if (p.tolerance !== null) out.tolerance = p.tolerance
  if (p.vRatingV !== null) out.vRatingV = p.vRatingV
  if (p.iRatingA !== null) out.iRatingA = p.iRatingA
  if (p.q !== null) out.q = p.q
  if (p.model) out.model = JSON.parse(p.model)
  if (p.measured) out.measured = JSON.parse(p.measured)
  if (p.description) out.description = p.description
  out.updatedAt = new Date(p.updatedAt).toISOString()
  return out as LibraryPartRow
}
