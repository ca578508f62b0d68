import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

// Measured files (Touchstone) kept for boards whose load is `{ kind: 'measured', uploadId }`.
export interface UploadRow {
  id: string
  workspaceId: number
  boardId: string | null
  fileName: string
  sizeBytes: number
  /** JSON text of the parsed data (as parseTouchstone returns it). */
  parsed: string
  uploadedBy: number | null
  createdAt: Date
  updatedAt: Date
}
export type UploadInstance = Model<UploadRow, Optional<UploadRow, 'boardId' | 'uploadedBy' | 'createdAt' | 'updatedAt'>> & UploadRow

export function defineUpload(sequelize: Sequelize) {
  return sequelize.define<UploadInstance>('Upload', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    boardId: { type: DataTypes.STRING(100), allowNull: true },
    fileName: { type: DataTypes.STRING(255), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    parsed: { type: DataTypes.TEXT, allowNull: false },
    uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'uploads', underscored: true })
}

export function serializeUpload(upload: UploadRow) {
  return {
    id: upload.id,
    boardId: upload.boardId,
    fileName: upload.fileName,
    sizeBytes: upload.sizeBytes,
    createdAt: upload.createdAt.toISOString(),
  }
}
