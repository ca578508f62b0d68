// Two live hubs ("nodes") joined by an in-memory bus that behaves like Redis pub/sub (every
// subscriber of a channel gets each message, the sender included, asynchronously), sharing one
// store. Real `ws` servers and y-websocket clients on each; Redis itself is in tests/multinode.
import { afterEach, describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import { DEMO_BOARDS } from '../../../shared/board/demo-boards'
import { createBoardDoc, encodeBoardState, readBoard } from '../../../shared/board/ydoc'
import { addElement, updateElement } from '../../../shared/board/ops'
import { readPresence } from '../../../shared/live/presence'
import { decodeRelayMessage, encodeRelayMessage, type RelayBus } from '../../../server/utils/live/relay'
import { connectClient, identity, memoryStore, startTestHub, synced, waitFor, type TestClient, type TestHub } from './harness'

const BOARD = 'brackwater-915-antenna'
const demo = DEMO_BOARDS.find(b => b.id === BOARD)!
const demoState = () => encodeBoardState(createBoardDoc(demo))
const FAST = { saveDebounceMs: 100, saveMaxWaitMs: 400 }

function memoryNetwork() {
  const channels = new Map<string, Map<string, (bytes: Uint8Array) => void>>()
  let delivered = 0
  return {
    get delivered() { return delivered },
    bus(nodeId: string): RelayBus {
      return {
        nodeId,
        async subscribe(boardId, onMessage) {
          if (!channels.has(boardId)) channels.set(boardId, new Map())
          channels.get(boardId)!.set(nodeId, onMessage)
        },
        unsubscribe(boardId) {
          channels.get(boardId)?.delete(nodeId)
        },
        publish(boardId, bytes) {
          const copy = bytes.slice()
          setTimeout(() => {
            for (const handler of channels.get(boardId)?.values() ?? []) {
              delivered++
              handler(copy)
            }
          }, 1)
        },
      }
    },
  }
}

const hubs: TestHub[] = []
const clients: TestClient[] = []
const client = (...args: Parameters<typeof connectClient>) => {
  const c = connectClient(...args)
  clients.push(c)
  return c
}

afterEach(async () => {
  for (const c of clients.splice(0)) c.destroy()
  for (const hub of hubs.splice(0)) await hub.close()
})

async function twoNodes(store = memoryStore({ [BOARD]: demoState() })) {
  const network = memoryNetwork()
  const a = await startTestHub({ store, timings: FAST, relay: network.bus('node-a') })
  const b = await startTestHub({ store, timings: FAST, relay: network.bus('node-b') })
  hubs.push(a, b)
  return { a, b, store, network }
}

const stateVector = (doc: Y.Doc) => Buffer.from(Y.encodeStateVector(doc)).toString('base64')

describe('relay between nodes', () => {
  it('encodes and decodes its messages', () => {
    const message = { kind: 2, nodeId: 'n-1', payload: new Uint8Array([1, 2, 3]), wantsReply: true }
    expect(decodeRelayMessage(encodeRelayMessage(message))).toEqual(message)
  })

  it('converges editors on different nodes and keeps a reviewer read-only on both', async () => {
    const { a, b } = await twoNodes()
    const onA = client(a.url, BOARD, identity(1, 'designer'))
    const onB = client(b.url, BOARD, identity(2, 'admin'))
    const reviewer = client(b.url, BOARD, identity(3, 'reviewer'))
    await Promise.all([synced(onA), synced(onB), synced(reviewer)])
    const first = demo.elements[0]!.id
    updateElement(onA.doc, first, { value: 1.5e-9 })
    const added = addElement(onB.doc, { kind: 'C', placement: 'shunt', value: 2.2e-12 })
    await waitFor(() => stateVector(onA.doc) === stateVector(onB.doc) && readBoard(onA.doc).elements.some(e => e.id === added), 5000, 'convergence')
    expect(readBoard(onB.doc).elements.find(e => e.id === first)).toMatchObject({ value: 1.5e-9 })
    await waitFor(() => readBoard(reviewer.doc).elements.some(e => e.id === added))

    const before = stateVector(onA.doc)
    addElement(reviewer.doc, { kind: 'R', placement: 'series', value: 10 })
    await waitFor(() => reviewer.notices.some(n => n.dropped))
    await new Promise(r => setTimeout(r, 200))
    expect(stateVector(onA.doc)).toBe(before)
    expect(stateVector(a.hub.openDoc(BOARD)!)).toBe(before)
    expect(stateVector(b.hub.openDoc(BOARD)!)).toBe(before)
  })

  it('carries stamped presence across nodes and removes it when the peer leaves', async () => {
    const { a, b } = await twoNodes()
    const onA = client(a.url, BOARD, identity(1, 'designer'))
    const onB = client(b.url, BOARD, identity(2, 'designer'))
    await Promise.all([synced(onA), synced(onB)])
    onA.provider.awareness.setLocalState({ user: { id: 99, name: 'Someone Else', colour: '#000', role: 'admin' }, pointer: { re: 0.3, im: 0.1 } })
    const seenByB = () => readPresence(onB.provider.awareness.getStates().get(onA.doc.clientID))
    await waitFor(() => seenByB()?.pointer?.re === 0.3, 5000, 'presence on the other node')
    expect(seenByB()!.user).toEqual({ id: 1, name: 'Person 1', colour: '#123456', role: 'designer' })
    onA.provider.disconnect()
    await waitFor(() => !onB.provider.awareness.getStates().has(onA.doc.clientID), 5000, 'presence removed')
  })

  it('gives a node that opens the board later the edits the other node has not saved yet', async () => {
    const store = memoryStore({ [BOARD]: demoState() })
    const { a, b } = await twoNodes(store)
    const onA = client(a.url, BOARD, identity(1, 'designer'))
    await synced(onA)
    // Saves now take 1.5 s: the later node loads the stored state without the edit.
    store.slowWrites(1500)
    const added = addElement(onA.doc, { kind: 'L', placement: 'series', value: 3.3e-9 })
    await new Promise(r => setTimeout(r, 50))
    const onB = client(b.url, BOARD, identity(2, 'designer'))
    await synced(onB)
    await waitFor(() => readBoard(onB.doc).elements.some(e => e.id === added), 5000, 'unsaved edit reaches the late node')
  })
})
