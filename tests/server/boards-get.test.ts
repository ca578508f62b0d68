import { beforeAll, describe, expect, inject, it } from 'vitest'
import { DEMO_BOARDS } from '../../shared/board/demo-boards'
import { DEMO_USERS, signIn } from '../support/auth'

const baseUrl = inject('baseUrl')
// The boards are the demo workspace's: a member must be signed in to read them.
let headers: Record<string, string> = {}

describe('GET /api/boards/:id', () => {
  beforeAll(async () => {
    headers = { cookie: await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password) }
  })

  it.each(DEMO_BOARDS.map(b => b.id))('serves demo board %s with its settings and elements', async (id) => {
    const res = await fetch(`${baseUrl}/api/boards/${id}`, { headers })
    expect(res.status).toBe(200)
    const body = await res.json()
    const demo = DEMO_BOARDS.find(b => b.id === id)!
    expect(body.id).toBe(id)
    expect(body.workspace).toBe('brackwater')
    expect(body.name).toBe(demo.name)
    expect(body.settings).toEqual(demo.settings)
    expect(body.elements).toEqual(demo.elements)
    expect(Number.isNaN(Date.parse(body.updatedAt))).toBe(false)
  })

  it('answers 404 JSON with a message for an unknown id', async () => {
    const res = await fetch(`${baseUrl}/api/boards/no-such-board`, { headers })
    expect(res.status).toBe(404)
    const body = await res.json()
    expect(body.statusCode).toBe(404)
    expect(body.message).toMatch(/no-such-board/)
  })

  it('answers 400 naming the id for a malformed id', async () => {
    const res = await fetch(`${baseUrl}/api/boards/${encodeURIComponent('bad id!')}`, { headers })
    expect(res.status).toBe(400)
    const body = await res.json()
    expect(body.message).toMatch(/id/)
  })
})

describe('default Q of new boards', () => {
  beforeAll(async () => {
    headers = { cookie: await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password) }
  })
  async function create(body: Record<string, unknown>) {
    const res = await fetch(`${baseUrl}/api/boards`, {
      method: 'POST', headers: { ...headers, 'content-type': 'application/json' }, body: JSON.stringify({ workspace: 'brackwater', ...body }),
    })
    expect(res.status).toBe(201)
    const created = await res.json()
    return (await (await fetch(`${baseUrl}/api/boards/${created.id}`, { headers })).json()).settings
  }

  it('a blank board starts with finite Q for L and C (typical chip parts, common practice)', async () => {
    expect((await create({ name: 'Blank with default Q' })).defaultQ).toEqual({ L: 40, C: 200 })
  })

  it('a board from a template keeps the template\'s settings (the seeded one has no default Q)', async () => {
    const templates = await (await fetch(`${baseUrl}/api/workspaces/brackwater/templates`, { headers })).json() as { id: string, name: string }[]
    // The template the demo seed publishes from the first demo board.
    const seeded = templates.find(t => t.name === '915 MHz chip antenna, series L + shunt C')!
    const settings = await create({ name: 'From the seeded template', templateId: seeded.id })
    expect(settings.defaultQ).toBeUndefined()
    expect(settings).toEqual(DEMO_BOARDS[0]!.settings)
  })
})
