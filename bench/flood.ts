// Memory under hostile traffic on the built server: (1) a reviewer who never reads sends 150
// four-byte sync-step-1 frames on a board of about 3.6 MB (each asks for the whole document);
// (2) a 200 MB chunked JSON body to the sign-in route. Reports the server's resident memory (VmRSS) before and
// its peak over the following seconds, and how the server ended the connection.
import { request } from 'node:http'
import { pathToFileURL } from 'node:url'
import { WebSocket } from 'ws'
import { startServer } from '../tests/support/server'
import { DEMO_USERS, signIn } from '../tests/support/auth'
import { connectLive, liveUrl, waitUntil, whenSynced } from '../tests/support/live-client'
import { createBoard } from '../tests/live/helpers'
import { rssKiB } from './live'

export interface FloodResult { rssBeforeMiB: number, rssPeakMiB: number, closedBy: string }

const BIG_KEYS = 4
const BIG_CHARS = 900_000

/** Samples RSS every 25 ms for `ms` and answers the highest. */
async function peakRss(pid: number, ms: number): Promise<number> {
  let peak = 0
  const end = Date.now() + ms
  while (Date.now() < end) {
    peak = Math.max(peak, rssKiB(pid))
    await new Promise(r => setTimeout(r, 25))
  }
  return peak
}

async function bigBoard(baseUrl: string, designer: string, admin: string): Promise<string> {
  const boardId = await createBoard(baseUrl, designer, 'Bench flood')
  const writer = connectLive(baseUrl, boardId, { cookie: designer })
  const reader = connectLive(baseUrl, boardId, { cookie: admin })
  try {
    await Promise.all([whenSynced(writer), whenSynced(reader)])
    for (let k = 0; k < BIG_KEYS; k++) writer.doc.getMap('bench').set(`blob${k}`, String.fromCharCode(97 + k).repeat(BIG_CHARS))
    await waitUntil(() => reader.doc.getMap('bench').size === BIG_KEYS, 30_000, 'the big document at a second peer')
  }
  finally {
    writer.destroy()
    reader.destroy()
  }
  return boardId
}

export async function runSocketFlood(frames = 150): Promise<FloodResult> {
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  try {
    const [designer, admin, reviewer] = await Promise.all([DEMO_USERS.designer, DEMO_USERS.admin, DEMO_USERS.reviewer].map(u => signIn(server.url, u.email, u.password)))
    const boardId = await bigBoard(server.url, designer!, admin!)
    await new Promise(r => setTimeout(r, 3000)) // the room unloads and the heap settles
    const pid = server.process.pid!
    const before = rssKiB(pid)
    const ws = new WebSocket(`${liveUrl(server.url)}/${boardId}`, { headers: { cookie: reviewer! } })
    let closedBy = 'left open by the server'
    ws.on('close', (code) => { if (closedBy.startsWith('left')) closedBy = `ended by the server (close ${code})` })
    ws.on('error', () => {})
    // The room's first frame says it has loaded (frames sent earlier are only queued).
    await new Promise<void>((ok, fail) => { ws.once('message', () => ok()); ws.once('unexpected-response', () => fail(new Error('upgrade refused'))) })
    // Read no more: what the server sends piles up on its side.
    ;(ws as unknown as { _socket: { pause: () => void } })._socket.pause()
    const request = new Uint8Array([0, 0, 1, 0]) // sync, step 1, an empty state vector
    for (let i = 0; i < frames; i++) ws.send(request)
    const peak = await peakRss(pid, 5000)
    // Read again: a connection the server ended shows its close now.
    ;(ws as unknown as { _socket: { resume: () => void } })._socket.resume()
    await new Promise(r => setTimeout(r, 1000))
    const seen = closedBy
    ws.terminate()
    closedBy = seen
    return { rssBeforeMiB: before / 1024, rssPeakMiB: peak / 1024, closedBy }
  }
  finally {
    await server.stop()
  }
}

export interface BodyResult { rssBeforeMiB: number, rssPeakMiB: number, status: number | string, sentMiB: number }

/** Streams `totalMiB` of one JSON string, chunked (no Content-Length), to the sign-in route. */
export async function runBigBody(totalMiB = 200): Promise<BodyResult> {
  const server = await startServer()
  try {
    const pid = server.process.pid!
    const before = rssKiB(pid)
    const chunk = Buffer.alloc(1024 * 1024, 0x61)
    let sent = 0
    let peak = before
    const sampler = setInterval(() => { peak = Math.max(peak, rssKiB(pid)) }, 25)
    const status = await new Promise<number | string>((resolve) => {
      const req = request(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'transfer-encoding': 'chunked' } }, (res) => {
        res.resume()
        resolve(res.statusCode!)
        req.destroy()
      })
      req.on('error', error => resolve(`connection ended (${(error as NodeJS.ErrnoException).code ?? error.message})`))
      req.write('{"email":"')
      const pump = () => {
        while (sent < totalMiB) {
          sent++
          if (!req.write(chunk)) return void req.once('drain', pump)
        }
        req.end('","password":"x"}')
      }
      pump()
    })
    await new Promise(r => setTimeout(r, 1000))
    clearInterval(sampler)
    return { rssBeforeMiB: before / 1024, rssPeakMiB: peak / 1024, status, sentMiB: sent }
  }
  finally {
    await server.stop()
  }
}

export function printBodyBench(body: BodyResult): void {
  console.log(`flood: a ${body.sentMiB} MiB chunked JSON body to /api/auth/login: server RSS ${body.rssBeforeMiB.toFixed(0)} -> peak ${body.rssPeakMiB.toFixed(0)} MiB `
    + `(+${(body.rssPeakMiB - body.rssBeforeMiB).toFixed(0)} MiB), answered ${body.status}`)
}

export function printFloodBench(socket: FloodResult): void {
  console.log(`flood: 150 sync-step-1 frames from a non-reading reviewer on a ${(BIG_KEYS * BIG_CHARS / 1e6).toFixed(1)} MB board: `
    + `server RSS ${socket.rssBeforeMiB.toFixed(0)} -> peak ${socket.rssPeakMiB.toFixed(0)} MiB (+${(socket.rssPeakMiB - socket.rssBeforeMiB).toFixed(0)} MiB), ${socket.closedBy}`)
}

export async function runFloodBench() {
  return { socket: await runSocketFlood(), body: await runBigBody() }
}

export function printFloodBenches(result: Awaited<ReturnType<typeof runFloodBench>>): void {
  printFloodBench(result.socket)
  printBodyBench(result.body)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runFloodBench().then(printFloodBenches).catch((error) => {
    console.error(error)
    process.exit(1)
  })
}
