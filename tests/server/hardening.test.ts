// Smaller hardening points, each against a real server of its own (the throttles here must not
// lock other files out): mailed links never come from request headers, unknown API paths answer
// JSON, forgotten-password requests are throttled and alike for every address, a reset uses up
// every outstanding link, and odd inputs answer 4xx, never 500.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../support/server'
import { apiClient, postFrom } from '../support/api'
import { linkIn, mailsTo, waitForMails } from '../support/db'

let server: RunningServer
let api: ReturnType<typeof apiClient>

beforeAll(async () => {
  server = await startServer({ env: { GAMMABOARD_PUBLIC_URL: 'https://boards.brackwater.example' } })
  api = apiClient(server.url)
})
afterAll(async () => {
  await server?.stop()
})

let serial = 0
const uniqueEmail = (who: string) => `${who}-${Date.now()}-${++serial}@harden.example`

async function signUp(name: string, email = uniqueEmail(name.toLowerCase())) {
  const res = await api('POST', '/api/auth/signup', { body: { name, email, password: 'a good long password' } })
  expect(res.status).toBe(201)
  return { email, cookie: res.cookie, workspace: res.json.workspace.slug as string, id: res.json.user.id as number }
}

describe('mailed links', () => {
  it('come from GAMMABOARD_PUBLIC_URL, never from a forged Host or X-Forwarded-Host', async () => {
    const user = await signUp('Victim')
    const forged = { 'host': 'attacker.example', 'x-forwarded-host': 'attacker.example', 'x-forwarded-proto': 'https' }
    expect((await api('POST', '/api/auth/forgot', { body: { email: user.email }, headers: forged })).status).toBe(200)
    const [reset] = await waitForMails(server.dbFile, user.email)
    expect(linkIn(reset!.text_body, '/reset/')).toMatch(/^https:\/\/boards\.brackwater\.example\/reset\//)
    expect(reset!.text_body + reset!.html_body).not.toContain('attacker.example')

    const invitee = uniqueEmail('invitee')
    const invited = await api('POST', `/api/workspaces/${user.workspace}/invitations`, { cookie: user.cookie, body: { email: invitee, role: 'reviewer' }, headers: forged })
    expect(invited.status).toBe(201)
    const [invitation] = await mailsTo(server.dbFile, invitee)
    expect(linkIn(invitation!.text_body, '/invite/')).toMatch(/^https:\/\/boards\.brackwater\.example\/invite\//)
  })

  it('without GAMMABOARD_PUBLIC_URL the server refuses to mail links, alike for every address, and says what to set', async () => {
    const bare = await startServer({ env: { GAMMABOARD_PUBLIC_URL: '' } })
    try {
      const bareApi = apiClient(bare.url)
      const signup = await bareApi('POST', '/api/auth/signup', { body: { name: 'Bare', email: 'bare@harden.example', password: 'a good long password' } })
      expect(signup.status).toBe(201)
      const known = await bareApi('POST', '/api/auth/forgot', { body: { email: 'bare@harden.example' } })
      const unknown = await bareApi('POST', '/api/auth/forgot', { body: { email: 'nobody@harden.example' } })
      expect(known.status).toBe(503)
      expect(known.json.message).toMatch(/GAMMABOARD_PUBLIC_URL/)
      expect(unknown.json).toEqual(known.json)
      const invite = await bareApi('POST', `/api/workspaces/${signup.json.workspace.slug}/invitations`, { cookie: signup.cookie, body: { email: 'x@harden.example', role: 'reviewer' } })
      expect(invite.status).toBe(503)
      await new Promise(r => setTimeout(r, 300))
      expect(await mailsTo(bare.dbFile, 'harden.example')).toEqual([])
    }
    finally {
      await bare.stop()
    }
  })
})

describe('unknown API paths', () => {
  it.each([
    ['GET', '/api/nothing-here'],
    ['POST', '/api/nothing-here'],
    ['GET', '/api/boards/x/y/z'],
    ['DELETE', '/api/auth/me/extra'],
  ])('%s %s answers a JSON 404, never a redirect to the sign-in page', async (method, path) => {
    const res = await fetch(`${server.url}${path}`, { method, redirect: 'manual' })
    expect(res.status).toBe(404)
    expect(res.headers.get('content-type')).toMatch(/application\/json/)
    const body = await res.json() as { statusCode: number, message: string }
    expect(body.statusCode).toBe(404)
    expect(body.message.length).toBeGreaterThan(0)
  })
})

describe('forgotten password', () => {
  it('answers alike for an address with and without an account', async () => {
    const user = await signUp('Alike')
    const known = await postFrom(server.url, '127.0.5.1', '/api/auth/forgot', { email: user.email })
    const unknown = await postFrom(server.url, '127.0.5.1', '/api/auth/forgot', { email: uniqueEmail('ghost') })
    expect([known, unknown]).toEqual([200, 200])
    await waitForMails(server.dbFile, user.email)
  })

  it('throttles requests: 3 per address asked for, 20 per client, in 15 minutes', async () => {
    const user = await signUp('Flooded')
    const forAccount = []
    for (let i = 0; i < 6; i++) forAccount.push(await postFrom(server.url, `127.0.6.${i + 1}`, '/api/auth/forgot', { email: user.email }))
    expect(forAccount).toEqual([200, 200, 200, 429, 429, 429])
    expect(await waitForMails(server.dbFile, user.email, 3)).toHaveLength(3)

    const fromOneClient = await Promise.all(Array.from({ length: 30 }, (_, i) =>
      postFrom(server.url, '127.0.7.1', '/api/auth/forgot', { email: uniqueEmail(`spray${i}`) })))
    expect(fromOneClient.filter(s => s === 200)).toHaveLength(20)
    expect(fromOneClient.filter(s => s === 429)).toHaveLength(10)
  })

  it('a reset uses up every outstanding link of the account', async () => {
    const user = await signUp('Outstanding')
    for (let i = 0; i < 2; i++) await postFrom(server.url, '127.0.8.1', '/api/auth/forgot', { email: user.email })
    const mails = await waitForMails(server.dbFile, user.email, 2)
    const [newer, older] = mails.map(m => linkIn(m.text_body, '/reset/').split('/reset/')[1]!)
    expect((await api('POST', '/api/auth/reset', { body: { token: newer, password: 'the chosen new password' } })).status).toBe(200)
    const stale = await api('POST', '/api/auth/reset', { body: { token: older, password: 'an attacker password' } })
    expect(stale.status).toBe(400)
    expect((await postFrom(server.url, '127.0.8.2', '/api/auth/login', { email: user.email, password: 'the chosen new password' }))).toBe(200)
  })
})

describe('odd inputs answer 4xx, never 500', () => {
  it('a NUL in the sign-in e-mail is a 400', async () => {
    const res = await postFrom(server.url, '127.0.9.1', '/api/auth/login', { email: 'mara\u0000@brackwater.example', password: 'whatever it is' })
    expect(res).toBe(400)
  })

  it('names and labels refuse NUL, control characters and lone surrogates', async () => {
    const user = await signUp('Namer')
    for (const name of ['nul\u0000inside', 'lone \ud800 high', 'lone \udc00 low', 'bell\u0007']) {
      const signup = await api('POST', '/api/auth/signup', { body: { name, email: uniqueEmail('odd'), password: 'a good long password' } })
      expect(signup.status, JSON.stringify(name)).toBe(400)
      expect(signup.json.message).toMatch(/name/)
      const board = await api('POST', '/api/boards', { cookie: user.cookie, body: { workspace: user.workspace, name } })
      expect(board.status, JSON.stringify(name)).toBe(400)
    }
    const board = await api('POST', '/api/boards', { cookie: user.cookie, body: { workspace: user.workspace, name: 'Proper board \u{1F4E1}' } })
    expect(board.status).toBe(201)
    expect((await api('POST', `/api/boards/${board.json.id}/snapshots`, { cookie: user.cookie, body: { label: 'cut\u0000' } })).status).toBe(400)
    expect((await api('POST', `/api/boards/${board.json.id}/snapshots`, { cookie: user.cookie, body: { label: 'half \udfff' } })).status).toBe(400)
  })

  it('member ids are plain digits: 0x3, " 3" and 3e0 are refused', async () => {
    const user = await signUp('Counter')
    for (const id of ['0x3', '%203', '3e0', '03', '-3']) {
      const res = await api('PATCH', `/api/workspaces/${user.workspace}/members/${id}`, { cookie: user.cookie, body: { role: 'designer' } })
      expect(res.status, id).toBe(400)
      expect(res.json.message).toMatch(/userId/)
    }
  })

  it('the 404 for another workspace\'s upload does not name that workspace', async () => {
    const owner = await signUp('Uploader')
    const board = await api('POST', '/api/boards', { cookie: owner.cookie, body: { workspace: owner.workspace, name: 'Measured' } })
    const form = new FormData()
    form.append('file', new Blob(['# Hz S RI R 50\n1e9 0.2 -0.1\n2e9 0.25 -0.05\n'], { type: 'text/plain' }), 'probe.s1p')
    const uploaded = await fetch(`${server.url}/api/boards/${board.json.id}/uploads`, { method: 'POST', headers: { cookie: owner.cookie }, body: form })
    expect(uploaded.status).toBe(201)
    const { id } = await uploaded.json() as { id: string }
    const outsider = await signUp('Outsider')
    const res = await api('GET', `/api/uploads/${id}`, { cookie: outsider.cookie })
    expect(res.status).toBe(404)
    expect(res.json.message).not.toContain(owner.workspace)
    const missing = await api('GET', '/api/uploads/00000000-0000-4000-8000-000000000000', { cookie: outsider.cookie })
    expect(missing.json.message.replace(/[0-9a-f-]{36}/, 'ID')).toBe(res.json.message.replace(/[0-9a-f-]{36}/, 'ID'))
  })

  it('solve-stub with z0 = 1e308 answers a 4xx, never NaN', async () => {
    const res = await fetch(`${server.url}/api/rf/solve-stub`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ z0: 1e308, frequency: 1e9, load: { re: 25, im: -10 }, end: 'short' }),
    })
    const text = await res.text()
    expect(res.status).toBeGreaterThanOrEqual(400)
    expect(res.status).toBeLessThan(500)
    expect(text).not.toMatch(/NaN/)
  })

  it('a 100 KB query string answers a JSON 414', async () => {
    const res = await fetch(`${server.url}/api/health?q=${'x'.repeat(100_000)}`)
    expect(res.status).toBe(414)
    expect((await res.json() as { message: string }).message).toMatch(/too long/)
    // The server is fine afterwards.
    expect((await fetch(`${server.url}/api/health`)).status).toBe(200)
  })
})
