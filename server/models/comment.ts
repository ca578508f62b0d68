import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

export const ANCHOR_KINDS = ['point', 'element', 'frequency'] as const
export type AnchorKind = (typeof ANCHOR_KINDS)[number]

/** Where a thread is pinned: a point of the chart (Γ), an element (by id), or a frequency (Hz). */
export type CommentAnchor =
  | { kind: 'point', gamma: { re: number, im: number } }
  | { kind: 'element', elementId: string }
  | { kind: 'frequency', hz: number }

export interface CommentRow {
  id: string
  boardId: string
  /** The thread's first comment for a reply; null for the first comment itself. */
  parentId: string | null
  authorId: number | null
  body: string
  anchorKind: AnchorKind | null
  gammaRe: number | null
  gammaIm: number | null
  elementId: string | null
  frequencyHz: number | null
  resolvedAt: Date | null
  resolvedBy: number | null
  editedAt: Date | null
  createdAt: Date
  updatedAt: Date
}
type Optionals = 'parentId' | 'authorId' | 'anchorKind' | 'gammaRe' | 'gammaIm' | 'elementId' | 'frequencyHz'
  | 'resolvedAt' | 'resolvedBy' | 'editedAt' | 'createdAt' | 'updatedAt'
export type CommentInstance = Model<CommentRow, Optional<CommentRow, Optionals>> & CommentRow

export function defineComment(sequelize: Sequelize) {
  return sequelize.define<CommentInstance>('Comment', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    boardId: { type: DataTypes.STRING(100), allowNull: false },
    parentId: { type: DataTypes.STRING(36), allowNull: true },
    authorId: { type: DataTypes.INTEGER, allowNull: true },
    body: { type: DataTypes.TEXT, allowNull: false },
    anchorKind: { type: DataTypes.STRING(16), allowNull: true },
    gammaRe: { type: DataTypes.DOUBLE, allowNull: true },
    gammaIm: { type: DataTypes.DOUBLE, allowNull: true },
    elementId: { type: DataTypes.STRING(100), allowNull: true },
    frequencyHz: { type: DataTypes.DOUBLE, allowNull: true },
    resolvedAt: { type: DataTypes.DATE, allowNull: true },
    resolvedBy: { type: DataTypes.INTEGER, allowNull: true },
    editedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'comments', underscored: true })
}

/** The anchor columns of a row as the API's anchor, or null. */
export function anchorOf(row: CommentRow): CommentAnchor | null {
  if (row.anchorKind === 'point') return { kind: 'point', gamma: { re: row.gammaRe!, im: row.gammaIm! } }
  if (row.anchorKind === 'element') return { kind: 'element', elementId: row.elementId! }
  if (row.anchorKind === 'frequency') return { kind: 'frequency', hz: row.frequencyHz! }
  return null
}

/** An anchor as the columns that store it (every anchor column set, the unused ones null). */
export function anchorColumns(anchor: CommentAnchor | undefined) {
  return {
    anchorKind: anchor?.kind ?? null,
    gammaRe: anchor?.kind === 'point' ? anchor.gamma.re : null,
    gammaIm: anchor?.kind === 'point' ? anchor.gamma.im : null,
    elementId: anchor?.kind === 'element' ? anchor.elementId : null,
    frequencyHz: anchor?.kind === 'frequency' ? anchor.hz : null,
  }
}
