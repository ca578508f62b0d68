// Review on the real server: threads with anchors (an element anchor follows the element when the
// ladder is reordered and says so once it is removed), replies, edits, deletes, resolve/reopen,
// bad input (400 naming the field), mentions mailed through the catcher, verdicts on snapshots,
// and the event stream that tells open browsers a thread changed.
import { afterEach, beforeAll, describe, expect, inject, it } from 'vitest'
import { addElement, moveElement, removeElement } from '../../shared/board/ops'
import { DEMO_USERS } from '../support/auth'
import { mailsTo } from '../support/db'
import { connectLive, waitUntil, whenSynced } from '../support/live-client'
import { clientPool, createBoard, signInAll } from '../live/helpers'

const baseUrl = inject('baseUrl')
const pool = clientPool()
let cookies: Awaited<ReturnType<typeof signInAll>>
let boardId = ''

async function api(cookie: string, method: string, path: string, body?: unknown) {
  const res = await fetch(`${baseUrl}${path}`, {
    method, headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  const text = await res.text()
  return { status: res.status, json: text ? JSON.parse(text) : null }
}

const threads = async () => (await api(cookies.reviewer, 'GET', `/api/boards/${boardId}/comments`)).json as any[]

beforeAll(async () => {
  cookies = await signInAll(baseUrl)
  boardId = await createBoard(baseUrl, cookies.designer, 'Review threads')
})
afterEach(() => pool.destroyAll())

describe('comments and threads', () => {
  it('a reviewer pins a question to a chart point; the designer replies and resolves it; the reviewer reopens it', async () => {
    const posted = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/comments`, { body: 'Why stop short of the centre here?', anchor: { kind: 'point', gamma: { re: 0.2, im: -0.1 } } })
    expect(posted.status).toBe(201)
    expect(posted.json).toMatchObject({ body: 'Why stop short of the centre here?', anchor: { kind: 'point', gamma: { re: 0.2, im: -0.1 } }, resolved: false, author: { name: DEMO_USERS.reviewer.name }, replies: [] })
    const id = posted.json.id
    const reply = await api(cookies.designer, 'POST', `/api/comments/${id}/replies`, { body: 'The band edge needs the margin.' })
    expect(reply.status).toBe(201)
    // A reply to the reply joins the same thread.
    expect((await api(cookies.reviewer, 'POST', `/api/comments/${reply.json.id}/replies`, { body: 'Fair.' })).status).toBe(201)
    expect((await api(cookies.designer, 'POST', `/api/comments/${id}/resolve`)).json.resolved).toBe(true)
    let thread = (await threads()).find(t => t.id === id)
    expect(thread.resolved).toBe(true)
    expect(thread.resolvedBy.name).toBe(DEMO_USERS.designer.name)
    expect(thread.replies.map((r: any) => [r.body, r.authorName])).toEqual([['The band edge needs the margin.', DEMO_USERS.designer.name], ['Fair.', DEMO_USERS.reviewer.name]])
    expect((await api(cookies.reviewer, 'POST', `/api/comments/${id}/reopen`)).json.resolved).toBe(false)
    expect((await api(cookies.reviewer, 'POST', `/api/comments/${reply.json.id}/resolve`)).status).toBe(400)
    thread = (await threads()).find(t => t.id === id)
    expect(thread.resolved).toBe(false)
  })

  it('an element anchor follows the element when the ladder is reordered, and says so when it is removed', async () => {
    const designer = pool.track(connectLive(baseUrl, boardId, { cookie: cookies.designer }))
    await whenSynced(designer)
    addElement(designer.doc, { kind: 'C', placement: 'shunt', value: 3.3e-12 })
    const inductor = addElement(designer.doc, { kind: 'L', placement: 'series', value: 8.2e-9 })
    // The REST view reads the live room, so wait until the server has both elements.
    const deadline = Date.now() + 5000
    while ((await api(cookies.designer, 'GET', `/api/boards/${boardId}`)).json.elements.length < 2 && Date.now() < deadline) await new Promise(r => setTimeout(r, 20))
    const posted = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/comments`, { body: 'Is 8.2 nH in stock?', anchor: { kind: 'element', elementId: inductor } })
    expect(posted.status).toBe(201)
    expect(posted.json.elementIndex).toBe(1)
    moveElement(designer.doc, inductor, 0)
    await expect.poll(async () => (await threads()).find(t => t.id === posted.json.id).elementIndex).toBe(0)
    removeElement(designer.doc, inductor)
    await expect.poll(async () => (await threads()).find(t => t.id === posted.json.id).elementRemoved).toBe(true)
    expect((await threads()).find(t => t.id === posted.json.id).elementIndex).toBeNull()
  })

  it('authors edit their own comments; admins delete anyone\'s, a thread taking its replies with it', async () => {
    const posted = await api(cookies.designer, 'POST', `/api/boards/${boardId}/comments`, { body: 'Frequency note', anchor: { kind: 'frequency', hz: 928e6 } })
    const id = posted.json.id
    await api(cookies.reviewer, 'POST', `/api/comments/${id}/replies`, { body: 'Seen.' })
    const edited = await api(cookies.designer, 'PATCH', `/api/comments/${id}`, { body: 'Frequency note, upper band edge' })
    expect(edited.status).toBe(200)
    expect(edited.json.body).toBe('Frequency note, upper band edge')
    expect(edited.json.editedAt).not.toBeNull()
    expect((await api(cookies.reviewer, 'PATCH', `/api/comments/${id}`, { body: 'not mine' })).status).toBe(403)
    expect((await api(cookies.reviewer, 'DELETE', `/api/comments/${id}`)).status).toBe(403)
    expect((await api(cookies.admin, 'DELETE', `/api/comments/${id}`)).status).toBe(200)
    expect((await threads()).some(t => t.id === id)).toBe(false)
    expect((await api(cookies.admin, 'DELETE', `/api/comments/${id}`)).status).toBe(404)
  })

  it.each([
    [{ body: '' }, 'body'],
    [{ body: '   ' }, 'body'],
    [{ body: 'x'.repeat(4001) }, 'body'],
    [{ body: 42 }, 'body'],
    [{ body: 'ok', anchor: { kind: 'point', gamma: { re: 1.2, im: 0 } } }, 'anchor.gamma'],
    [{ body: 'ok', anchor: { kind: 'point', gamma: { re: 'a', im: 0 } } }, 'anchor.gamma.re'],
    [{ body: 'ok', anchor: { kind: 'frequency', hz: -5 } }, 'anchor.hz'],
    [{ body: 'ok', anchor: { kind: 'element', elementId: 'no-such-element' } }, 'anchor.elementId'],
    [{ body: 'ok', anchor: { kind: 'somewhere' } }, 'anchor'],
  ])('POST %j answers 400 naming %s', async (body, field) => {
    const res = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/comments`, body)
    expect(res.status).toBe(400)
    expect(res.json.message).toContain(field)
  })

  it('accepts 4000 characters and keeps markup as plain text', async () => {
    const body = `<img src=x onerror="alert(1)">${'y'.repeat(3970)}`.slice(0, 4000)
    const res = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/comments`, { body })
    expect(res.status).toBe(201)
    expect(res.json.body).toBe(body)
  })

  it('answers 404 for a comment that does not exist', async () => {
    expect((await api(cookies.admin, 'POST', '/api/comments/00000000-0000-4000-8000-000000000000/replies', { body: 'hello' })).status).toBe(404)
  })
})

describe('mentions', () => {
  it('mails a mentioned member a link that opens the board at the thread; others get nothing', async () => {
    const before = (await mailsTo(inject('dbFile'), DEMO_USERS.designer.email)).length
    const adminBefore = (await mailsTo(inject('dbFile'), DEMO_USERS.admin.email)).length
    const posted = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/comments`, { body: `@${DEMO_USERS.designer.name} can you check the shunt C? (@Nobody Here is not a member)` })
    expect(posted.status).toBe(201)
    await expect.poll(async () => (await mailsTo(inject('dbFile'), DEMO_USERS.designer.email)).length).toBe(before + 1)
    const [mail] = await mailsTo(inject('dbFile'), DEMO_USERS.designer.email)
    expect(mail!.kind).toBe('comment-mention')
    expect(mail!.text_body).toContain('can you check the shunt C?')
    expect(mail!.text_body).toContain(`/boards/${boardId}?comment=${posted.json.id}`)
    expect((await mailsTo(inject('dbFile'), DEMO_USERS.admin.email)).length).toBe(adminBefore)
  })
})

describe('verdicts', () => {
  it('a reviewer approves a designer\'s snapshot; GET snapshots shows it with the giver\'s name; authors and designers may not', async () => {
    const snap = await api(cookies.designer, 'POST', `/api/boards/${boardId}/snapshots`, { label: 'Ready to order' })
    const id = snap.json.id
    expect((await api(cookies.designer, 'POST', `/api/snapshots/${id}/verdict`, { verdict: 'approved' })).status).toBe(403)
    expect((await api(cookies.reviewer, 'POST', `/api/snapshots/${id}/verdict`, { verdict: 'maybe' })).status).toBe(400)
    const given = await api(cookies.reviewer, 'POST', `/api/snapshots/${id}/verdict`, { verdict: 'approved', note: 'Parts in stock.' })
    expect(given.status).toBe(201)
    const own = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/snapshots`, { label: 'reviewer snapshot' })
    expect((await api(cookies.reviewer, 'POST', `/api/snapshots/${own.json.id}/verdict`, { verdict: 'approved' })).status).toBe(403)
    const list = (await api(cookies.designer, 'GET', `/api/boards/${boardId}/snapshots`)).json as any[]
    const shown = list.find(s => s.id === id)
    expect(shown.verdicts).toHaveLength(1)
    expect(shown.verdicts[0]).toMatchObject({ verdict: 'approved', note: 'Parts in stock.', giverName: DEMO_USERS.reviewer.name, giver: { name: DEMO_USERS.reviewer.name } })
    expect(Number.isNaN(Date.parse(shown.verdicts[0].createdAt))).toBe(false)
  })
})

describe('the review event stream', () => {
  it('tells an open listener about a new comment', async () => {
    const controller = new AbortController()
    const res = await fetch(`${baseUrl}/api/boards/${boardId}/review-events`, { headers: { cookie: cookies.designer }, signal: controller.signal })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toContain('text/event-stream')
    const reader = res.body!.getReader()
    let text = ''
    const read = (async () => {
      while (!text.includes('event: review')) {
        const { value, done } = await reader.read()
        if (done) break
        text += new TextDecoder().decode(value)
      }
    })()
    await waitUntil(() => text.includes('event: ready'), 5000, 'ready').catch(() => {})
    const posted = await api(cookies.reviewer, 'POST', `/api/boards/${boardId}/comments`, { body: 'Pushed?' })
    await read
    controller.abort()
    expect(text).toContain('event: review')
    expect(text).toContain(posted.json.id)
  })
})
