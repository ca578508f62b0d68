// A real `ws` server on a free loopback port wired to the room logic, and y-websocket clients in
// Node. The identity travels in a test-only header here; the built server takes it from the session.
import { WebSocketServer, WebSocket } from 'ws'
import * as Y from 'yjs'
import { WebsocketProvider } from 'y-websocket'
import { createLiveHub, type LiveHub, type LiveHubOptions } from '../../../server/utils/live/rooms'
import type { LiveIdentity } from '../../../server/utils/live/types'
import { listenForAccessNotice } from '../../../shared/live/provider'
import type { AccessNotice } from '../../../shared/live/protocol'

export interface TestHub {
  hub: LiveHub
  url: string
  server: WebSocketServer
  close: () => Promise<void>
}

export async function startTestHub(options: LiveHubOptions): Promise<TestHub> {
  const hub = createLiveHub(options)
  const server = new WebSocketServer({ host: '127.0.0.1', port: 0 })
  await new Promise<void>(ok => server.once('listening', () => ok()))
  server.on('connection', (ws, request) => {
    const boardId = decodeURIComponent(new URL(request.url!, 'http://x').pathname.split('/').pop()!)
    const identity = JSON.parse(String(request.headers['x-test-identity'])) as LiveIdentity
    const conn = hub.join(boardId, {
      send: data => ws.send(data),
      close: (code, reason) => ws.close(code, reason),
      bufferedAmount: () => ws.bufferedAmount,
      terminate: () => ws.terminate(),
    }, identity)
    ws.on('message', data => hub.receive(conn, new Uint8Array(data as Buffer)))
    ws.on('close', () => hub.leave(conn))
  })
  const { port } = server.address() as { port: number }
  return {
    hub,
    server,
    url: `ws://127.0.0.1:${port}/live`,
    close: async () => {
      for (const client of server.clients) client.terminate()
      await new Promise<void>(ok => server.close(() => ok()))
      await hub.shutdown()
    },
  }
}

export function identity(userId: number, role: LiveIdentity['role'], workspaceId = 1): LiveIdentity {
  return { userId, name: `Person ${userId}`, colour: '#123456', role, workspaceId }
}

export interface TestClient {
  doc: Y.Doc
  provider: WebsocketProvider
  notices: AccessNotice[]
  closes: number[]
  destroy: () => void
}

export function connectClient(url: string, boardId: string, who: LiveIdentity, doc = new Y.Doc()): TestClient {
  const headers = { 'x-test-identity': JSON.stringify(who) }
  class HeaderSocket extends WebSocket {
    constructor(address: string, protocols?: string | string[]) {
      super(address, protocols, { headers })
    }
  }
  const provider = new WebsocketProvider(url, boardId, doc, {
    WebSocketPolyfill: HeaderSocket as unknown as typeof globalThis.WebSocket,
    disableBc: true,
  })
  const notices: AccessNotice[] = []
  const closes: number[] = []
  listenForAccessNotice(provider, n => notices.push(n))
  provider.on('connection-close', (event) => { if (event) closes.push(event.code) })
  return { doc, provider, notices, closes, destroy: () => { provider.destroy(); doc.destroy() } }
}

export async function waitFor(check: () => boolean, timeoutMs = 5000, what = 'condition'): Promise<void> {
  const deadline = Date.now() + timeoutMs
  while (!check()) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`)
    await new Promise(r => setTimeout(r, 10))
  }
}

export const synced = (client: TestClient) => waitFor(() => client.provider.synced, 5000, 'sync')

/** An in-memory store that records each write, with hooks to delay or fail loads. */
export function memoryStore(initial: Record<string, Uint8Array> = {}) {
  const states = new Map(Object.entries(initial))
  const writes: { boardId: string, at: number, bytes: number }[] = []
  let loadGate: Promise<void> = Promise.resolve()
  let failLoad = false
  let activeWrites = 0
  let maxConcurrentWrites = 0
  let writeDelayMs = 0
  return {
    states,
    writes,
    get maxConcurrentWrites() { return maxConcurrentWrites },
    holdLoads(gate: Promise<void>) { loadGate = gate },
    failLoads(yes = true) { failLoad = yes },
    slowWrites(ms: number) { writeDelayMs = ms },
    async loadState(boardId: string) {
      await loadGate
      if (failLoad) throw new Error('disk on fire (test)')
      return states.get(boardId) ?? null
    },
    async saveState(boardId: string, update: Uint8Array) {
      activeWrites++
      maxConcurrentWrites = Math.max(maxConcurrentWrites, activeWrites)
      try {
        if (writeDelayMs) await new Promise(r => setTimeout(r, writeDelayMs))
        states.set(boardId, update)
        writes.push({ boardId, at: Date.now(), bytes: update.byteLength })
      }
      finally {
        activeWrites--
      }
    },
  }
}
