// Roles and refusals on the real server: reviewers read and show presence but cannot change the
// document; upgrades without a valid session, from a foreign Origin or by non-members are refused.
import { afterEach, beforeAll, describe, expect, inject, it } from 'vitest'
import * as Y from 'yjs'
import { readBoard } from '../../shared/board/ydoc'
import { addElement, updateElement } from '../../shared/board/ops'
import { readPresence } from '../../shared/live/presence'
import { cookieFrom } from '../support/auth'
import { connectLive, DEMO_BOARD_ID, tryUpgrade, waitUntil, whenSynced } from '../support/live-client'
import { b64, clientPool, createBoard, signInAll } from './helpers'

const baseUrl = inject('baseUrl')
const pool = clientPool()
let cookies: Awaited<ReturnType<typeof signInAll>>

beforeAll(async () => { cookies = await signInAll(baseUrl) })
afterEach(() => pool.destroyAll())

async function storedBoard(boardId: string, cookie: string) {
  const res = await fetch(`${baseUrl}/api/boards/${boardId}`, { headers: { cookie } })
  expect(res.status).toBe(200)
  return await res.json() as { elements: { id: string, value?: number }[], updatedAt: string }
}

describe('reviewers on the live connection', () => {
  it('drops a reviewer\'s updates: server, peers and storage stay unchanged; presence still works', async () => {
    const boardId = await createBoard(baseUrl, cookies.designer, 'Reviewer drop')
    const designer = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.designer }))
    await whenSynced(designer)
    const id = addElement(designer.doc, { kind: 'C', placement: 'shunt', value: 3.3e-12 })
    // Wait until the designer's edit is stored, so a later write would show in updatedAt.
    let saved = await storedBoard(boardId, cookies.designer)
    const savedDeadline = Date.now() + 5000
    while (saved.elements.length !== 1 && Date.now() < savedDeadline) {
      await new Promise(r => setTimeout(r, 200))
      saved = await storedBoard(boardId, cookies.designer)
    }
    await new Promise(r => setTimeout(r, 2500))
    const before = await storedBoard(boardId, cookies.designer)

    const reviewer = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.reviewer }))
    await whenSynced(reviewer)
    await waitUntil(() => reviewer.notices.length > 0)
    expect(reviewer.notices[0]).toMatchObject({ readOnly: true, role: 'reviewer' })
    expect(readBoard(reviewer.doc).elements.map(e => e.id)).toEqual([id])
    const designerVector = b64(Y.encodeStateVector(designer.doc))

    updateElement(reviewer.doc, id, { value: 9.1e-12 })
    addElement(reviewer.doc, { kind: 'R', placement: 'series', value: 1000 })
    reviewer.provider.awareness.setLocalStateField('pointer', { re: -0.25, im: 0.4 })
    await waitUntil(() => reviewer.notices.some(n => n.dropped), 5000, 'drop notice')
    await waitUntil(() => [...designer.provider.awareness.getStates().values()]
      .some(s => readPresence(s)?.user.name === 'Ines Halvorsen' && readPresence(s)?.pointer?.im === 0.4), 5000, 'reviewer presence')
    await new Promise(r => setTimeout(r, 2500))
    expect(b64(Y.encodeStateVector(designer.doc))).toBe(designerVector)
    expect(readBoard(designer.doc).elements).toEqual([expect.objectContaining({ id, value: 3.3e-12 })])
    // The server's live document (GET answers from it while the room is open) and the stored row.
    const during = await storedBoard(boardId, cookies.designer)
    expect(during.elements).toEqual(before.elements)
    pool.destroyAll()
    await new Promise(r => setTimeout(r, 500))
    const after = await storedBoard(boardId, cookies.designer)
    expect(after.elements).toEqual(before.elements)
    expect(after.updatedAt).toBe(before.updatedAt)
  })

  it('refuses anonymous, tampered, foreign-Origin and non-member upgrades before the socket opens', async () => {
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, {})).toBe(401)
    const tampered = cookies.designer.replace(/=(.{8})/, (_m, head: string) => `=${head.split('').reverse().join('')}`)
    expect(tampered).not.toBe(cookies.designer)
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, { cookie: tampered })).toBe(401)
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, { cookie: cookies.designer, origin: 'http://127.0.0.1:1' })).toBe(403)
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, { cookie: cookies.designer, origin: 'https://evil.example' })).toBe(403)
    const signup = await fetch(`${baseUrl}/api/auth/signup`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'Outside Person', email: `outside-${Date.now()}@example.test`, password: 'outside-person-password' }),
    })
    expect(signup.status).toBe(201)
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, { cookie: cookieFrom(signup) })).toBe(403)
    expect(await tryUpgrade(baseUrl, 'no-such-board', { cookie: cookies.designer })).toBe(403)
    // The same session from our own Origin, and without one (a non-browser client), is let in.
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, { cookie: cookies.designer, origin: baseUrl })).toBe('open')
    expect(await tryUpgrade(baseUrl, DEMO_BOARD_ID, { cookie: cookies.reviewer })).toBe('open')
  })
})
