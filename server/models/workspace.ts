import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

export interface WorkspaceRow {
  id: number
  slug: string
  name: string
  createdAt: Date
  updatedAt: Date
}
export type WorkspaceInstance = Model<WorkspaceRow, Optional<WorkspaceRow, 'id' | 'createdAt' | 'updatedAt'>> & WorkspaceRow

export function defineWorkspace(sequelize: Sequelize) {
  return sequelize.define<WorkspaceInstance>('Workspace', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'workspaces', underscored: true })
}

export interface PublicWorkspace { slug: string, name: string }

export function serializeWorkspace(workspace: WorkspaceRow): PublicWorkspace {
  return { slug: workspace.slug, name: workspace.name }
}

/** Slugs: lower-case letters, digits and single hyphens, 2–64 characters. */
export const SLUG_PATTERN = /^[a-z0-9](?:[a-z0-9]|-(?=[a-z0-9])){1,63}$/

/** A slug made from a name ("Brackwater Sensor Works" → "brackwater-sensor-works"), not yet unique. */
export function slugFromName(name: string): string {
  const slug = name.normalize('NFKD').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 48).replace(/-+$/, '')
  return slug.length >= 2 ? slug : `team-${slug || 'x'}`
}
