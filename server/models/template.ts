import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'
import type { BoardContent } from '../../shared/board/schema'
import type { PublicTemplate } from '../../shared/types/api'

export interface TemplateRow {
  id: string
  workspaceId: number
  snapshotId: string | null
  name: string
  /** A copy of the published snapshot's Yjs state: the template outlives its board. */
  state: Buffer
  summary: string
  publishedBy: number | null
  createdAt: Date
  updatedAt: Date
}
export type TemplateInstance = Model<TemplateRow, Optional<TemplateRow, 'snapshotId' | 'publishedBy' | 'createdAt' | 'updatedAt'>> & TemplateRow

export function defineTemplate(sequelize: Sequelize) {
  return sequelize.define<TemplateInstance>('Template', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    snapshotId: { type: DataTypes.STRING(36), allowNull: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    state: { type: DataTypes.BLOB, allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    publishedBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'templates', underscored: true })
}

export function serializeTemplate(template: TemplateRow, publisher: { id: number, name: string } | null): PublicTemplate {
  const content = JSON.parse(template.summary) as BoardContent
  return {
    id: template.id,
    name: template.name,
    snapshotId: template.snapshotId,
    publishedBy: publisher ? { id: publisher.id, name: publisher.name } : null,
    createdAt: template.createdAt.toISOString(),
    settings: content.settings,
    elements: content.elements,
  }
}
export type { PublicTemplate } from '../../shared/types/api'
