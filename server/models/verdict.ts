import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

export const VERDICTS = ['approved', 'changes-requested'] as const
export type VerdictKind = (typeof VERDICTS)[number]

export interface VerdictRow {
  id: string
  snapshotId: string
  giverId: number | null
  verdict: VerdictKind
  note: string | null
  createdAt: Date
  updatedAt: Date
}
export type VerdictInstance = Model<VerdictRow, Optional<VerdictRow, 'giverId' | 'note' | 'createdAt' | 'updatedAt'>> & VerdictRow

export function defineVerdict(sequelize: Sequelize) {
  return sequelize.define<VerdictInstance>('Verdict', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    snapshotId: { type: DataTypes.STRING(36), allowNull: false },
    giverId: { type: DataTypes.INTEGER, allowNull: true },
    verdict: { type: DataTypes.STRING(24), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'verdicts', underscored: true })
}

export interface PublicVerdict {
  id: string
  snapshotId: string
  verdict: VerdictKind
  note: string | null
  giver: { id: number, name: string } | null
  giverName: string | null
  createdAt: string
}

export function serializeVerdict(v: VerdictRow, giver: { id: number, name: string } | null): PublicVerdict {
  return {
    id: v.id, snapshotId: v.snapshotId, verdict: v.verdict, note: v.note,
    giver: giver ? { id: giver.id, name: giver.name } : null, giverName: giver?.name ?? null,
    createdAt: v.createdAt.toISOString(),
  }
}
