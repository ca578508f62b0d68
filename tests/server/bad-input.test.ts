// Bad input for every route: missing fields, wrong types, over-long names, unknown ids and
// malformed JSON each get a 4xx with a message, and no table gains or loses a row.
import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { DEMO_USERS, signIn } from '../support/auth'
import { rowCounts } from '../support/db'

const baseUrl = inject('baseUrl')
const dbFile = inject('dbFile')
let cookie = ''
let boardId = ''
let snapshotId = ''
let adminId = 0

const long = (n: number) => 'x'.repeat(n)
const MALFORMED = '{"name": "unfinished'

interface Case { name: string, method: string, path: () => string, body?: unknown, raw?: string, status: number }

const CASES: Case[] = [
  // sign-in and account forms
  { name: 'login: malformed JSON', method: 'POST', path: () => '/api/auth/login', raw: MALFORMED, status: 400 },
  { name: 'login: missing password', method: 'POST', path: () => '/api/auth/login', body: { email: 'a@b.example' }, status: 400 },
  { name: 'login: email of the wrong type', method: 'POST', path: () => '/api/auth/login', body: { email: 42, password: 'x' }, status: 400 },
  { name: 'login: over-long email', method: 'POST', path: () => '/api/auth/login', body: { email: `${long(300)}@b.example`, password: 'x' }, status: 400 },
  { name: 'signup: missing name', method: 'POST', path: () => '/api/auth/signup', body: { email: 'new1@b.example', password: 'long enough' }, status: 400 },
  { name: 'signup: name of 121 characters', method: 'POST', path: () => '/api/auth/signup', body: { name: long(121), email: 'new2@b.example', password: 'long enough' }, status: 400 },
  { name: 'signup: blank name', method: 'POST', path: () => '/api/auth/signup', body: { name: '   ', email: 'new3@b.example', password: 'long enough' }, status: 400 },
  { name: 'signup: not an e-mail address', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', email: 'nope', password: 'long enough' }, status: 400 },
  { name: 'signup: short password', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', email: 'new4@b.example', password: 'short' }, status: 400 },
  { name: 'signup: workspace name of 121 characters', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', email: 'new5@b.example', password: 'long enough', workspaceName: long(121) }, status: 400 },
  { name: 'signup: address already has an account', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', email: DEMO_USERS.admin.email, password: 'long enough' }, status: 422 },
  { name: 'signup: malformed JSON', method: 'POST', path: () => '/api/auth/signup', raw: MALFORMED, status: 400 },
  { name: 'signup: no e-mail and no invitation', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', password: 'long enough' }, status: 400 },
  { name: 'signup: unknown invitation token', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', password: 'long enough', invitation: 'b'.repeat(43) }, status: 404 },
  { name: 'signup: invitation token of the wrong type', method: 'POST', path: () => '/api/auth/signup', body: { name: 'N', email: 'new6@b.example', password: 'long enough', invitation: 7 }, status: 400 },
  { name: 'forgot: missing email', method: 'POST', path: () => '/api/auth/forgot', body: {}, status: 400 },
  { name: 'forgot: not an e-mail address', method: 'POST', path: () => '/api/auth/forgot', body: { email: 'nobody' }, status: 400 },
  { name: 'reset: missing token', method: 'POST', path: () => '/api/auth/reset', body: { password: 'long enough' }, status: 400 },
  { name: 'reset: unknown token', method: 'POST', path: () => '/api/auth/reset', body: { token: 'a'.repeat(43), password: 'long enough' }, status: 400 },
  { name: 'reset: short password', method: 'POST', path: () => '/api/auth/reset', body: { token: 'a'.repeat(43), password: 'short' }, status: 400 },
  // workspaces
  { name: 'workspace: malformed slug', method: 'GET', path: () => '/api/workspaces/Not%20A%20Slug!', status: 400 },
  { name: 'workspace: unknown slug', method: 'GET', path: () => '/api/workspaces/no-such-team', status: 404 },
  { name: 'invite: unknown role', method: 'POST', path: () => '/api/workspaces/brackwater/invitations', body: { email: 'x@y.example', role: 'boss' }, status: 400 },
  { name: 'invite: missing email', method: 'POST', path: () => '/api/workspaces/brackwater/invitations', body: { role: 'reviewer' }, status: 400 },
  { name: 'invite: malformed JSON', method: 'POST', path: () => '/api/workspaces/brackwater/invitations', raw: MALFORMED, status: 400 },
  { name: 'invite: already a member', method: 'POST', path: () => '/api/workspaces/brackwater/invitations', body: { email: DEMO_USERS.designer.email, role: 'admin' }, status: 422 },
  { name: 'invite: unknown workspace', method: 'POST', path: () => '/api/workspaces/no-such-team/invitations', body: { email: 'x@y.example', role: 'reviewer' }, status: 404 },
  { name: 'member role: unknown role', method: 'PATCH', path: () => `/api/workspaces/brackwater/members/${adminId}`, body: { role: 'boss' }, status: 400 },
  { name: 'member role: user id not a number', method: 'PATCH', path: () => '/api/workspaces/brackwater/members/abc', body: { role: 'reviewer' }, status: 400 },
  { name: 'member role: unknown member', method: 'PATCH', path: () => '/api/workspaces/brackwater/members/999999', body: { role: 'reviewer' }, status: 404 },
  { name: 'member role: the last admin demoted', method: 'PATCH', path: () => `/api/workspaces/brackwater/members/${adminId}`, body: { role: 'designer' }, status: 422 },
  { name: 'member removal: user id not a number', method: 'DELETE', path: () => '/api/workspaces/brackwater/members/abc', status: 400 },
  { name: 'member removal: the last admin leaves', method: 'DELETE', path: () => `/api/workspaces/brackwater/members/${adminId}`, status: 422 },
  { name: 'templates: unknown workspace', method: 'GET', path: () => '/api/workspaces/no-such-team/templates', status: 404 },
  { name: 'outbox: unknown workspace', method: 'GET', path: () => '/api/workspaces/no-such-team/outbox', status: 404 },
  // boards
  { name: 'board list: missing workspace', method: 'GET', path: () => '/api/boards', status: 400 },
  { name: 'board list: unknown workspace', method: 'GET', path: () => '/api/boards?workspace=no-such-team', status: 404 },
  { name: 'new board: missing name', method: 'POST', path: () => '/api/boards', body: { workspace: 'brackwater' }, status: 400 },
  { name: 'new board: name of 121 characters', method: 'POST', path: () => '/api/boards', body: { workspace: 'brackwater', name: long(121) }, status: 400 },
  { name: 'new board: name of the wrong type', method: 'POST', path: () => '/api/boards', body: { workspace: 'brackwater', name: 7 }, status: 400 },
  { name: 'new board: malformed template id', method: 'POST', path: () => '/api/boards', body: { workspace: 'brackwater', name: 'B', templateId: 'nope' }, status: 400 },
  { name: 'new board: unknown template', method: 'POST', path: () => '/api/boards', body: { workspace: 'brackwater', name: 'B', templateId: randomUUID() }, status: 404 },
  { name: 'new board: unknown workspace', method: 'POST', path: () => '/api/boards', body: { workspace: 'no-such-team', name: 'B' }, status: 404 },
  { name: 'new board: malformed JSON', method: 'POST', path: () => '/api/boards', raw: MALFORMED, status: 400 },
  { name: 'board: unknown id', method: 'GET', path: () => '/api/boards/no-such-board', status: 404 },
  { name: 'rename: name of 121 characters', method: 'PATCH', path: () => `/api/boards/${boardId}`, body: { name: long(121) }, status: 400 },
  { name: 'rename: missing name', method: 'PATCH', path: () => `/api/boards/${boardId}`, body: {}, status: 400 },
  { name: 'rename: unknown board', method: 'PATCH', path: () => '/api/boards/no-such-board', body: { name: 'N' }, status: 404 },
  { name: 'delete: unknown board', method: 'DELETE', path: () => '/api/boards/no-such-board', status: 404 },
  // snapshots and templates
  { name: 'snapshot list: unknown board', method: 'GET', path: () => '/api/boards/no-such-board/snapshots', status: 404 },
  { name: 'take snapshot: missing label', method: 'POST', path: () => `/api/boards/${boardId}/snapshots`, body: {}, status: 400 },
  { name: 'take snapshot: label of 121 characters', method: 'POST', path: () => `/api/boards/${boardId}/snapshots`, body: { label: long(121) }, status: 400 },
  { name: 'take snapshot: label of the wrong type', method: 'POST', path: () => `/api/boards/${boardId}/snapshots`, body: { label: ['a'] }, status: 400 },
  { name: 'take snapshot: malformed JSON', method: 'POST', path: () => `/api/boards/${boardId}/snapshots`, raw: MALFORMED, status: 400 },
  { name: 'take snapshot: unknown board', method: 'POST', path: () => '/api/boards/no-such-board/snapshots', body: { label: 'L' }, status: 404 },
  { name: 'snapshot: malformed id', method: 'GET', path: () => '/api/snapshots/not-a-uuid', status: 400 },
  { name: 'snapshot: unknown id', method: 'GET', path: () => `/api/snapshots/${randomUUID()}`, status: 404 },
  { name: 'restore: unknown snapshot', method: 'POST', path: () => `/api/snapshots/${randomUUID()}/restore`, status: 404 },
  { name: 'publish: name of 121 characters', method: 'POST', path: () => `/api/snapshots/${snapshotId}/publish`, body: { name: long(121) }, status: 400 },
  { name: 'publish: unknown snapshot', method: 'POST', path: () => `/api/snapshots/${randomUUID()}/publish`, body: {}, status: 404 },
  { name: 'share: not an e-mail address', method: 'POST', path: () => `/api/snapshots/${snapshotId}/share`, body: { email: 'nobody' }, status: 400 },
  { name: 'share: someone outside the workspace', method: 'POST', path: () => `/api/snapshots/${snapshotId}/share`, body: { email: 'outsider@else.example' }, status: 422 },
  // invitations
  { name: 'invitation: malformed token', method: 'GET', path: () => '/api/invitations/short', status: 400 },
  { name: 'invitation: unknown token', method: 'GET', path: () => `/api/invitations/${'b'.repeat(43)}`, status: 404 },
  { name: 'accept: unknown token', method: 'POST', path: () => `/api/invitations/${'b'.repeat(43)}/accept`, status: 404 },
]

async function send(c: Case) {
  const headers: Record<string, string> = { cookie }
  let body: string | undefined
  if (c.raw !== undefined || c.body !== undefined) {
    headers['content-type'] = 'application/json'
    body = c.raw ?? JSON.stringify(c.body)
  }
  const res = await fetch(`${baseUrl}${c.path()}`, { method: c.method, headers, body })
  return { status: res.status, json: await res.json() as { statusCode: number, message: string } }
}

describe('bad input', () => {
  beforeAll(async () => {
    cookie = await signIn(baseUrl, DEMO_USERS.admin.email, DEMO_USERS.admin.password)
    const me = await fetch(`${baseUrl}/api/auth/me`, { headers: { cookie } })
    adminId = (await me.json()).user.id
    const board = await fetch(`${baseUrl}/api/boards`, {
      method: 'POST', headers: { cookie, 'content-type': 'application/json' },
      body: JSON.stringify({ workspace: 'brackwater', name: 'Bad input target' }),
    })
    boardId = (await board.json()).id
    const snap = await fetch(`${baseUrl}/api/boards/${boardId}/snapshots`, {
      method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify({ label: 'target' }),
    })
    snapshotId = (await snap.json()).id
  })

  it.each(CASES.map(c => [c.name, c] as const))('%s', async (_name, c) => {
    const before = await rowCounts(dbFile)
    const { status, json } = await send(c)
    expect(status).toBe(c.status)
    expect(json.statusCode).toBe(c.status)
    expect(json.message.length).toBeGreaterThan(0)
    expect(await rowCounts(dbFile)).toEqual(before)
  })

  it('names the offending field in a validation message', async () => {
    const { json } = await send({ name: '', method: 'POST', path: () => '/api/boards', body: { workspace: 'brackwater', name: long(121) }, status: 400 })
    expect(json.message).toMatch(/name: must be at most 120 characters/)
  })

  it('accepts a name of exactly 120 characters (the boundary)', async () => {
    const before = await rowCounts(dbFile)
    const res = await fetch(`${baseUrl}/api/boards`, {
      method: 'POST', headers: { cookie, 'content-type': 'application/json' },
      body: JSON.stringify({ workspace: 'brackwater', name: long(120) }),
    })
    expect(res.status).toBe(201)
    expect((await res.json()).name).toBe(long(120))
    expect((await rowCounts(dbFile)).boards).toBe(before.boards + 1)
  })
})
