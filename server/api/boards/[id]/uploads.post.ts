// POST /api/boards/:id/uploads — a measured Touchstone file (.s1p or .s2p) for this board, in the
// multipart field `file` (designer or admin of the board's workspace). Read as it streams in: 413
// past 20 MB received, 422 with data { line } for a file that cannot be read. Stored, parsed, in
// the uploads table; answers { id, fileName, ports, frequencies, fMinHz, fMaxHz }.
import { z } from 'zod'

const ParamsSchema = z.object({
  id: z.string().min(1).max(100).regex(/^[A-Za-z0-9-]+$/, 'must be letters, digits and dashes'),
})

export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, ParamsSchema)
  const access = await requireMember(event, { boardId: id }, 'designer')
  const upload = await readUploadedFile(event, { field: 'file', maxBytes: UPLOAD_MAX_BYTES })
  const fileName = upload.fileName.trim()
  if (!fileName || fileName.length > 255) {
    throw createError({ statusCode: 400, message: 'The file needs a name of 1–255 characters ending in .s1p or .s2p.' })
  }
  // The reader itself refuses anything but one- and two-ports (MEASURED_LIMITS), naming the line.
  const { json, summary } = await parseUploadedTouchstone({ data: upload.data, fileName })
  setResponseStatus(event, 201)
  return storeMeasuredUpload({
    workspaceId: access.workspace.id,
    boardId: id,
    uploadedBy: access.user.id,
    fileName,
    sizeBytes: upload.data.length,
    parsedJson: json,
    summary,
  })
})
