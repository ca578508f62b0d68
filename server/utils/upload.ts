// Reading one uploaded file from a multipart/form-data request as it streams in (busboy), counting
// the bytes received: past the limit the reading stops and the route answers 413 at once; the body
// is never held whole before it is checked. Used by the Touchstone route and board uploads.
import busboy from 'busboy'
import type { H3Event } from 'h3'

export interface UploadedFile {
  /** The file name the client sent ('' when it sent none). */
  fileName: string
  mimeType: string
  data: Buffer
}

export interface UploadOptions {
  /** The form field that holds the file. */
  field: string
  /** Most bytes of request body accepted (the file plus the multipart framing). */
  maxBytes: number
}

/** 20 MiB: the largest measured file the app takes. */
export const UPLOAD_MAX_BYTES = 20 * 1024 * 1024

// After a 413 the rest of the body is read and dropped (not kept) so the client can read the
// answer; a client that keeps sending past this much more is cut off.
const DRAIN_ALLOWANCE_BYTES = 64 * 1024 * 1024

function tooLarge(maxBytes: number) {
  return createError({ statusCode: 413, message: `The upload is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.` })
}

/** Refuses a body whose declared Content-Length is over the limit, before reading any of it. */
export function refuseDeclaredOversize(event: H3Event, maxBytes: number): void {
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(maxBytes)
}

/** Streams the request through busboy and resolves with the file in `options.field`. */
export function readUploadedFile(event: H3Event, options: UploadOptions): Promise<UploadedFile> {
  const { field, maxBytes } = options
  const contentType = getRequestHeader(event, 'content-type') ?? ''
  if (!/^multipart\/form-data\b/i.test(contentType)) {
    throw createError({ statusCode: 400, message: `Expected a multipart/form-data upload with the file in the field '${field}'.` })
  }
  refuseDeclaredOversize(event, maxBytes)
  const req = event.node.req
  let parser: busboy.Busboy
  try {
    parser = busboy({ headers: req.headers, limits: { files: 1, fileSize: maxBytes, fields: 20, fieldSize: 64 * 1024, parts: 40 } })
  }
  catch (error) {
    throw createError({ statusCode: 400, message: `Malformed multipart request: ${(error as Error).message}.` })
  }

  return new Promise<UploadedFile>((resolve, reject) => {
    let received = 0
    let isSettled = false
    let file: Omit<UploadedFile, 'data'> | undefined
    const chunks: Buffer[] = []

    const settle = (error?: unknown, value?: UploadedFile) => {
      if (isSettled) return
      isSettled = true
      if (error) {
        req.unpipe(parser)
        parser.removeAllListeners()
        parser.on('error', () => {}) // a half-fed parser may still complain; nobody listens now
        chunks.length = 0
        req.resume() // drop whatever else arrives
        reject(error)
      }
      else resolve(value!)
    }

    req.on('data', (chunk: Buffer) => {
      received += chunk.length
      if (received > maxBytes) settle(tooLarge(maxBytes))
      if (received > maxBytes + DRAIN_ALLOWANCE_BYTES) req.socket.destroy()
    })
    req.on('error', error => settle(createError({ statusCode: 400, message: `The upload was interrupted: ${error.message}.` })))

    parser.on('file', (name, stream, info) => {
      if (name !== field || file) {
        stream.resume()
        return
      }
      file = { fileName: info.filename ?? '', mimeType: info.mimeType }
      stream.on('data', (chunk: Buffer) => chunks.push(chunk))
      stream.on('limit', () => settle(tooLarge(maxBytes)))
    })
    parser.on('error', error => settle(createError({ statusCode: 400, message: `Malformed multipart request: ${(error as Error).message}.` })))
    parser.on('close', () => {
      if (!file) return settle(createError({ statusCode: 400, message: `No file in the field '${field}'.` }))
      settle(undefined, { ...file, data: Buffer.concat(chunks) })
    })
    req.pipe(parser)
  })
}
