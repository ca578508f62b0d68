// Requests whose head overflows Node's 16 KB header limit never reach h3: Node answers them itself
// (431, or a reset when the client is still sending). A URL that long (a 100 KB query string) gets
// a JSON 414 here instead; an oversized header block keeps Node's 431; other parse errors 400.
// NOTE: Nitro's node server is created after the plugins run and is not exposed to them, so the
// `clientError` listener is attached by wrapping http.Server#listen once, for the next server only.
import http from 'node:http'
import type { Duplex } from 'node:stream'

/** Longest request line (method, target, version) we parse; longer ones are 414. */
export const MAX_REQUEST_LINE_BYTES = 8 * 1024

function answer(socket: Duplex, status: number, reason: string, message: string) {
  const body = JSON.stringify({ statusCode: status, message })
  socket.end(`HTTP/1.1 ${status} ${reason}\r\ncontent-type: application/json\r\ncontent-length: ${Buffer.byteLength(body)}\r\nconnection: close\r\n\r\n${body}`)
}

export function onClientError(error: Error & { code?: string, rawPacket?: Buffer }, socket: Duplex) {
  if (error.code === 'ECONNRESET' || !socket.writable) return socket.destroy()
  if (error.code === 'HPE_HEADER_OVERFLOW') {
    const lineEnd = error.rawPacket?.indexOf('\r\n') ?? -1
    if (lineEnd === -1 || lineEnd > MAX_REQUEST_LINE_BYTES) {
      return answer(socket, 414, 'URI Too Long', `The request URL is too long: at most ${MAX_REQUEST_LINE_BYTES / 1024} KB.`)
    }
    return answer(socket, 431, 'Request Header Fields Too Large', 'The request headers are too large.')
  }
  if (error.code === 'ERR_HTTP_REQUEST_TIMEOUT') return answer(socket, 408, 'Request Timeout', 'The request took too long to arrive.')
  return answer(socket, 400, 'Bad Request', 'The request could not be parsed.')
}

export default defineNitroPlugin(() => {
  const listen = http.Server.prototype.listen
  http.Server.prototype.listen = function (this: http.Server, ...args: unknown[]) {
    http.Server.prototype.listen = listen
    this.on('clientError', onClientError)
    return (listen as (...a: unknown[]) => http.Server).apply(this, args)
  } as typeof listen
})
