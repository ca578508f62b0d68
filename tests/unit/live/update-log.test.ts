// The update log's batching: updates pushed together reach the store as one merged append, a
// failed append keeps its batch for the next one, and lastId only moves once a batch is stored.
import { describe, expect, it } from 'vitest'
import * as Y from 'yjs'
import { createUpdateLog } from '../../../server/utils/live/update-log'

function edits(count: number) {
  const doc = new Y.Doc()
  const updates: Uint8Array[] = []
  doc.on('update', (u: Uint8Array) => updates.push(u))
  for (let k = 0; k < count; k++) doc.getArray<number>('a').push([k])
  return updates
}

function replay(stored: Uint8Array[]) {
  const doc = new Y.Doc()
  for (const u of stored) Y.applyUpdate(doc, u)
  return doc.getArray<number>('a').toArray()
}

describe('createUpdateLog', () => {
  it('merges the updates pushed before an append into one row, in order', async () => {
    const stored: Uint8Array[] = []
    const log = createUpdateLog({ append: async (u) => { stored.push(u); return stored.length }, intervalMs: 50, retryMs: 50, initialId: 0 })
    for (const u of edits(5)) log.push(u)
    await log.flush()
    expect(stored).toHaveLength(1)
    expect(replay(stored)).toEqual([0, 1, 2, 3, 4])
    expect(log.lastId).toBe(1)
    log.dispose()
  })

  it('keeps a failed batch and stores it with the next one; lastId stays until then', async () => {
    const stored: Uint8Array[] = []
    let isFailing = true
    const errors: unknown[] = []
    const log = createUpdateLog({
      append: async (u) => { if (isFailing) throw new Error('disk full (test)'); stored.push(u); return 40 + stored.length },
      intervalMs: 10, retryMs: 10, initialId: 7, onError: e => errors.push(e),
    })
    const updates = edits(4)
    log.push(updates[0]!)
    log.push(updates[1]!)
    await log.flush()
    expect(errors.length).toBeGreaterThan(0)
    expect(log.lastId).toBe(7)
    isFailing = false
    log.push(updates[2]!)
    log.push(updates[3]!)
    await log.flush()
    expect(replay(stored)).toEqual([0, 1, 2, 3])
    expect(log.lastId).toBe(40 + stored.length)
    log.dispose()
  })

  it('writes nothing after dispose', async () => {
    const stored: Uint8Array[] = []
    const log = createUpdateLog({ append: async (u) => { stored.push(u); return 1 }, intervalMs: 10, retryMs: 10, initialId: 0 })
    log.push(edits(1)[0]!)
    log.dispose()
    await log.flush()
    await new Promise(r => setTimeout(r, 30))
    expect(stored).toEqual([])
  })
})
