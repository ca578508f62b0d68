// Two built nodes on one PostgreSQL database and one Redis (the postgres project's throwaway
// servers), as in production: live peers on different nodes, presence, read-only reviewers, the
// sign-in limit, member changes and a SIGKILLed node, some of it through a pass-through balancer.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest'
import { readBoard } from '../../shared/board/ydoc'
import { addElement, updateElement } from '../../shared/board/ops'
import { readPresence } from '../../shared/live/presence'
import { startServer, type RunningServer } from '../support/server'
import { freshDatabase, projectServices, startRedis } from '../support/services'
import { startBalancer, type Balancer } from '../support/balancer'
import { connectLive, waitUntil, whenSynced, type LiveClient } from '../support/live-client'
import { postFrom } from '../support/api'
import { DEMO_USERS } from '../support/auth'
import { clientPool, createBoard, signInAll } from '../live/helpers'

const pool = clientPool()
let database: string
let nodeA: RunningServer
let nodeB: RunningServer
let cookies: Awaited<ReturnType<typeof signInAll>>
const extra: { stop: () => Promise<void> }[] = []

beforeAll(async () => {
  expect(projectServices().redis, 'this suite runs in the postgres project, with Redis').toBeTruthy()
  database = await freshDatabase()
  nodeA = await startServer({ dbFile: database, env: { GAMMABOARD_SEED: 'demo' } })
  nodeB = await startServer({ dbFile: database, env: { GAMMABOARD_SEED: 'demo' } })
  cookies = await signInAll(nodeA.url)
})

afterEach(async () => {
  pool.destroyAll()
  for (const thing of extra.splice(0).reverse()) await thing.stop()
})

afterAll(async () => {
  await nodeA?.stop()
  await nodeB?.stop()
})

const valueOf = (client: LiveClient, id: string) =>
  (readBoard(client.doc).elements.find(e => e.id === id) as { value?: number } | undefined)?.value
const presenceOf = (seer: LiveClient, seen: LiveClient) => readPresence(seer.provider.awareness.getStates().get(seen.doc.clientID))

describe('two nodes on one database and one Redis', () => {
  it('answers health with the database and Redis up on both nodes', async () => {
    for (const node of [nodeA, nodeB]) {
      const res = await fetch(`${node.url}/api/health`)
      expect(res.status).toBe(200)
      expect(await res.json()).toMatchObject({ ok: true, database: 'up', redis: 'up', dialect: 'postgres' })
    }
  })

  it('converges peers on different nodes, both ways, and keeps a reviewer read-only', async () => {
    const boardId = await createBoard(nodeA.url, cookies.designer, 'Two nodes')
    const onA = pool.track(connectLive(nodeA.url, boardId, { cookie: cookies.designer }))
    const onB = pool.track(connectLive(nodeB.url, boardId, { cookie: cookies.admin }))
    const reviewer = pool.track(connectLive(nodeB.url, boardId, { cookie: cookies.reviewer }))
    await Promise.all([whenSynced(onA), whenSynced(onB), whenSynced(reviewer)])
    const fromA = addElement(onA.doc, { kind: 'C', placement: 'shunt', value: 3.9e-12 })
    const fromB = addElement(onB.doc, { kind: 'L', placement: 'series', value: 6.8e-9 })
    await waitUntil(() => [onA, onB, reviewer].every(c => readBoard(c.doc).elements.length === 2), 5000, 'convergence')
    expect(readBoard(onA.doc).elements.map(e => e.id)).toEqual(readBoard(onB.doc).elements.map(e => e.id))
    expect(new Set(readBoard(reviewer.doc).elements.map(e => e.id))).toEqual(new Set([fromA, fromB]))

    // The reviewer's change is dropped on node B and never reaches node A.
    updateElement(reviewer.doc, fromA, { value: 1e-9 })
    await waitUntil(() => reviewer.notices.some(n => n.dropped), 5000, 'dropped notice')
    updateElement(onB.doc, fromB, { value: 8.2e-9 })
    await waitUntil(() => valueOf(onA, fromB) === 8.2e-9, 5000, 'later edit from B')
    expect(valueOf(onA, fromA)).toBe(3.9e-12)
    const stored = await fetch(`${nodeA.url}/api/boards/${boardId}`, { headers: { cookie: cookies.designer } })
    expect(((await stored.json()) as { elements: { id: string, value: number }[] }).elements.find(e => e.id === fromA)?.value).toBe(3.9e-12)
  })

  it('shows presence, stamped by the node it came through, on the other node', async () => {
    const boardId = await createBoard(nodeA.url, cookies.designer, 'Presence across nodes')
    const onA = pool.track(connectLive(nodeA.url, boardId, { cookie: cookies.designer }))
    const onB = pool.track(connectLive(nodeB.url, boardId, { cookie: cookies.admin }))
    await Promise.all([whenSynced(onA), whenSynced(onB)])
    onA.provider.awareness.setLocalState({ user: { id: 999, name: 'Not Me', colour: '#000000', role: 'admin' }, pointer: { re: 0.25, im: -0.5 } })
    await waitUntil(() => presenceOf(onB, onA)?.pointer?.re === 0.25, 5000, 'presence on node B')
    expect(presenceOf(onB, onA)!.user).toMatchObject({ name: DEMO_USERS.designer.name, role: 'designer' })
    onA.destroy()
    await waitUntil(() => !onB.provider.awareness.getStates().has(onA.doc.clientID), 5000, 'presence gone on node B')
  })

  it('lists who is in a board on every node\'s board list', async () => {
    const boardId = await createBoard(nodeA.url, cookies.designer, 'In it now across nodes')
    const namesOn = async (node: RunningServer) => {
      const res = await fetch(`${node.url}/api/boards?workspace=brackwater`, { headers: { cookie: cookies.reviewer } })
      const board = (await res.json() as { id: string, present: { name: string }[] }[]).find(b => b.id === boardId)!
      return board.present.map(p => p.name).sort()
    }
    const onA = pool.track(connectLive(nodeA.url, boardId, { cookie: cookies.designer }))
    await whenSynced(onA)
    await expect.poll(() => namesOn(nodeB), { timeout: 10_000 }).toEqual([DEMO_USERS.designer.name])
    onA.destroy()
    await expect.poll(() => namesOn(nodeB), { timeout: 15_000 }).toEqual([])
  })

  it('tells a review listener on one node about a comment posted through the other', async () => {
    const boardId = await createBoard(nodeA.url, cookies.designer, 'Review across nodes')
    const controller = new AbortController()
    const res = await fetch(`${nodeB.url}/api/boards/${boardId}/review-events`, { headers: { cookie: cookies.designer }, signal: controller.signal })
    expect(res.status).toBe(200)
    const reader = res.body!.getReader()
    let text = ''
    const read = (async () => {
      while (!text.includes('event: review')) {
        const { value, done } = await reader.read()
        if (done) break
        text += new TextDecoder().decode(value)
      }
    })()
    await waitUntil(() => text.includes('event: ready'), 5000, 'ready')
    const posted = await fetch(`${nodeA.url}/api/boards/${boardId}/comments`, {
      method: 'POST', headers: { 'content-type': 'application/json', cookie: cookies.reviewer, origin: nodeA.url }, body: JSON.stringify({ body: 'Seen on the other node?' }),
    })
    expect(posted.status).toBe(201)
    const { id } = await posted.json() as { id: string }
    await Promise.race([read, new Promise(r => setTimeout(r, 5000))])
    controller.abort()
    expect(text).toContain('event: review')
    expect(text).toContain(id)
  })

  it('counts failed sign-ins across nodes: ten in all, wherever they land', async () => {
    const email = `target-${Date.now()}@race.example`
    const made = await fetch(`${nodeA.url}/api/auth/signup`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'Sign-in Target', email, password: 'the right long password' }),
    })
    expect(made.status).toBe(201)
    // Parallel wrong guesses, alternating between the nodes, each from its own address.
    const statuses = await Promise.all(Array.from({ length: 24 }, (_, i) =>
      postFrom(i % 2 ? nodeB.url : nodeA.url, `127.0.2.${i + 1}`, '/api/auth/login', { email, password: `wrong ${i}` })))
    expect(statuses.filter(s => s === 401)).toHaveLength(10)
    expect(statuses.filter(s => s === 429)).toHaveLength(14)
    for (const node of [nodeA, nodeB]) {
      expect(await postFrom(node.url, '127.0.2.99', '/api/auth/login', { email, password: 'the right long password' })).toBe(429)
    }
  })

  it('closes a member\'s sockets on the other node when an admin on this one changes their role or removes them', async () => {
    const boardId = await createBoard(nodeA.url, cookies.designer, 'Member changes across nodes')
    const members = await (await fetch(`${nodeA.url}/api/workspaces/brackwater/members`, { headers: { cookie: cookies.admin } })).json() as { userId: number, email: string }[]
    const ines = members.find(m => m.email === DEMO_USERS.reviewer.email)!
    const member = (init: RequestInit) => fetch(`${nodeA.url}/api/workspaces/brackwater/members/${ines.userId}`, {
      ...init, headers: { 'content-type': 'application/json', cookie: cookies.admin, origin: nodeA.url },
    })
    const designer = pool.track(connectLive(nodeA.url, boardId, { cookie: cookies.designer }))
    const person = pool.track(connectLive(nodeB.url, boardId, { cookie: cookies.reviewer }))
    await Promise.all([whenSynced(designer), whenSynced(person)])
    await waitUntil(() => person.notices.at(-1)?.readOnly === true)

    expect((await member({ method: 'PATCH', body: JSON.stringify({ role: 'designer' }) })).status).toBe(200)
    await waitUntil(() => person.closeCodes.includes(4001), 5000, 'role-change close on node B')
    await waitUntil(() => person.provider.synced && person.notices.at(-1)?.readOnly === false, 10_000, 'reconnect as designer')
    const id = addElement(person.doc, { kind: 'C', placement: 'series', value: 2e-12 })
    await waitUntil(() => readBoard(designer.doc).elements.some(e => e.id === id), 5000, 'edit after promotion reaches node A')

    expect((await member({ method: 'DELETE' })).status).toBeLessThan(300)
    await waitUntil(() => person.closeCodes.includes(4403), 5000, 'removal close on node B')
  })

  it('loses nothing that the other node holds when a node is SIGKILLed; its clients carry on through the balancer', async () => {
    const nodeC = await startServer({ dbFile: database })
    const nodeD = await startServer({ dbFile: database })
    extra.push(nodeD, nodeC)
    const balancer: Balancer = await startBalancer([nodeC.port, nodeD.port])
    extra.push({ stop: balancer.close })
    const boardId = await createBoard(nodeC.url, cookies.designer, 'Kill one node')
    // Round robin: the first client lands on node C, the second on node D.
    const first = pool.track(connectLive(balancer.url, boardId, { cookie: cookies.designer }))
    await whenSynced(first)
    const second = pool.track(connectLive(balancer.url, boardId, { cookie: cookies.admin }))
    await whenSynced(second)
    expect([...balancer.counts.values()]).toEqual([1, 1])

    const before = addElement(first.doc, { kind: 'C', placement: 'shunt', value: 4.7e-12 })
    await waitUntil(() => valueOf(second, before) === 4.7e-12, 5000, 'edit reaches node D')
    // Killed at once, well inside its save debounce: node C never wrote this edit itself.
    await nodeC.stop('SIGKILL')
    await waitUntil(() => first.closeCodes.length > 0, 5000, 'first client notices')
    await waitUntil(() => first.provider.synced && first.provider.wsconnected, 15_000, 'first client reconnects to node D')
    const after = addElement(first.doc, { kind: 'L', placement: 'series', value: 10e-9 })
    await waitUntil(() => readBoard(second.doc).elements.some(e => e.id === after), 5000, 'edit after the kill')

    // Node D saves (debounced); a node started afterwards loads both edits from the database.
    pool.destroyAll()
    await nodeD.stop('SIGTERM')
    const fresh = await startServer({ dbFile: database })
    extra.push(fresh)
    const reader = pool.track(connectLive(fresh.url, boardId, { cookie: cookies.admin }))
    await whenSynced(reader)
    expect(new Set(readBoard(reader.doc).elements.map(e => e.id))).toEqual(new Set([before, after]))
  })

  it('answers 503 from a node whose Redis went away', async () => {
    const redis = await startRedis()
    extra.push(redis)
    const lonely = await startServer({ dbFile: database, services: { redis: redis.url } })
    extra.push(lonely)
    expect((await fetch(`${lonely.url}/api/health`)).status).toBe(200)
    await redis.stop()
    await expect.poll(async () => (await fetch(`${lonely.url}/api/health`)).status, { timeout: 10_000 }).toBe(503)
    const body = await (await fetch(`${lonely.url}/api/health`)).json() as { data: { database: string, redis: string } }
    expect(body.data).toMatchObject({ database: 'up', redis: 'down' })
  })
})
