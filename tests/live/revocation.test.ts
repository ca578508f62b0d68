// Ending sessions reaches the live sockets at once: sign-out everywhere, a password reset and a
// plain sign-out close the sockets they end, edits sent afterwards are never stored, and the
// socket cannot reopen with the old cookie. Sessions expire on the server and are extended by use.
// Deleting a board closes its sockets. Real server, real y-websocket clients.
import { afterEach, describe, expect, inject, it } from 'vitest'
import { readBoard } from '../../shared/board/ydoc'
import { addElement } from '../../shared/board/ops'
import { CLOSE_ACCESS_REVOKED, CLOSE_BOARD_GONE } from '../../shared/live/protocol'
import { apiClient } from '../support/api'
import { signIn } from '../support/auth'
import { linkIn, waitForMails, queryDb, writeDb } from '../support/db'
import { connectLive, tryUpgrade, waitUntil, whenSynced } from '../support/live-client'
import { clientPool } from './helpers'

const baseUrl = inject('baseUrl')
const dbFile = inject('dbFile')
const api = apiClient(baseUrl)
const pool = clientPool()
afterEach(() => pool.destroyAll())

let serial = 0
const DAY_MS = 24 * 60 * 60 * 1000

/** A fresh account with its own workspace and one board in it. */
async function accountWithBoard(name: string) {
  const email = `${name.toLowerCase()}-${Date.now()}-${++serial}@revoke.example`
  const password = 'a good long password'
  const signup = await api('POST', '/api/auth/signup', { body: { name, email, password } })
  expect(signup.status).toBe(201)
  const board = await api('POST', '/api/boards', { cookie: signup.cookie, body: { workspace: signup.json.workspace.slug, name: `${name} board` } })
  expect(board.status).toBe(201)
  return { email, password, cookie: signup.cookie, id: signup.json.user.id as number, boardId: board.json.id as string }
}

async function openSocket(boardId: string, cookie: string) {
  const client = pool.track(connectLive(baseUrl, boardId, { cookie }))
  await whenSynced(client)
  return client
}

async function storedElements(boardId: string, cookie: string) {
  const res = await api('GET', `/api/boards/${boardId}`, { cookie })
  expect(res.status).toBe(200)
  return (res.json.elements as { id: string }[]).map(e => e.id)
}

/** The session row of a cookie's session: the newest one of the user. */
async function newestSession(userId: number) {
  const [row] = await queryDb<{ id: string, expires_at: string, created_at: string, revoked_at: string | null }>(dbFile,
    'SELECT id, expires_at, created_at, revoked_at FROM sessions WHERE user_id = ? ORDER BY created_at DESC LIMIT 1', [userId])
  return row!
}

describe('revoked sessions lose their live sockets at once', () => {
  it('sign-out everywhere closes the open socket; a later edit is never stored; the old cookie cannot reconnect', async () => {
    const owner = await accountWithBoard('Everywhere')
    const laptop = await signIn(baseUrl, owner.email, owner.password)
    const client = await openSocket(owner.boardId, laptop)
    const kept = addElement(client.doc, { kind: 'C', placement: 'shunt', value: 2.2e-12 })
    await waitUntil(() => client.provider.synced && !client.provider.ws?.bufferedAmount)

    expect((await api('POST', '/api/auth/logout-everywhere', { cookie: owner.cookie })).status).toBe(200)
    await waitUntil(() => client.closeCodes.includes(CLOSE_ACCESS_REVOKED), 3000, 'the socket to close')
    addElement(client.doc, { kind: 'L', placement: 'series', value: 4.7e-9 })
    await new Promise(r => setTimeout(r, 2500))

    const fresh = await signIn(baseUrl, owner.email, owner.password)
    expect(await storedElements(owner.boardId, fresh)).toEqual([kept])
    expect([401, 403]).toContain(await tryUpgrade(baseUrl, owner.boardId, { cookie: laptop }))
  })

  it('a password reset closes the sockets of every session', async () => {
    const owner = await accountWithBoard('Reset')
    const client = await openSocket(owner.boardId, owner.cookie)
    expect((await api('POST', '/api/auth/forgot', { body: { email: owner.email } })).status).toBe(200)
    const token = linkIn((await waitForMails(dbFile, owner.email))[0]!.text_body, '/reset/').split('/reset/')[1]!
    expect((await api('POST', '/api/auth/reset', { body: { token, password: 'another good password' } })).status).toBe(200)
    await waitUntil(() => client.closeCodes.includes(CLOSE_ACCESS_REVOKED), 3000, 'the socket to close')
    expect([401, 403]).toContain(await tryUpgrade(baseUrl, owner.boardId, { cookie: owner.cookie }))
  })

  it('plain sign-out revokes that session on the server and closes its socket; the other session stays', async () => {
    const owner = await accountWithBoard('Plain')
    const other = await signIn(baseUrl, owner.email, owner.password)
    const leaving = await openSocket(owner.boardId, owner.cookie)
    const staying = await openSocket(owner.boardId, other)

    expect((await api('POST', '/api/auth/logout', { cookie: owner.cookie })).status).toBe(200)
    await waitUntil(() => leaving.closeCodes.includes(CLOSE_ACCESS_REVOKED), 3000, 'the socket to close')
    // A copy of the signed-out cookie is refused everywhere, not only forgotten by the browser.
    expect((await api('GET', '/api/auth/me', { cookie: owner.cookie })).status).toBe(401)
    expect([401, 403]).toContain(await tryUpgrade(baseUrl, owner.boardId, { cookie: owner.cookie }))

    expect((await api('GET', '/api/auth/me', { cookie: other })).status).toBe(200)
    expect(staying.closeCodes).toEqual([])
    const id = addElement(staying.doc, { kind: 'R', placement: 'series', value: 50 })
    await waitUntil(() => readBoard(staying.doc).elements.length === 1)
    await new Promise(r => setTimeout(r, 2500))
    expect(await storedElements(owner.boardId, other)).toEqual([id])
  })
})

describe('session lifetime', () => {
  it('a session lives 7 days from its last use, is extended by use, and is refused once expired', async () => {
    const owner = await accountWithBoard('Lifetime')
    const row = await newestSession(owner.id)
    expect(Date.parse(row.expires_at) - Date.parse(row.created_at)).toBeCloseTo(7 * DAY_MS, -4)

    // Last extended two minutes ago, one hour left: the next request extends it to 7 days again.
    const twoMinutesAgo = new Date(Date.now() - 120_000).toISOString().replace('T', ' ').replace('Z', ' +00:00')
    const inAnHour = new Date(Date.now() + 3600_000).toISOString().replace('T', ' ').replace('Z', ' +00:00')
    await writeDb(dbFile, 'UPDATE sessions SET updated_at = ?, expires_at = ? WHERE id = ?', [twoMinutesAgo, inAnHour, row.id])
    expect((await api('GET', '/api/auth/me', { cookie: owner.cookie })).status).toBe(200)
    const extended = await newestSession(owner.id)
    expect(Date.parse(extended.expires_at) - Date.now()).toBeGreaterThan(6.9 * DAY_MS)

    await writeDb(dbFile, 'UPDATE sessions SET expires_at = ? WHERE id = ?', ['2000-01-01 00:00:00.000 +00:00', row.id])
    expect((await api('GET', '/api/auth/me', { cookie: owner.cookie })).status).toBe(401)
    expect([401, 403]).toContain(await tryUpgrade(baseUrl, owner.boardId, { cookie: owner.cookie }))
  })

  it('is never extended past 30 days after sign-in', async () => {
    const owner = await accountWithBoard('Capped')
    const row = await newestSession(owner.id)
    const signedIn = new Date(Date.now() - 29.5 * DAY_MS).toISOString().replace('T', ' ').replace('Z', ' +00:00')
    await writeDb(dbFile, 'UPDATE sessions SET created_at = ?, updated_at = ? WHERE id = ?', [signedIn, signedIn, row.id])
    expect((await api('GET', '/api/auth/me', { cookie: owner.cookie })).status).toBe(200)
    const capped = await newestSession(owner.id)
    expect(Date.parse(capped.expires_at) - Date.now()).toBeLessThan(0.6 * DAY_MS)
  })
})

describe('deleting an open board', () => {
  it('closes its sockets, and the board cannot be reopened', async () => {
    const owner = await accountWithBoard('Deleter')
    const client = await openSocket(owner.boardId, owner.cookie)
    expect((await api('DELETE', `/api/boards/${owner.boardId}`, { cookie: owner.cookie })).status).toBe(200)
    await waitUntil(() => client.closeCodes.includes(CLOSE_BOARD_GONE), 3000, 'the socket to close')
    expect([403, 404]).toContain(await tryUpgrade(baseUrl, owner.boardId, { cookie: owner.cookie }))
    expect((await api('GET', `/api/boards/${owner.boardId}`, { cookie: owner.cookie })).status).toBe(404)
  })
})
