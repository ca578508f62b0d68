// POST /api/rf/search against the built server: the answer equals searchMatches called here on
// the same arguments; 401 without a session; 400 naming the field; 503 with a message past the
// time limit (a server of its own with a tiny limit); and a live edit round trip that completes
// while two searches work (they run in worker threads, not on the event loop).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { searchMatches, type SearchInput } from '../../shared/rf/index'
import { addElement } from '../../shared/board/ops'
import { DEMO_USERS, signIn } from '../support/auth'
import { startServer, type RunningServer } from '../support/server'
import { connectLive, waitUntil, whenSynced } from '../support/live-client'
import { clientPool, createBoard } from '../live/helpers'

const baseUrl = inject('baseUrl')
let cookie = ''

// Our invented scenario: the Brackwater soil node's 915 MHz chip antenna across 902–928 MHz.
const band = (n: number) => Array.from({ length: n }, (_, i) => 902e6 + (i * 26e6) / (n - 1))
const INPUT: SearchInput = { z0: 50, frequencies: band(11), load: { re: 18, im: -32 }, series: 'E24', maxElements: 2, q: { L: 40, C: 200 } }

async function post(body: unknown, options: { base?: string, cookie?: string | null } = {}) {
  const headers: Record<string, string> = { 'content-type': 'application/json' }
  const c = options.cookie === undefined ? cookie : options.cookie
  if (c) headers.cookie = c
  const res = await fetch(`${options.base ?? baseUrl}/api/rf/search`, { method: 'POST', headers, body: JSON.stringify(body) })
  return { status: res.status, body: await res.json() as any }
}

beforeAll(async () => { cookie = await signIn(baseUrl, DEMO_USERS.reviewer.email, DEMO_USERS.reviewer.password) })

describe('POST /api/rf/search', () => {
  it('answers what searchMatches gives, for any signed-in member (a reviewer here)', async () => {
    const res = await post(INPUT)
    expect(res.status).toBe(200)
    const want = searchMatches(INPUT)
    expect(res.body.candidates).toEqual(want.candidates)
    expect(res.body.searched).toBe(want.searched)
  })

  it('refuses a caller without a session', async () => {
    expect((await post(INPUT, { cookie: null })).status).toBe(401)
  })

  it.each([
    [{ maxElements: 4 }, 'maxElements'],
    [{ frequencies: band(402), load: { re: 18, im: -32 } }, 'frequencies'],
    [{ series: 'E6' }, 'series'],
    [{ q: { L: 0 } }, 'q.L'],
    [{ load: [{ re: 18, im: -32 }] }, 'load'],
    [{ load: { re: -1, im: 0 } }, 'load'],
    [{ z0: 'fifty' }, 'z0'],
  ])('400 naming the field %#', async (patch, field) => {
    const res = await post({ ...INPUT, ...patch })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain(field)
  })
})

describe('search time limit', () => {
  let server: RunningServer
  beforeAll(async () => { server = await startServer({ env: { GAMMABOARD_SEED: 'demo', GAMMABOARD_SEARCH_TIMEOUT_MS: '1000' } }) })
  afterAll(async () => { await server.stop() })

  it('answers 503 with a message when a search runs past it', async () => {
    const c = await signIn(server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const res = await post({ ...INPUT, series: 'E96', maxElements: 3, frequencies: band(101) }, { base: server.url, cookie: c })
    expect(res.status).toBe(503)
    expect(res.body.message).toMatch(/longer than/)
    // The pool starts a fresh thread for the next search.
    expect((await post({ ...INPUT, maxElements: 1 }, { base: server.url, cookie: c })).status).toBe(200)
  })
})

describe('live editing during searches', () => {
  const pool = clientPool()
  afterAll(() => pool.destroyAll())

  it('a colleague sees an edit while two large searches are running', async () => {
    const designer = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const boardId = await createBoard(baseUrl, designer, 'Search round trip')
    const a = pool.track(connectLive(baseUrl, boardId, { cookie: designer }))
    const b = pool.track(connectLive(baseUrl, boardId, { cookie }))
    await Promise.all([whenSynced(a), whenSynced(b)])
    const big = { ...INPUT, series: 'E96', maxElements: 3, frequencies: band(101) }
    let answered = 0
    const searches = [post(big), post(big)].map(p => p.then((r) => { answered++; return r }))
    // Let both requests reach their threads, then edit on one client and wait for the other.
    await new Promise(r => setTimeout(r, 300))
    addElement(a.doc, { kind: 'C', placement: 'shunt', value: 2.2e-12 })
    await waitUntil(() => b.doc.getArray('elements').length === 1, 15_000, 'the edit at the colleague')
    const answeredAtRoundTrip = answered
    const results = await Promise.all(searches)
    for (const r of results) expect(r.status).toBe(200)
    expect(answeredAtRoundTrip).toBe(0)
  })
})
