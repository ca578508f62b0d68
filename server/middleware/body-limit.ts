// Every request body that is not a multipart upload is read here, counting the bytes actually
// received (chunked bodies too, Content-Length is not trusted): past the cap the request gets a 413
// at once and the rest is dropped, so a 200 MB body never sits in memory. The body read is handed
// to h3 (req.rawBody), so readBody in the routes parses the capped bytes. Multipart uploads are
// capped as they stream by server/utils/upload.ts.
import type { IncomingMessage } from 'node:http'

/** JSON bodies of the app's own forms and edits are a few KB. */
export const JSON_MAX_BODY_BYTES = 1024 * 1024
const METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])
// After a 413 a client that keeps sending past this much more is cut off.
const DRAIN_ALLOWANCE_BYTES = 8 * 1024 * 1024

function capFor(path: string): number {
  return path.startsWith('/api/rf/') ? RF_MAX_BODY_BYTES : JSON_MAX_BODY_BYTES
}

function readCapped(req: IncomingMessage, maxBytes: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let received = 0
    let isOver = false
    req.on('data', (chunk: Buffer) => {
      received += chunk.length
      if (isOver) {
        if (received > maxBytes + DRAIN_ALLOWANCE_BYTES) req.socket.destroy()
        return
      }
      if (received > maxBytes) {
        isOver = true
        chunks.length = 0
        return reject(createError({ statusCode: 413, message: `The request body is larger than ${Math.round(maxBytes / 1024)} KB.` }))
      }
      chunks.push(chunk)
    })
    req.on('end', () => { if (!isOver) resolve(Buffer.concat(chunks)) })
    req.on('error', error => reject(createError({ statusCode: 400, message: `The request body was interrupted: ${error.message}.` })))
  })
}

export default defineEventHandler(async (event) => {
  if (!METHODS.has(event.method)) return
  if (!event.path.startsWith('/api/')) return
  const contentType = getRequestHeader(event, 'content-type') ?? ''
  if (/^multipart\/form-data\b/i.test(contentType)) return
  const maxBytes = capFor(event.path)
  refuseDeclaredOversize(event, maxBytes)
  const req = event.node.req as IncomingMessage & { rawBody?: Buffer }
  req.rawBody = await readCapped(req, maxBytes)
})
