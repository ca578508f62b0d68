// What one connection may cost the live server: the frame-rate cap, the cap on bytes queued
// towards a peer that does not read, the document size cap, and sync answers encoded once per
// document version. A real `ws` server on port 0 (harness) or a recording socket.
import { afterEach, describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import { WebSocket } from 'ws'
import * as decoding from 'lib0/decoding'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'
import { createBoardDoc, encodeBoardState } from '../../../shared/board/ydoc'
import { createLiveHub } from '../../../server/utils/live/rooms'
import { connectClient, identity, memoryStore, startTestHub, synced, waitFor, type TestClient, type TestHub } from './harness'

const BOARD = 'brackwater-915-antenna'
const demoState = () => encodeBoardState(createBoardDoc(DEMO_BOARDS.find(b => b.id === BOARD)!))
const SYNC_STEP_1_EMPTY = new Uint8Array([0, 0, 1, 0]) // sync, step 1, an empty state vector

let hub: TestHub | undefined
const clients: TestClient[] = []
afterEach(async () => {
  for (const c of clients.splice(0)) c.destroy()
  await hub?.close()
  hub = undefined
})

/** A raw socket that has seen the room's first frame (so the room has loaded). */
async function rawSocket(url: string, who: ReturnType<typeof identity>) {
  const ws = new WebSocket(`${url}/${BOARD}`, { headers: { 'x-test-identity': JSON.stringify(who) } })
  const closed = new Promise<number>(ok => ws.on('close', code => ok(code)))
  ws.on('error', () => {})
  await new Promise<void>(ok => ws.once('message', () => ok()))
  return { ws, closed }
}

describe('live limits', () => {
  it('closes a connection past its frame burst (1008), and keeps one under it', async () => {
    hub = await startTestHub({ store: memoryStore({ [BOARD]: demoState() }), limits: { frameBurst: 50, framesPerSecond: 1 } })
    const calm = await rawSocket(hub.url, identity(1, 'reviewer'))
    for (let i = 0; i < 40; i++) calm.ws.send(new Uint8Array([3]))
    const flooder = await rawSocket(hub.url, identity(2, 'reviewer'))
    for (let i = 0; i < 60; i++) flooder.ws.send(new Uint8Array([3]))
    expect(await flooder.closed).toBe(1008)
    expect(calm.ws.readyState).toBe(WebSocket.OPEN)
    expect(hub.hub.stats().connections).toBe(1)
    calm.ws.close()
  })

  it('ends a peer that asks for the document again and again without reading', async () => {
    const doc = new Y.Doc()
    Y.applyUpdate(doc, demoState())
    doc.getMap('bench').set('blob', 'x'.repeat(200_000)) // about 200 KB per answer
    hub = await startTestHub({ store: memoryStore({ [BOARD]: Y.encodeStateAsUpdate(doc) }), limits: { maxPendingSendBytes: 1024 * 1024 } })
    const { ws, closed } = await rawSocket(hub.url, identity(3, 'reviewer'))
    ;(ws as unknown as { _socket: { pause: () => void } })._socket.pause()
    for (let i = 0; i < 150; i++) ws.send(SYNC_STEP_1_EMPTY)
    await waitFor(() => hub!.hub.stats().connections === 0, 10_000, 'the non-reading peer to be ended')
    ;(ws as unknown as { _socket: { resume: () => void } })._socket.resume()
    expect(await closed).toBe(1006) // terminated: no close frame behind the queued answers
  })

  it('refuses an edit that would take the document past its cap (4413) and keeps the document as it was', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, limits: { maxDocBytes: 50_000 } })
    const writer = connectClient(hub.url, BOARD, identity(4, 'designer'))
    const witness = connectClient(hub.url, BOARD, identity(5, 'admin'))
    clients.push(writer, witness)
    await Promise.all([synced(writer), synced(witness)])
    writer.doc.getMap('bench').set('small', 'y'.repeat(1000))
    await waitFor(() => witness.doc.getMap('bench').has('small'), 5000, 'a small edit')
    writer.doc.getMap('bench').set('blob', 'x'.repeat(60_000))
    await waitFor(() => writer.closes.includes(4413), 5000, 'the 4413 close')
    expect(hub.hub.openDoc(BOARD)!.getMap('bench').has('blob')).toBe(false)
    expect(witness.doc.getMap('bench').has('blob')).toBe(false)
  })

  it('answers repeated sync requests with the same encoded bytes until the document changes', async () => {
    const sent: Uint8Array[] = []
    const live = createLiveHub({ store: memoryStore({ [BOARD]: demoState() }) })
    try {
      const conn = live.join(BOARD, { send: d => sent.push(d), close: () => {} }, identity(6, 'designer'))
      await waitFor(() => sent.length >= 2, 5000, 'the welcome')
      const answers = () => sent.filter(frame => frame[0] === 0 && frame[1] === 1)
      live.receive(conn, SYNC_STEP_1_EMPTY)
      live.receive(conn, SYNC_STEP_1_EMPTY)
      expect(answers()).toHaveLength(2)
      expect(answers()[1]).toBe(answers()[0])
      live.openDoc(BOARD)!.getMap('bench').set('k', 1)
      live.receive(conn, SYNC_STEP_1_EMPTY)
      const third = answers()[2]!
      expect(third).not.toBe(answers()[0])
      const check = new Y.Doc()
      const decoder = decoding.createDecoder(third)
      expect([decoding.readVarUint(decoder), decoding.readVarUint(decoder)]).toEqual([0, 1])
      Y.applyUpdate(check, decoding.readVarUint8Array(decoder))
      expect(check.getMap('bench').get('k')).toBe(1)
      live.leave(conn)
    }
    finally {
      await live.shutdown()
    }
  })
})
