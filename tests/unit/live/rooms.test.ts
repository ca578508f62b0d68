// Room logic over a real `ws` server on port 0 with y-websocket clients (no mocked socket).
import { afterEach, describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import { WebSocket } from 'ws'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'
import { createBoardDoc, encodeBoardState, readBoard } from '../../../shared/board/ydoc'
import { addElement, updateElement } from '../../../shared/board/ops'
import { readPresence } from '../../../shared/live/presence'
import { connectClient, identity, memoryStore, startTestHub, synced, waitFor, type TestClient, type TestHub } from './harness'

const BOARD = 'brackwater-915-antenna'
const demo = DEMO_BOARDS.find(b => b.id === BOARD)!
const demoState = () => encodeBoardState(createBoardDoc(demo))
const FAST = { saveDebounceMs: 100, saveMaxWaitMs: 400 }

let hub: TestHub | undefined
const clients: TestClient[] = []
const client = (...args: Parameters<typeof connectClient>) => {
  const c = connectClient(...args)
  clients.push(c)
  return c
}

afterEach(async () => {
  for (const c of clients.splice(0)) c.destroy()
  await hub?.close()
  hub = undefined
})

const stateVector = (doc: Y.Doc) => Buffer.from(Y.encodeStateVector(doc)).toString('base64')

describe('live rooms', () => {
  it('sends the stored board to a joining client and converges two editors', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    const b = client(hub.url, BOARD, identity(2, 'admin'))
    await Promise.all([synced(a), synced(b)])
    expect(readBoard(a.doc).elements.map(e => e.id)).toEqual(demo.elements.map(e => e.id))
    const first = demo.elements[0]!.id
    updateElement(a.doc, first, { value: 1.5e-9 })
    addElement(b.doc, { kind: 'C', placement: 'shunt', value: 2.2e-12 })
    await waitFor(() => stateVector(a.doc) === stateVector(b.doc) && readBoard(a.doc).elements.length === demo.elements.length + 1)
    expect(Y.equalSnapshots(Y.snapshot(a.doc), Y.snapshot(b.doc))).toBe(true)
    expect(readBoard(b.doc).elements.find(e => e.id === first)).toMatchObject({ value: 1.5e-9 })
  })

  it('sends no sync before the room has loaded, then answers the queued frames', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    let release!: () => void
    store.holdLoads(new Promise<void>(ok => { release = ok }))
    hub = await startTestHub({ store, timings: FAST })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    await waitFor(() => a.provider.wsconnected)
    await new Promise(r => setTimeout(r, 150))
    expect(a.provider.synced).toBe(false)
    expect(readBoard(a.doc).elements).toHaveLength(0)
    release()
    await synced(a)
    expect(readBoard(a.doc).elements).toHaveLength(demo.elements.length)
  })

  it('closes every peer when the load fails and never writes', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    store.failLoads()
    hub = await startTestHub({ store, timings: FAST, log: { error() {}, warn() {} } })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    const b = client(hub.url, BOARD, identity(2, 'designer'))
    await waitFor(() => a.closes.includes(4500) && b.closes.includes(4500))
    expect(a.provider.synced).toBe(false)
    expect(store.writes).toHaveLength(0)
  })

  it('drops a reviewer\'s document changes, says read-only, and keeps its presence', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const designer = client(hub.url, BOARD, identity(1, 'designer'))
    const reviewer = client(hub.url, BOARD, identity(3, 'reviewer'))
    await Promise.all([synced(designer), synced(reviewer)])
    await waitFor(() => reviewer.notices.length > 0)
    expect(reviewer.notices[0]).toMatchObject({ readOnly: true, role: 'reviewer' })
    expect(designer.notices[0]).toMatchObject({ readOnly: false, role: 'designer' })
    const before = stateVector(designer.doc)
    updateElement(reviewer.doc, demo.elements[0]!.id, { value: 9.9e-9 })
    addElement(reviewer.doc, { kind: 'R', placement: 'series', value: 10 })
    reviewer.provider.awareness.setLocalStateField('pointer', { re: 0.1, im: -0.2 })
    await waitFor(() => reviewer.notices.some(n => n.dropped))
    await waitFor(() => [...designer.provider.awareness.getStates().values()].some(s => readPresence(s)?.user.id === 3))
    await new Promise(r => setTimeout(r, 300))
    expect(stateVector(designer.doc)).toBe(before)
    expect(stateVector(hub.hub.openDoc(BOARD)!)).toBe(before)
    expect(store.writes).toHaveLength(0)
  })

  it('stamps presence with the server identity and removes it on close and when stale', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    const b = client(hub.url, BOARD, identity(2, 'designer'))
    await Promise.all([synced(a), synced(b)])
    a.provider.awareness.setLocalState({ user: { id: 99, name: 'Someone Else', colour: '#000', role: 'admin' }, pointer: { re: 0.3, im: 0.1 }, dragging: { elementId: 'x', value: 1e-9 } })
    const seenByB = () => [...b.provider.awareness.getStates().entries()].filter(([id]) => id === a.doc.clientID).map(([, s]) => readPresence(s))
    await waitFor(() => seenByB()[0]?.pointer?.re === 0.3)
    expect(seenByB()[0]).toEqual({ user: { id: 1, name: 'Person 1', colour: '#123456', role: 'designer' }, pointer: { re: 0.3, im: 0.1 }, dragging: { elementId: 'x', value: 1e-9 } })
    // Stale: a peer that published once and then went silent is removed by the sweep (25 s).
    const silent = await rawSocket(hub.url, identity(5, 'designer'))
    const { encodeAwarenessEntries } = await import('../../../server/utils/live/presence')
    const entry = encodeAwarenessEntries([{ clientId: 424242, clock: 1, state: { pointer: { re: 0, im: 0 } } }])
    silent.ws.send(new Uint8Array([1, ...encodeVarUint(entry.length), ...entry]))
    const silentSeen = () => b.provider.awareness.getStates().has(424242)
    await waitFor(silentSeen, 2000, 'silent peer seen')
    hub.hub.sweep(Date.now() + 26_000)
    await waitFor(() => !silentSeen(), 2000, 'stale presence removed')
    silent.ws.close()
    a.provider.disconnect()
    await waitFor(() => seenByB().length === 0, 2000, 'presence removed on close')
  })

  it('will not let one connection speak for another\'s awareness client id', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    const b = client(hub.url, BOARD, identity(2, 'designer'))
    await Promise.all([synced(a), synced(b)])
    a.provider.awareness.setLocalStateField('pointer', { re: 0.5, im: 0 })
    await waitFor(() => readPresence(b.provider.awareness.getStates().get(a.doc.clientID))?.pointer?.re === 0.5)
    // b forges an awareness entry under a's client id with a higher clock.
    const { encodeAwarenessEntries } = await import('../../../server/utils/live/presence')
    const forged = encodeAwarenessEntries([{ clientId: a.doc.clientID, clock: 9999, state: { pointer: { re: -0.9, im: 0 } } }])
    const frame = new Uint8Array([1, ...encodeVarUint(forged.length), ...forged])
    b.provider.ws!.send(frame)
    await new Promise(r => setTimeout(r, 200))
    expect(readPresence(b.provider.awareness.getStates().get(a.doc.clientID))?.pointer?.re).toBe(0.5)
  })

  it('closes a connection that sends a frame above 1 MB, or too many before the room loads', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const big = await rawSocket(hub.url, identity(1, 'designer'))
    big.ws.send(new Uint8Array(1024 * 1024 + 1))
    expect(await big.closed).toBe(1009)

    let release!: () => void
    store.holdLoads(new Promise<void>(ok => { release = ok }))
    const chatty = await rawSocket(hub.url.replace('/live', '/live'), identity(2, 'designer'), 'brackwater-other')
    for (let i = 0; i < 101; i++) chatty.ws.send(new Uint8Array([3]))
    expect(await chatty.closed).toBe(1008)
    release()
  })

  it('saves about one debounce after an edit, within the max wait under continuous edits, one write at a time', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    store.slowWrites(120)
    hub = await startTestHub({ store, timings: { saveDebounceMs: 150, saveMaxWaitMs: 500 } })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    await synced(a)
    const id = demo.elements[0]!.id
    const editedAt = Date.now()
    updateElement(a.doc, id, { value: 3.3e-9 })
    await waitFor(() => store.writes.length === 1, 3000)
    const firstDelay = store.writes[0]!.at - editedAt
    expect(firstDelay).toBeGreaterThanOrEqual(150)
    expect(firstDelay).toBeLessThan(150 + 120 + 200)
    // Edits every 40 ms for 1.5 s never leave a quiet gap of 150 ms, so only the max wait saves.
    const start = Date.now()
    let value = 1e-9
    while (Date.now() - start < 1500) {
      updateElement(a.doc, id, { value: (value += 1e-11) })
      await new Promise(r => setTimeout(r, 40))
    }
    const during = store.writes.filter(w => w.at > start && w.at <= start + 1500)
    expect(during.length).toBeGreaterThanOrEqual(2)
    expect(store.maxConcurrentWrites).toBe(1)
    // The last value reaches the store after the last disconnect.
    a.provider.disconnect()
    await waitFor(() => hub!.hub.stats().rooms === 0, 3000, 'room unloaded')
    const stored = new Y.Doc()
    Y.applyUpdate(stored, store.states.get(BOARD)!)
    expect(readBoard(stored).elements.find(e => e.id === id)).toMatchObject({ value })
  })

  it('closes a removed member\'s sockets and makes a changed role reconnect with the new role', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const a = client(hub.url, BOARD, identity(1, 'designer', 7))
    const b = client(hub.url, BOARD, identity(2, 'designer', 7))
    await Promise.all([synced(a), synced(b)])
    expect(hub.hub.refreshRole(2, 7, 'designer')).toBe(0)
    expect(hub.hub.refreshRole(2, 7, 'reviewer')).toBe(1)
    await waitFor(() => b.closes.includes(4001))
    expect(hub.hub.closeSocketsOf(1, 7)).toBe(1)
    await waitFor(() => a.closes.includes(4403))
    await new Promise(r => setTimeout(r, 600))
    expect(a.provider.wsconnected).toBe(false) // 4403 is final: no reconnect
  })

  it('applies a server-side edit to the open room so connected peers see it', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    hub = await startTestHub({ store, timings: FAST })
    const a = client(hub.url, BOARD, identity(1, 'designer'))
    await synced(a)
    await hub.hub.editBoard(BOARD, doc => addElement(doc, { kind: 'L', placement: 'series', value: 4.7e-9, id: 'restored-one' }, undefined, 'test:restore'))
    await waitFor(() => readBoard(a.doc).elements.some(e => e.id === 'restored-one'))
    expect(store.writes.length).toBeGreaterThanOrEqual(1)
    // With nobody connected the edit loads, applies, writes and unloads.
    a.provider.disconnect()
    await waitFor(() => hub!.hub.stats().rooms === 0)
    await hub.hub.editBoard(BOARD, doc => addElement(doc, { kind: 'C', placement: 'shunt', value: 1e-12, id: 'restored-two' }, undefined, 'test:restore'))
    const stored = new Y.Doc()
    Y.applyUpdate(stored, store.states.get(BOARD)!)
    expect(readBoard(stored).elements.map(e => e.id)).toContain('restored-two')
    await waitFor(() => hub!.hub.stats().rooms === 0)
  })
})

function encodeVarUint(n: number): number[] {
  const out: number[] = []
  while (n > 0x7f) { out.push((n & 0x7f) | 0x80); n >>>= 7 }
  out.push(n)
  return out
}

async function rawSocket(url: string, who: ReturnType<typeof identity>, boardId = BOARD) {
  const ws = new WebSocket(`${url}/${boardId}`, { headers: { 'x-test-identity': JSON.stringify(who) } })
  const closed = new Promise<number>(ok => ws.on('close', code => ok(code)))
  await new Promise<void>((ok, fail) => { ws.once('open', () => ok()); ws.once('error', fail) })
  return { ws, closed }
}
