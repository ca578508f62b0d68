// y-websocket clients in Node for tests and the benchmark: `ws` as the WebSocket, the session
// cookie (and optionally an Origin) in the upgrade headers, BroadcastChannel off.
import { WebSocket } from 'ws'
import * as Y from 'yjs'
import { WebsocketProvider } from 'y-websocket'
import { listenForAccessNotice } from '../../shared/live/provider'
import type { AccessNotice } from '../../shared/live/protocol'

export const DEMO_BOARD_ID = 'brackwater-915-antenna'

// y-websocket adds one process 'exit' listener per provider in Node; tests and the benchmark open
// hundreds on purpose.
process.setMaxListeners(Math.max(process.getMaxListeners(), 500))

export const liveUrl = (baseUrl: string) => `${baseUrl.replace(/^http/, 'ws')}/live`

export interface LiveClient {
  doc: Y.Doc
  provider: WebsocketProvider
  notices: AccessNotice[]
  closeCodes: number[]
  destroy: () => void
}

export function connectLive(baseUrl: string, boardId: string, headers: Record<string, string>, doc = new Y.Doc()): LiveClient {
  class HeaderSocket extends WebSocket {
    constructor(address: string, protocols?: string | string[]) {
      super(address, protocols, { headers })
    }
  }
  const provider = new WebsocketProvider(liveUrl(baseUrl), boardId, doc, {
    WebSocketPolyfill: HeaderSocket as unknown as typeof globalThis.WebSocket,
    disableBc: true,
  })
  const notices: AccessNotice[] = []
  const closeCodes: number[] = []
  listenForAccessNotice(provider, n => notices.push(n))
  provider.on('connection-close', (event) => { if (event) closeCodes.push(event.code) })
  return { doc, provider, notices, closeCodes, destroy: () => { provider.destroy(); doc.destroy() } }
}

/** Tries one upgrade and reports how it ended: 'open', or the HTTP status of the refusal. */
export function tryUpgrade(baseUrl: string, boardId: string, headers: Record<string, string>): Promise<'open' | number> {
  return new Promise((resolve, reject) => {
    const ws = new WebSocket(`${liveUrl(baseUrl)}/${encodeURIComponent(boardId)}`, { headers })
    const timer = setTimeout(() => { ws.terminate(); reject(new Error('upgrade neither opened nor was refused in 5 s')) }, 5000)
    ws.on('open', () => { clearTimeout(timer); ws.close(); resolve('open') })
    ws.on('unexpected-response', (_req, res) => { clearTimeout(timer); resolve(res.statusCode ?? 0); ws.terminate() })
    ws.on('error', () => {})
  })
}

export async function waitUntil(check: () => boolean, timeoutMs = 5000, what = 'condition'): Promise<void> {
  const deadline = Date.now() + timeoutMs
  while (!check()) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`)
    await new Promise(r => setTimeout(r, 10))
  }
}

export const whenSynced = (client: LiveClient, timeoutMs = 5000) => waitUntil(() => client.provider.synced, timeoutMs, 'sync')
