// Every JSON body is capped on the bytes received, before parsing: a chunked body (no
// Content-Length) past the cap is a 413 while it is still arriving; RF routes take up to 16 MiB.
import { request } from 'node:http'
import { describe, expect, inject, it } from 'vitest'

const baseUrl = inject('baseUrl')
const MB = 1024 * 1024

/** Streams `totalBytes` of one JSON string in 64 KB chunks, chunked; stops at the answer. */
// The server may drop the socket right after its 413: a write then fails with ECONNRESET/EPIPE
// before the client has parsed the answer. That is reported as `reset` (status 0): refused too.
function streamJson(path: string, totalBytes: number): Promise<{ status: number, sentBytes: number, body: any, reset?: boolean }> {
  return new Promise((resolve, reject) => {
    let sentBytes = 0
    let isAnswered = false
    const chunk = Buffer.alloc(64 * 1024, 0x61)
    const req = request(`${baseUrl}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', 'transfer-encoding': 'chunked' } }, (res) => {
      isAnswered = true
      let text = ''
      res.on('data', (d) => { text += d })
      res.on('end', () => { resolve({ status: res.statusCode!, sentBytes, body: JSON.parse(text) }); req.destroy() })
    })
    req.on('error', (error: NodeJS.ErrnoException) => {
      if (isAnswered) return
      if (error.code === 'ECONNRESET' || error.code === 'EPIPE') resolve({ status: 0, sentBytes, body: null, reset: true })
      else reject(error)
    })
    req.write('{"email":"')
    const pump = () => {
      while (!isAnswered && sentBytes < totalBytes) {
        sentBytes += chunk.length
        if (!req.write(chunk)) return void req.once('drain', pump)
      }
      if (!isAnswered) req.end('","password":"x"}')
    }
    pump()
  })
}

describe('JSON body cap', () => {
  it('answers 413 to a chunked 64 MB sign-in body while it is still arriving', async () => {
    const total = 64 * MB
    const { status, sentBytes, body, reset } = await streamJson('/api/auth/login', total)
    expect(sentBytes, 'refused before the body was sent').toBeLessThan(total)
    expect(sentBytes, 'not refused before the cap').toBeGreaterThan(MB)
    if (!reset) {
      expect(status).toBe(413)
      expect(body.statusCode).toBe(413)
    }
  })

  it('still reads a body just under 1 MiB (a 400 for the bad e-mail, not a 413)', async () => {
    const { status } = await streamJson('/api/auth/login', 15 * 64 * 1024)
    expect(status).toBe(400)
  })

  it('takes an RF body over 1 MiB (their cap is 16 MiB) and refuses one past it', async () => {
    const frequencies = Array.from({ length: 60_000 }, (_, k) => 1e6 + k * 1000 + 0.123456789)
    const ok = await fetch(`${baseUrl}/api/rf/sweep`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ z0: 50, frequencies, load: { re: 25, im: 0 }, elements: [] }),
    })
    expect(JSON.stringify({ frequencies }).length).toBeGreaterThan(MB)
    expect(ok.status).toBe(200)
    const past = await streamJson('/api/rf/sweep', 20 * MB)
    if (!past.reset) expect(past.status).toBe(413)
  })
})
