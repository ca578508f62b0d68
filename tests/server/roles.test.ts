// Every API route called as each kind of caller; each cell's status is asserted. Rows are the
// routes, columns: anonymous, reviewer, designer (both of brackwater), admin of another workspace,
// admin of brackwater. What a caller may not see answers 404; what their role may not do, 403.
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { readFileSync } from 'node:fs'
import path from 'node:path'
import { DEMO_USERS, cookieFrom, signIn } from '../support/auth'
import { TOUCHSTONE_DIR } from '../support/reference'
import { linkIn, mailsTo } from '../support/db'

const baseUrl = inject('baseUrl')

type Persona = 'anonymous' | 'reviewer' | 'designer' | 'otherAdmin' | 'admin'
const PERSONAS: Persona[] = ['anonymous', 'reviewer', 'designer', 'otherAdmin', 'admin']
const cookies: Partial<Record<Persona, string>> = {}
let boardId = ''
let snapshotId = ''
let designerId = 0
let counter = 0
let designerSnapshotId = ''
let adminThreadId = ''

async function call(persona: Persona, method: string, path: string, body?: unknown) {
  const headers: Record<string, string> = {}
  if (cookies[persona]) headers.cookie = cookies[persona]!
  if (body !== undefined) headers['content-type'] = 'application/json'
  const controller = new AbortController()
  const res = await fetch(`${baseUrl}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: controller.signal })
  // An open event stream never ends: its status and headers are the answer.
  if (res.ok && res.headers.get('content-type')?.startsWith('text/event-stream')) {
    controller.abort()
    return { status: res.status, json: null }
  }
  const text = await res.text()
  // The CSV export answers text, everything else JSON.
  return { status: res.status, json: text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text || null }
}

/** A new invitation to brackwater for an address nobody has; answers the token from the mailed link. */
async function freshInvitation(): Promise<string> {
  const email = `invited-${++counter}-${Date.now()}@matrix.example`
  const res = await call('admin', 'POST', '/api/workspaces/brackwater/invitations', { email, role: 'reviewer' })
  expect(res.status).toBe(201)
  const [mail] = await mailsTo(inject('dbFile'), email)
  return linkIn(mail!.text_body, '/invite/').split('/invite/')[1]!
}

/** A new thread on the matrix board written by `persona`; answers its id. */
async function newThread(persona: Persona): Promise<string> {
  const res = await call(persona, 'POST', `/api/boards/${boardId}/comments`, { body: `matrix thread ${++counter}`, anchor: { kind: 'frequency', hz: 915e6 } })
  expect(res.status).toBe(201)
  return res.json.id
}

async function newBoard(name: string): Promise<string> {
  const res = await call('admin', 'POST', '/api/boards', { workspace: 'brackwater', name })
  expect(res.status).toBe(201)
  return res.json.id
}

beforeAll(async () => {
  cookies.reviewer = await signIn(baseUrl, DEMO_USERS.reviewer.email, DEMO_USERS.reviewer.password)
  cookies.designer = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  cookies.admin = await signIn(baseUrl, DEMO_USERS.admin.email, DEMO_USERS.admin.password)
  const signup = await fetch(`${baseUrl}/api/auth/signup`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ name: 'Olga Outsider', email: `olga-${Date.now()}@elsewhere.example`, password: 'outsider-password' }),
  })
  expect(signup.status).toBe(201)
  cookies.otherAdmin = cookieFrom(signup)
  // A board of our own, so restores and deletes never touch the demo boards other tests read.
  boardId = await newBoard('Role matrix board')
  const snap = await call('admin', 'POST', `/api/boards/${boardId}/snapshots`, { label: 'matrix snapshot' })
  snapshotId = snap.json.id
  const members = await call('admin', 'GET', '/api/workspaces/brackwater/members')
  designerId = members.json.find((m: { email: string }) => m.email === DEMO_USERS.designer.email).userId
  designerSnapshotId = (await call('designer', 'POST', `/api/boards/${boardId}/snapshots`, { label: 'designer snapshot' })).json.id
  adminThreadId = await newThread('admin')
})

interface Row {
  route: string
  method: string
  /** The path (and body) for one call; called per cell so destructive routes get a fresh target. */
  request: () => Promise<{ path: string, body?: unknown }> | { path: string, body?: unknown }
  expected: Record<Persona, number>
}

const row = (anonymous: number, reviewer: number, designer: number, otherAdmin: number, admin: number) =>
  ({ anonymous, reviewer, designer, otherAdmin, admin })

const ROWS: Row[] = [
  { route: 'GET /api/auth/me', method: 'GET', request: () => ({ path: '/api/auth/me' }), expected: row(401, 200, 200, 200, 200) },
  { route: 'GET /api/workspaces', method: 'GET', request: () => ({ path: '/api/workspaces' }), expected: row(401, 200, 200, 200, 200) },
  { route: 'GET /api/workspaces/:slug', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater' }), expected: row(401, 200, 200, 404, 200) },
  { route: 'GET /api/workspaces/:slug/members', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater/members' }), expected: row(401, 200, 200, 404, 200) },
  {
    route: 'PATCH /api/workspaces/:slug/members/:userId', method: 'PATCH',
    request: () => ({ path: `/api/workspaces/brackwater/members/${designerId}`, body: { role: 'designer' } }),
    expected: row(401, 403, 403, 404, 200),
  },
  {
    route: 'DELETE /api/workspaces/:slug/members/:userId (someone else, not a member)', method: 'DELETE',
    request: () => ({ path: '/api/workspaces/brackwater/members/999999' }),
    expected: row(401, 403, 403, 404, 404),
  },
  { route: 'GET /api/workspaces/:slug/invitations', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater/invitations' }), expected: row(401, 403, 403, 404, 200) },
  {
    route: 'POST /api/workspaces/:slug/invitations', method: 'POST',
    request: () => ({ path: '/api/workspaces/brackwater/invitations', body: { email: `invitee-${++counter}@matrix.example`, role: 'reviewer' } }),
    expected: row(401, 403, 403, 404, 201),
  },
  { route: 'GET /api/workspaces/:slug/templates', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater/templates' }), expected: row(401, 200, 200, 404, 200) },
  { route: 'GET /api/workspaces/:slug/outbox', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater/outbox' }), expected: row(401, 403, 403, 404, 200) },
  { route: 'GET /api/boards?workspace=', method: 'GET', request: () => ({ path: '/api/boards?workspace=brackwater' }), expected: row(401, 200, 200, 404, 200) },
  {
    route: 'POST /api/boards', method: 'POST',
    request: () => ({ path: '/api/boards', body: { workspace: 'brackwater', name: `Matrix created ${++counter}` } }),
    expected: row(401, 403, 201, 404, 201),
  },
  { route: 'GET /api/boards/:id', method: 'GET', request: () => ({ path: `/api/boards/${boardId}` }), expected: row(401, 200, 200, 404, 200) },
  { route: 'PATCH /api/boards/:id', method: 'PATCH', request: () => ({ path: `/api/boards/${boardId}`, body: { name: 'Role matrix board, renamed' } }), expected: row(401, 403, 200, 404, 200) },
  {
    route: 'DELETE /api/boards/:id', method: 'DELETE',
    request: async () => ({ path: `/api/boards/${await newBoard(`Doomed ${++counter}`)}` }),
    expected: row(401, 403, 200, 404, 200),
  },
  { route: 'GET /api/boards/:id/snapshots', method: 'GET', request: () => ({ path: `/api/boards/${boardId}/snapshots` }), expected: row(401, 200, 200, 404, 200) },
  { route: 'POST /api/boards/:id/snapshots', method: 'POST', request: () => ({ path: `/api/boards/${boardId}/snapshots`, body: { label: 'cell snapshot' } }), expected: row(401, 201, 201, 404, 201) },
  { route: 'GET /api/snapshots/:id', method: 'GET', request: () => ({ path: `/api/snapshots/${snapshotId}` }), expected: row(401, 200, 200, 404, 200) },
  { route: 'POST /api/snapshots/:id/restore', method: 'POST', request: () => ({ path: `/api/snapshots/${snapshotId}/restore` }), expected: row(401, 403, 200, 404, 200) },
  { route: 'POST /api/snapshots/:id/publish', method: 'POST', request: () => ({ path: `/api/snapshots/${snapshotId}/publish`, body: { name: 'Matrix template' } }), expected: row(401, 403, 403, 404, 201) },
  {
    route: 'POST /api/snapshots/:id/share', method: 'POST',
    request: () => ({ path: `/api/snapshots/${snapshotId}/share`, body: { email: DEMO_USERS.reviewer.email } }),
    expected: row(401, 200, 200, 404, 200),
  },
  { route: 'GET /api/boards/:id/comments', method: 'GET', request: () => ({ path: `/api/boards/${boardId}/comments` }), expected: row(401, 200, 200, 404, 200) },
  {
    route: 'POST /api/boards/:id/comments', method: 'POST',
    request: () => ({ path: `/api/boards/${boardId}/comments`, body: { body: 'Is this point inside the spec?', anchor: { kind: 'point', gamma: { re: 0.1, im: -0.2 } } } }),
    expected: row(401, 201, 201, 404, 201),
  },
  { route: 'GET /api/boards/:id/review-events (event stream)', method: 'GET', request: () => ({ path: `/api/boards/${boardId}/review-events` }), expected: row(401, 200, 200, 404, 200) },
  { route: 'POST /api/comments/:id/replies', method: 'POST', request: () => ({ path: `/api/comments/${adminThreadId}/replies`, body: { body: 'A reply.' } }), expected: row(401, 201, 201, 404, 201) },
  { route: 'POST /api/comments/:id/resolve (an admin\'s thread)', method: 'POST', request: async () => ({ path: `/api/comments/${await newThread('admin')}/resolve` }), expected: row(401, 403, 200, 404, 200) },
  { route: 'POST /api/comments/:id/resolve (a reviewer\'s own thread)', method: 'POST', request: async () => ({ path: `/api/comments/${await newThread('reviewer')}/resolve` }), expected: row(401, 200, 200, 404, 200) },
  { route: 'POST /api/comments/:id/reopen (an admin\'s thread)', method: 'POST', request: () => ({ path: `/api/comments/${adminThreadId}/reopen` }), expected: row(401, 403, 200, 404, 200) },
  { route: 'PATCH /api/comments/:id (an admin\'s comment)', method: 'PATCH', request: () => ({ path: `/api/comments/${adminThreadId}`, body: { body: 'Edited text.' } }), expected: row(401, 403, 403, 404, 200) },
  { route: 'DELETE /api/comments/:id (a designer\'s thread)', method: 'DELETE', request: async () => ({ path: `/api/comments/${await newThread('designer')}` }), expected: row(401, 403, 200, 404, 200) },
  { route: 'POST /api/snapshots/:id/verdict (an admin\'s snapshot)', method: 'POST', request: () => ({ path: `/api/snapshots/${snapshotId}/verdict`, body: { verdict: 'approved' } }), expected: row(401, 201, 403, 404, 403) },
  { route: 'POST /api/snapshots/:id/verdict (a designer\'s snapshot)', method: 'POST', request: () => ({ path: `/api/snapshots/${designerSnapshotId}/verdict`, body: { verdict: 'changes-requested', note: 'Check the shunt C rating.' } }), expected: row(401, 201, 403, 404, 201) },
  {
    route: 'GET /api/invitations/:token (open; the link is the secret)', method: 'GET',
    request: async () => ({ path: `/api/invitations/${await freshInvitation()}` }),
    expected: row(200, 200, 200, 200, 200),
  },
  {
    route: 'POST /api/invitations/:token/accept (sent to another address)', method: 'POST',
    request: async () => ({ path: `/api/invitations/${await freshInvitation()}/accept` }),
    expected: row(401, 403, 403, 403, 403),
  },
  {
    route: 'POST /api/auth/signup (through an invitation, with another address)', method: 'POST',
    request: async () => ({ path: '/api/auth/signup', body: { name: 'Forwarded', email: `forwarded-${++counter}@matrix.example`, password: 'long enough', invitation: await freshInvitation() } }),
    expected: row(403, 403, 403, 403, 403),
  },
  {
    route: 'POST /api/invitations/:token/accept (unknown token)', method: 'POST',
    request: () => ({ path: '/api/invitations/unknown-token-unknown-token-0000/accept' }),
    expected: row(401, 404, 404, 404, 404),
  },
  { route: 'GET /api/workspaces/:slug/parts', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater/parts' }), expected: row(401, 200, 200, 404, 200) },
  {
    route: 'POST /api/workspaces/:slug/parts', method: 'POST',
    request: () => ({ path: '/api/workspaces/brackwater/parts', body: { partId: `MATRIX-L-${++counter}`, kind: 'L', value: 3.3e-9, stocked: true } }),
    expected: row(401, 403, 201, 404, 201),
  },
  {
    route: 'PATCH /api/workspaces/:slug/parts/:partId', method: 'PATCH',
    request: async () => {
      const partId = `MATRIX-P-${++counter}`
      expect((await call('admin', 'POST', '/api/workspaces/brackwater/parts', { partId, kind: 'C', value: 1e-12 })).status).toBe(201)
      return { path: `/api/workspaces/brackwater/parts/${partId}`, body: { partId, kind: 'C', value: 1.2e-12, stocked: true } }
    },
    expected: row(401, 403, 200, 404, 200),
  },
  {
    route: 'DELETE /api/workspaces/:slug/parts/:partId', method: 'DELETE',
    request: async () => {
      const partId = `MATRIX-D-${++counter}`
      expect((await call('admin', 'POST', '/api/workspaces/brackwater/parts', { partId, kind: 'C', value: 1e-12 })).status).toBe(201)
      return { path: `/api/workspaces/brackwater/parts/${partId}` }
    },
    expected: row(401, 403, 200, 404, 200),
  },
  {
    route: 'POST /api/workspaces/:slug/parts/import', method: 'POST',
    request: () => ({ path: '/api/workspaces/brackwater/parts/import', body: { csv: `part_id,kind,value\nMATRIX-I-${++counter},L,4.7n\n` } }),
    expected: row(401, 403, 200, 404, 200),
  },
  { route: 'GET /api/workspaces/:slug/parts/export', method: 'GET', request: () => ({ path: '/api/workspaces/brackwater/parts/export' }), expected: row(401, 200, 200, 404, 200) },
  {
    route: 'POST /api/rf/search',
    method: 'POST',
    request: () => ({ path: '/api/rf/search', body: { z0: 50, frequencies: [902e6, 915e6, 928e6], load: { re: 18, im: -32 }, series: 'E12', maxElements: 1 } }),
    expected: row(401, 200, 200, 200, 200),
  },
]

describe('role matrix', () => {
  for (const r of ROWS) {
    it(r.route, async () => {
      const got: Record<string, number> = {}
      for (const persona of PERSONAS) {
        const { path, body } = await r.request()
        const res = await call(persona, r.method, path, body)
        got[persona] = res.status
        if (res.status >= 400) expect(typeof res.json?.message === 'string' && res.json.message.length > 0).toBe(true)
      }
      expect(got).toEqual(r.expected)
    })
  }

  it('POST /api/boards/:id/uploads and GET /api/uploads/:id', async () => {
    // Multipart, so outside the JSON rows: a measured antenna file from the reference fixtures.
    const text = readFileSync(path.join(TOUCHSTONE_DIR, 'antenna_ri_mhz.s1p'), 'utf8')
    const upload = async (persona: Persona) => {
      const form = new FormData()
      form.append('file', new Blob([text], { type: 'text/plain' }), 'antenna_ri_mhz.s1p')
      const headers: Record<string, string> = cookies[persona] ? { cookie: cookies[persona]! } : {}
      const res = await fetch(`${baseUrl}/api/boards/${boardId}/uploads`, { method: 'POST', headers, body: form })
      return { status: res.status, json: await res.json() }
    }
    const posted: Record<string, number> = {}
    let uploadId = ''
    for (const persona of PERSONAS) {
      const res = await upload(persona)
      posted[persona] = res.status
      if (res.status === 201) uploadId = res.json.id
      else expect(res.json.message.length).toBeGreaterThan(0)
    }
    expect(posted).toEqual(row(401, 403, 201, 404, 201))
    const read: Record<string, number> = {}
    for (const persona of PERSONAS) read[persona] = (await call(persona, 'GET', `/api/uploads/${uploadId}`)).status
    expect(read).toEqual(row(401, 200, 200, 404, 200))
  })

  it('a reviewer may take a snapshot but the board does not change', async () => {
    const before = await call('admin', 'GET', `/api/boards/${boardId}`)
    const res = await call('reviewer', 'POST', `/api/boards/${boardId}/snapshots`, { label: 'reviewer look' })
    expect(res.status).toBe(201)
    expect(res.json.author.name).toBe(DEMO_USERS.reviewer.name)
    const after = await call('admin', 'GET', `/api/boards/${boardId}`)
    expect(after.json.elements).toEqual(before.json.elements)
  })

  // Last: signing out revokes each persona's session on the server, so their cookies stop working.
  it('POST /api/auth/logout', async () => {
    const got: Record<string, number> = {}
    for (const persona of PERSONAS) got[persona] = (await call(persona, 'POST', '/api/auth/logout')).status
    expect(got).toEqual(row(200, 200, 200, 200, 200))
    const after: Record<string, number> = {}
    for (const persona of PERSONAS) after[persona] = (await call(persona, 'GET', '/api/auth/me')).status
    expect(after).toEqual(row(401, 401, 401, 401, 401))
  })
})
