// POST /api/rf/touchstone — a multipart upload with the file in the field `file`, answered with the
// parsed data (as parseTouchstone gives it). 422 with data { line, column?, code } for a file that
// cannot be read (or holds more than MEASURED_LIMITS allow), 413 over 20 MB received, 400 for a
// request without the file. Public: nothing is stored. Read in a worker thread, answered as the
// JSON text the worker wrote.
export default defineEventHandler(async (event) => {
  const upload = await readUploadedFile(event, { field: 'file', maxBytes: UPLOAD_MAX_BYTES })
  const { json } = await parseUploadedTouchstone(upload)
  setResponseHeader(event, 'content-type', 'application/json')
  return json
})
