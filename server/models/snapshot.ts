import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'
import type { BoardContent } from '../../shared/board/schema'

export interface SnapshotRow {
  id: string
  boardId: string
  label: string
  authorId: number | null
  /** The frozen document as one Yjs update. */
  state: Buffer
  /** JSON text of the board content ({ settings, elements }) read from `state`. */
  summary: string
  createdAt: Date
  updatedAt: Date
}
export type SnapshotInstance = Model<SnapshotRow, Optional<SnapshotRow, 'authorId' | 'createdAt' | 'updatedAt'>> & SnapshotRow

export function defineSnapshot(sequelize: Sequelize) {
  return sequelize.define<SnapshotInstance>('Snapshot', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    boardId: { type: DataTypes.STRING(100), allowNull: false },
    label: { type: DataTypes.STRING(120), allowNull: false },
    authorId: { type: DataTypes.INTEGER, allowNull: true },
    state: { type: DataTypes.BLOB, allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'snapshots', underscored: true })
}

export interface PublicSnapshot {
  id: string
  boardId: string
  label: string
  author: { id: number, name: string } | null
  createdAt: string
  elementCount: number
  frequencyHz: number
}

export function serializeSnapshot(snapshot: SnapshotRow, author: { id: number, name: string } | null): PublicSnapshot {
  const content = JSON.parse(snapshot.summary) as BoardContent
  return {
    id: snapshot.id,
    boardId: snapshot.boardId,
    label: snapshot.label,
    author: author ? { id: author.id, name: author.name } : null,
    createdAt: snapshot.createdAt.toISOString(),
    elementCount: content.elements.length,
    frequencyHz: content.settings.frequencyHz,
  }
}

/** The snapshot with its full content, for previews. */
export function serializeSnapshotPreview(snapshot: SnapshotRow, author: { id: number, name: string } | null) {
  const content = JSON.parse(snapshot.summary) as BoardContent
  return { ...serializeSnapshot(snapshot, author), settings: content.settings, elements: content.elements }
}
