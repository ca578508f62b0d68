// Nothing lost: the built server is killed and restarted on the same database (a SQLite file, or
// a PostgreSQL database in the postgres project).
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import { readBoard } from '../../shared/board/ydoc'
import { addElement, updateElement } from '../../shared/board/ops'
import { freePort, startServer, type RunningServer } from '../support/server'
import { freshDatabase } from '../support/services'
import { connectLive, waitUntil, whenSynced } from '../support/live-client'
import { clientPool, createBoard, signInAll } from './helpers'

const pool = clientPool()
const servers: RunningServer[] = []
let dbFile: string
let port: number

async function boot(): Promise<RunningServer> {
  const server = await startServer({ dbFile, port, env: { GAMMABOARD_SEED: 'demo' } })
  servers.push(server)
  return server
}

beforeAll(async () => {
  dbFile = await freshDatabase()
  port = await freePort()
})

afterEach(async () => {
  pool.destroyAll()
  for (const server of servers.splice(0)) await server.stop('SIGKILL')
})

const valueOf = (client: { doc: Parameters<typeof readBoard>[0] }, id: string) =>
  (readBoard(client.doc).elements.find(e => e.id === id) as { value?: number } | undefined)?.value

describe('live durability', () => {
  it('keeps an edit made more than 2 s before a SIGKILL', async () => {
    let server = await boot()
    const cookies = await signInAll(server.url)
    const boardId = await createBoard(server.url, cookies.designer, 'Kill test')
    const editor = pool.track(connectLive(server.url, boardId, { cookie: cookies.designer }))
    const witness = pool.track(connectLive(server.url, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(editor), whenSynced(witness)])
    const id = addElement(editor.doc, { kind: 'C', placement: 'shunt', value: 4.7e-12 })
    updateElement(editor.doc, id, { value: 5.6e-12 })
    // Acknowledged: the server has relayed it to another peer.
    await waitUntil(() => valueOf(witness, id) === 5.6e-12)
    await new Promise(r => setTimeout(r, 2100))
    await server.stop('SIGKILL')
    pool.destroyAll()
    servers.splice(0)

    server = await boot()
    const after = pool.track(connectLive(server.url, boardId, { cookie: (await signInAll(server.url)).designer }))
    await whenSynced(after)
    expect(readBoard(after.doc).elements).toEqual([expect.objectContaining({ id, kind: 'C', value: 5.6e-12 })])
  })

  it('under continuous editing (an edit every 50 ms), a SIGKILL loses only edits accepted in its last second', async () => {
    // The stated bound (DEVELOPERS.md, "Security limits"): at most 1 s of accepted edits.
    const BOUND_MS = 1000
    let server = await boot()
    const cookies = await signInAll(server.url)
    const boardId = await createBoard(server.url, cookies.designer, 'Continuous kill test')
    const editor = pool.track(connectLive(server.url, boardId, { cookie: cookies.designer }))
    const witness = pool.track(connectLive(server.url, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(editor), whenSynced(witness)])
    // Accepted = relayed by the server to another peer; the witness notes when it saw each edit.
    const acceptedAt = new Map<string, number>()
    witness.doc.getArray('elements').observe(() => {
      for (const element of readBoard(witness.doc).elements) if (!acceptedAt.has(element.id)) acceptedAt.set(element.id, Date.now())
    })
    let n = 0
    const editing = setInterval(() => addElement(editor.doc, { kind: 'C', placement: 'shunt', value: ++n * 1e-12 }), 50)
    try {
      await waitUntil(() => acceptedAt.size >= 60, 30_000, '60 accepted edits')
      const killedAt = Date.now()
      await server.stop('SIGKILL')
      clearInterval(editing)
      const accepted = [...acceptedAt].filter(([, at]) => at <= killedAt)
      pool.destroyAll()
      servers.splice(0)

      server = await boot()
      const after = pool.track(connectLive(server.url, boardId, { cookie: (await signInAll(server.url)).designer }))
      await whenSynced(after)
      const kept = new Set(readBoard(after.doc).elements.map(e => e.id))
      const lost = accepted.filter(([id]) => !kept.has(id))
      console.info(`[durability] continuous editing: ${accepted.length} edits accepted before SIGKILL, ${lost.length} lost`)
      expect(lost.filter(([, at]) => killedAt - at > BOUND_MS), 'edits accepted more than 1 s before the kill').toEqual([])
    }
    finally {
      clearInterval(editing)
    }
  })

  it('flushes everything on SIGTERM, even an edit made just before it', async () => {
    let server = await boot()
    const cookies = await signInAll(server.url)
    const boardId = await createBoard(server.url, cookies.designer, 'Term test')
    const editor = pool.track(connectLive(server.url, boardId, { cookie: cookies.designer }))
    const witness = pool.track(connectLive(server.url, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(editor), whenSynced(witness)])
    const ids = [1, 2, 3].map(n => addElement(editor.doc, { kind: 'L', placement: 'series', value: n * 1e-9 }))
    await waitUntil(() => readBoard(witness.doc).elements.length === 3)
    await server.stop('SIGTERM')
    expect(server.process.exitCode).toBe(0)
    pool.destroyAll()
    servers.splice(0)

    server = await boot()
    const after = pool.track(connectLive(server.url, boardId, { cookie: (await signInAll(server.url)).designer }))
    await whenSynced(after)
    expect(readBoard(after.doc).elements.map(e => e.id)).toEqual(ids)
  })

  it('merges an offline client\'s edits on reconnect and duplicates nothing across a restart', async () => {
    let server = await boot()
    const cookies = await signInAll(server.url)
    const boardId = await createBoard(server.url, cookies.designer, 'Offline test')
    const a = pool.track(connectLive(server.url, boardId, { cookie: cookies.designer }))
    const b = pool.track(connectLive(server.url, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(a), whenSynced(b)])
    const shared = addElement(a.doc, { kind: 'C', placement: 'shunt', value: 1e-12 })
    await waitUntil(() => readBoard(b.doc).elements.length === 1)

    a.provider.disconnect()
    const offline = addElement(a.doc, { kind: 'L', placement: 'series', value: 8.2e-9 })
    updateElement(a.doc, shared, { q: 60 })
    const online = addElement(b.doc, { kind: 'R', placement: 'shunt', value: 330 })
    await new Promise(r => setTimeout(r, 200))
    a.provider.connect()
    await waitUntil(() => readBoard(a.doc).elements.length === 3 && readBoard(b.doc).elements.length === 3, 10_000, 'offline merge')
    expect(readBoard(b.doc).elements.find(e => e.id === shared)).toMatchObject({ q: 60 })
    expect(new Set(readBoard(b.doc).elements.map(e => e.id))).toEqual(new Set([shared, offline, online]))

    // Restart on the same port: the connected clients reconnect by themselves and sync again.
    await server.stop('SIGTERM')
    servers.splice(0)
    server = await boot()
    await waitUntil(() => a.provider.synced && b.provider.synced, 20_000, 'resync after restart')
    const fresh = pool.track(connectLive(server.url, boardId, { cookie: (await signInAll(server.url)).admin }))
    await whenSynced(fresh)
    for (const client of [a, b, fresh]) {
      const board = readBoard(client.doc)
      expect(board.problems.filter(p => p.includes('repeats id'))).toEqual([])
      expect(client.doc.getArray('elements').length).toBe(3)
      expect(new Set(board.elements.map(e => e.id))).toEqual(new Set([shared, offline, online]))
    }
  })

  it('reconnects a member whose role changed with the new role, and closes a removed member within 5 s', async () => {
    const server = await boot()
    const cookies = await signInAll(server.url)
    const boardId = await createBoard(server.url, cookies.designer, 'Role test')
    const members = await (await fetch(`${server.url}/api/workspaces/brackwater/members`, { headers: { cookie: cookies.admin } })).json() as { userId: number, email: string }[]
    const ines = members.find(m => m.email === 'ines@brackwater.example')!
    const member = (init: RequestInit) => fetch(`${server.url}/api/workspaces/brackwater/members/${ines.userId}`, {
      ...init, headers: { 'content-type': 'application/json', cookie: cookies.admin, origin: server.url },
    })
    const designer = pool.track(connectLive(server.url, boardId, { cookie: cookies.designer }))
    const person = pool.track(connectLive(server.url, boardId, { cookie: cookies.reviewer }))
    await Promise.all([whenSynced(designer), whenSynced(person)])
    await waitUntil(() => person.notices.at(-1)?.readOnly === true)

    expect((await member({ method: 'PATCH', body: JSON.stringify({ role: 'designer' }) })).status).toBe(200)
    await waitUntil(() => person.closeCodes.includes(4001), 5000, 'role-change close')
    await waitUntil(() => person.provider.synced && person.notices.at(-1)?.readOnly === false, 10_000, 'reconnect as designer')
    const id = addElement(person.doc, { kind: 'C', placement: 'series', value: 2e-12 })
    await waitUntil(() => readBoard(designer.doc).elements.some(e => e.id === id), 5000, 'edit after promotion')

    const removedAt = Date.now()
    expect((await member({ method: 'DELETE' })).status).toBeLessThan(300)
    await waitUntil(() => person.closeCodes.includes(4403), 5000, 'removal close')
    expect(Date.now() - removedAt).toBeLessThan(5000)
    await new Promise(r => setTimeout(r, 1000))
    expect(person.provider.wsconnected).toBe(false)
  })
})
