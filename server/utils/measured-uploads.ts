// Measured Touchstone files kept per workspace: reading an uploaded file into parsed data in a
// worker thread (a TouchstoneError becomes a 422 naming the line), storing it, and fetching it back.
import { randomUUID } from 'node:crypto'
import type { TouchstoneData, TouchstoneLimits } from '../../shared/rf/index'
import type { UploadedFile } from './upload'
import type { UploadRow } from '../models'
import type { TouchstoneSummary } from '../workers/touchstone-protocol'

/**
 * What an uploaded file may hold. The product uses one- and two-ports only, and refuses others
 * before the reader lays anything out. 20,001 frequencies is more than one sweep of common bench
 * network analysers (common practice); with the 8 MiB JSON cap it bounds both the answer of
 * POST /api/rf/touchstone and the parsed text each stored upload keeps.
 */
export const MEASURED_LIMITS: Readonly<Required<TouchstoneLimits>> = { maxPorts: 2, maxFrequencies: 20_001 }
export const MEASURED_MAX_JSON_CHARS = 8 * 1024 * 1024

/**
 * The parsed file as JSON text with its summary, read in the worker thread; a 422 with
 * `data: { line, column?, code }` saying where it went wrong.
 */
export function parseUploadedTouchstone(upload: Pick<UploadedFile, 'data' | 'fileName'>) {
  return parseTouchstoneOffThread(upload.data, upload.fileName, MEASURED_LIMITS, MEASURED_MAX_JSON_CHARS)
}

/** What the upload route answers: enough for the board to say what came in. */
export function uploadSummary(row: Pick<UploadRow, 'id' | 'fileName'>, summary: TouchstoneSummary) {
  return { id: row.id, fileName: row.fileName, ...summary }
}

export interface NewUpload {
  workspaceId: number
  boardId: string
  uploadedBy: number
  fileName: string
  sizeBytes: number
  /** The parsed data as JSON text (parseUploadedTouchstone). */
  parsedJson: string
  summary: TouchstoneSummary
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
    parsed: input.parsedJson,
  })
  return uploadSummary(row, input.summary)
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
