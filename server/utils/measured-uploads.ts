// Measured Touchstone files kept per workspace: reading an uploaded file into parsed data (a
// TouchstoneError becomes a 422 naming the line), storing it, and fetching it back.
import { randomUUID } from 'node:crypto'
import { TouchstoneError, parseTouchstone, type TouchstoneData } from '../../shared/rf/index'
import type { UploadedFile } from './upload'
import type { UploadRow } from '../models'

/** The parsed file, or a 422 with `data: { line, column?, code }` saying where it went wrong. */
export function parseUploadedTouchstone(upload: Pick<UploadedFile, 'data' | 'fileName'>): TouchstoneData {
  try {
    return parseTouchstone(upload.data.toString('utf8'), upload.fileName)
  }
  catch (error) {
    if (error instanceof TouchstoneError) {
      const where = error.column === undefined ? { line: error.line } : { line: error.line, column: error.column }
      throw createError({ statusCode: 422, message: error.message, data: { ...where, code: error.code } })
    }
    throw error
  }
}

/** What the upload route answers: enough for the board to say what came in. */
export function uploadSummary(row: Pick<UploadRow, 'id' | 'fileName'>, parsed: TouchstoneData) {
  const f = parsed.frequencies
  return { id: row.id, fileName: row.fileName, ports: parsed.ports, frequencies: f.length, fMinHz: f[0]!, fMaxHz: f[f.length - 1]! }
}

export interface NewUpload {
  workspaceId: number
  boardId: string
  uploadedBy: number
  fileName: string
  sizeBytes: number
  parsed: TouchstoneData
}

/** Stores a parsed measured file with its workspace and board; answers its summary. */
export async function storeMeasuredUpload(input: NewUpload) {
  const { Upload } = await useModels()
  const row = await Upload.create({
    id: randomUUID(),
    workspaceId: input.workspaceId,
    boardId: input.boardId,
    uploadedBy: input.uploadedBy,
    fileName: input.fileName,
    sizeBytes: input.sizeBytes,
    parsed: JSON.stringify(input.parsed),
  })
  return uploadSummary(row, input.parsed)
}

/** An upload's row (without its parsed text) and its workspace's slug, or null. */
export async function findUploadWorkspace(id: string): Promise<{ workspaceSlug: string } | null> {
  const { Upload, Workspace } = await useModels()
  const row = await Upload.findByPk(id, { attributes: ['id', 'workspaceId'] })
  if (!row) return null
  const workspace = await Workspace.findByPk(row.workspaceId, { attributes: ['slug'] })
  return workspace ? { workspaceSlug: workspace.slug } : null
}

/** The stored parsed data with the upload's id and file name. */
export async function readMeasuredUpload(id: string) {
  const { Upload } = await useModels()
  const row = await Upload.findByPk(id)
  if (!row) return null
  const parsed = JSON.parse(row.parsed) as TouchstoneData
  return { id: row.id, fileName: row.fileName, boardId: row.boardId, ...parsed }
}
