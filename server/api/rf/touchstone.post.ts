// POST /api/rf/touchstone — a multipart upload with the file in the field `file`, answered with the
// parsed data (as parseTouchstone gives it). 422 with data { line, column?, code } for a file that
// cannot be read, 413 over 20 MB, 400 for a request without the file. Public: nothing is stored.
import { TouchstoneError, parseTouchstone } from '../../../shared/rf/index'

export default defineEventHandler(async (event) => {
  const upload = await readUploadedFile(event, { field: 'file', maxBytes: UPLOAD_MAX_BYTES })
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
})
