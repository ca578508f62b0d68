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
  server = await startServer({ env: { GAMMABOARD_PUBLIC_URL: 'https://boards.kestrel.example' } })
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
    expect(linkIn(reset!.text_body, '/reset/')).toMatch(/^https:\/\/boards\.kestrel\.example\/reset\//)
    expect(reset!.text_body + reset!.html_body).not.toContain('attacker.example')

    const invitee = uniqueEmail('invitee')
    const invited = await api('POST', `/api/workspaces/${user.workspace}/invitations`, { cookie: user.cookie, body: { email: invitee, role: 'reviewer' }, headers: forged })
    expect(invited.status).toBe(201)
    const [invitation] = await mailsTo(server.dbFile, invitee)
    expect(linkIn(invitation!.text_body, '/invite/')).toMatch(/^https:\/\/boards\.kestrel\.example\/invite\//)
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
