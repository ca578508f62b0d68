// y-websocket clients in Node for tests and the benchmark: `ws` as the WebSocket, the session
// cookie (and optionally an Origin) in the upgrade headers, BroadcastChannel off.
import { WebSocket } from 'ws'
import * as Y from 'yjs'
import { WebsocketProvider } from 'y-websocket'
import { listenForAccessNotice } from '../../shared/live/provider'
import type { AccessNotice } from '../../shared/live/protocol'

export const DEMO_BOARD_ID = 'kestrel-915-antenna'
export const DEMO_ACCOUNTS = {
  admin: { email: 'mara@kestrel.example', password: 'kestrel-admin-demo' },
  designer: { email: 'tomas@kestrel.example', password: 'kestrel-designer-demo' },
  reviewer: { email: 'ines@kestrel.example', password: 'kestrel-reviewer-demo' },
} as const

/** Signs in through POST /api/auth/login and returns the `name=value` session cookie. */
export async function sessionCookie(baseUrl: string, account: { email: string, password: string }): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(account),
  })
  if (!res.ok) throw new Error(`sign-in as ${account.email} failed: ${res.status} ${await res.text()}`)
  const cookie = res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  if (!cookie) throw new Error('sign-in answered without a cookie')
  return cookie
}

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
