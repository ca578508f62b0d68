// The workspace's board list says who is in each board now, from the live rooms (server-stamped).
import { afterEach, beforeAll, describe, expect, inject, it } from 'vitest'
import { connectLive, whenSynced } from '../support/live-client'
import { DEMO_USERS } from '../support/auth'
import { clientPool, createBoard, signInAll } from './helpers'

const baseUrl = inject('baseUrl')
const pool = clientPool()
let cookies: Awaited<ReturnType<typeof signInAll>>

beforeAll(async () => { cookies = await signInAll(baseUrl) })
afterEach(() => pool.destroyAll())

type Listed = { id: string, present: { userId: number, name: string, colour: string }[] }
async function presentIn(boardId: string): Promise<string[]> {
  const res = await fetch(`${baseUrl}/api/boards?workspace=brackwater`, { headers: { cookie: cookies.reviewer } })
  expect(res.status).toBe(200)
  const board = (await res.json() as Listed[]).find(b => b.id === boardId)!
  return board.present.map(p => p.name).sort()
}

describe('who is in a board now', () => {
  it('lists the people connected to a board, once each, and drops them when they leave', async () => {
    const boardId = await createBoard(baseUrl, cookies.designer, 'Presence list')
    expect(await presentIn(boardId)).toEqual([])
    const tab1 = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.designer }))
    const tab2 = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.designer }))
    const admin = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(tab1), whenSynced(tab2), whenSynced(admin)])
    // Two tabs of one person count once; names come from the accounts.
    expect(await presentIn(boardId)).toEqual([DEMO_USERS.admin.name, DEMO_USERS.designer.name].sort())
    admin.destroy()
    await expect.poll(() => presentIn(boardId), { timeout: 5000 }).toEqual([DEMO_USERS.designer.name])
  })
})
