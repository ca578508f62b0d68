// POST /api/rf/touchstone — a multipart upload with the file in the field `file`, answered with the
// parsed data (as parseTouchstone gives it). 422 with data { line, column?, code } for a file that
// cannot be read, 413 over 20 MB, 400 for a request without the file. Public: nothing is stored.
export default defineEventHandler(async (event) => {
  const upload = await readUploadedFile(event, { field: 'file', maxBytes: UPLOAD_MAX_BYTES })
  return parseUploadedTouchstone(upload)
})
