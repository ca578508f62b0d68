// Real built server, real y-websocket clients signed in over the API: concurrent edits converge.
import { afterEach, beforeAll, describe, expect, inject, it } from 'vitest'
import * as Y from 'yjs'
import seedrandom from 'seedrandom'
import { ORIGIN_LOCAL, readBoard } from '../../shared/board/ydoc'
import { addElement, moveElement, removeElement, updateElement } from '../../shared/board/ops'
import { connectLive, waitUntil, whenSynced, type LiveClient } from '../support/live-client'
import { b64, clientPool, createBoard, signInAll } from './helpers'

const baseUrl = inject('baseUrl')
const pool = clientPool()
let cookies: Awaited<ReturnType<typeof signInAll>>

beforeAll(async () => { cookies = await signInAll(baseUrl) })
afterEach(() => pool.destroyAll())

const sameState = (clients: LiveClient[]) => {
  const vectors = clients.map(c => b64(Y.encodeStateVector(c.doc)))
  return vectors.every(v => v === vectors[0])
}

async function expectConverged(clients: LiveClient[]) {
  await waitUntil(() => sameState(clients), 15_000, 'identical state vectors')
  // Same state vector and delete set (encoded bytes may still differ: each replica merges and
  // garbage-collects deleted structs in its own transactions), and the same content.
  const snapshots = clients.map(c => Y.snapshot(c.doc))
  for (const snap of snapshots) expect(Y.equalSnapshots(snap, snapshots[0]!)).toBe(true)
  const json = clients.map(c => JSON.stringify(c.doc.getArray('elements').toJSON()) + JSON.stringify(c.doc.getMap('board').toJSON()))
  for (const text of json) expect(text).toBe(json[0])
  const boards = clients.map(c => JSON.stringify(readBoard(c.doc)))
  for (const board of boards) expect(board).toBe(boards[0])
}

describe('live convergence', () => {
  it('two clients converge on concurrent edits of the same elements', async () => {
    const boardId = await createBoard(baseUrl, cookies.designer, 'Converge two')
    const a = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.designer }))
    const b = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(a), whenSynced(b)])
    const first = addElement(a.doc, { kind: 'C', placement: 'shunt', value: 1.8e-12 })
    await waitUntil(() => readBoard(b.doc).elements.length === 1)
    // Both change the same element at once, and both add one.
    updateElement(a.doc, first, { value: 2.2e-12 })
    updateElement(b.doc, first, { value: 2.7e-12, q: 80 })
    addElement(a.doc, { kind: 'L', placement: 'series', value: 6.8e-9 })
    addElement(b.doc, { kind: 'line', z0: 50, deg: 12 }, 0)
    await expectConverged([a, b])
    const board = readBoard(a.doc)
    expect(board.elements).toHaveLength(3)
    expect(board.elements.find(e => e.id === first)).toMatchObject({ q: 80 })
    expect([2.2e-12, 2.7e-12]).toContain((board.elements.find(e => e.id === first) as { value: number }).value)
  })

  it('ten clients converge on seeded random concurrent edits', async () => {
    const boardId = await createBoard(baseUrl, cookies.designer, 'Converge ten')
    const clients = Array.from({ length: 10 }, (_, i) =>
      pool.track(connectLive(baseUrl, boardId, { cookie: i % 2 ? cookies.admin : cookies.designer })))
    await Promise.all(clients.map(c => whenSynced(c, 10_000)))
    const random = seedrandom('ten-clients')
    addElement(clients[0]!.doc, { kind: 'C', placement: 'shunt', value: 1e-12, id: 'seed-element' })
    await waitUntil(() => clients.every(c => readBoard(c.doc).elements.length === 1), 10_000)
    for (let round = 0; round < 15; round++) {
      for (const client of clients) {
        const ids = readBoard(client.doc).elements.map(e => e.id)
        const pick = ids[Math.floor(random() * ids.length)]
        const roll = random()
        if (roll < 0.35 || !pick) addElement(client.doc, { kind: 'L', placement: random() < 0.5 ? 'series' : 'shunt', value: 1e-9 * (1 + random()) })
        else if (roll < 0.75) updateElement(client.doc, pick, { value: 1e-12 * (1 + random() * 10) })
        else if (roll < 0.9) moveElement(client.doc, pick, Math.floor(random() * ids.length))
        else if (ids.length > 2) removeElement(client.doc, pick)
      }
      await new Promise(r => setTimeout(r, 5))
    }
    await expectConverged(clients)
    const board = readBoard(clients[0]!.doc)
    expect(board.elements.length).toBeGreaterThan(1)
    expect(new Set(board.elements.map(e => e.id)).size).toBe(board.elements.length)
  })

  it('undo reverts only one\'s own change while a colleague edits the same element', async () => {
    const boardId = await createBoard(baseUrl, cookies.designer, 'Undo own')
    const a = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.designer }))
    const b = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(a), whenSynced(b)])
    const id = addElement(b.doc, { kind: 'L', placement: 'series', value: 10e-9 })
    await waitUntil(() => readBoard(a.doc).elements.length === 1)
    const undo = new Y.UndoManager([a.doc.getMap('board'), a.doc.getArray('elements')], { trackedOrigins: new Set([ORIGIN_LOCAL]), captureTimeout: 0 })
    updateElement(a.doc, id, { value: 12e-9 })
    updateElement(b.doc, id, { q: 45 })
    await waitUntil(() => (readBoard(a.doc).elements[0] as { q?: number }).q === 45 && (readBoard(b.doc).elements[0] as { value: number }).value === 12e-9)
    expect(undo.undoStack).toHaveLength(1) // the colleague's edit, applied by the provider, is not on it
    undo.undo()
    await waitUntil(() => (readBoard(b.doc).elements[0] as { value: number }).value === 10e-9)
    expect(readBoard(b.doc).elements[0]).toMatchObject({ value: 10e-9, q: 45 })
    await expectConverged([a, b])
    undo.destroy()
  })
})
