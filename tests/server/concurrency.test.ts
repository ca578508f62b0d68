// Parallel requests that race on the same rows: sign-in guesses against the limit, sign-ups,
// invitation accepts and admins demoting each other. Each must end as if the requests had come one
// after another, and never answer 500. Runs its own server: the guesses lock accounts and addresses.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../support/server'
import { apiClient, postFrom } from '../support/api'
import { linkIn, mailsTo, queryDb } from '../support/db'

let server: RunningServer
let api: ReturnType<typeof apiClient>

beforeAll(async () => {
  server = await startServer()
  api = apiClient(server.url)
})
afterAll(async () => {
  await server?.stop()
})

let serial = 0
const uniqueEmail = (who: string) => `${who.replace(/\W+/g, '-')}-${Date.now()}-${++serial}@race.example`
const tally = (statuses: number[]) => statuses.reduce<Record<number, number>>((t, s) => ({ ...t, [s]: (t[s] ?? 0) + 1 }), {})

async function signUp(name: string, email = uniqueEmail(name.toLowerCase())) {
  const res = await api('POST', '/api/auth/signup', { body: { name, email, password: 'a good long password' } })
  expect(res.status).toBe(201)
  return { email, password: 'a good long password', cookie: res.cookie, workspace: res.json.workspace.slug as string, id: res.json.user.id as number }
}

describe('the sign-in limit under parallel guesses', () => {
  it('checks only 10 of 40 parallel wrong guesses at one account (from 40 addresses); the right password then waits', async () => {
    const target = await signUp('Target')
    const statuses = await Promise.all(Array.from({ length: 40 }, (_, i) =>
      postFrom(server.url, `127.0.1.${i + 1}`, '/api/auth/login', { email: target.email, password: `wrong guess ${i}` })))
    expect(tally(statuses)).toEqual({ 401: 10, 429: 30 })
    expect(await postFrom(server.url, '127.0.1.99', '/api/auth/login', { email: target.email, password: target.password })).toBe(429)
  })

  it('a right password among 30 parallel guesses is refused once the 10 reservations are taken', async () => {
    const target = await signUp('Guessed')
    const statuses = await Promise.all(Array.from({ length: 30 }, (_, i) =>
      postFrom(server.url, `127.0.2.${i + 1}`, '/api/auth/login', { email: target.email, password: i === 27 ? target.password : `guess ${i}` })))
    const checked = statuses.filter(s => s !== 429)
    expect(checked).toHaveLength(10)
    expect(statuses.filter(s => s === 429)).toHaveLength(20)
    // Whether guess 28 was among the ten checked is up to scheduling; it never passes beyond them.
    expect(statuses.every(s => [200, 401, 429].includes(s))).toBe(true)
  })

  it('checks only 10 of 40 parallel guesses from one address at 40 different accounts', async () => {
    const statuses = await Promise.all(Array.from({ length: 40 }, (_, i) =>
      postFrom(server.url, '127.0.3.1', '/api/auth/login', { email: uniqueEmail(`spray${i}`), password: 'spray' })))
    expect(tally(statuses)).toEqual({ 401: 10, 429: 30 })
    const [row] = await queryDb<{ n: number }>(server.dbFile, "SELECT COUNT(*) AS n FROM login_failures WHERE scope = 'address' AND key LIKE '%127.0.3.1'")
    expect(row!.n).toBe(10)
  })

  it('a successful sign-in is not held against its address', async () => {
    const user = await signUp('Regular')
    for (let i = 0; i < 12; i++) {
      expect(await postFrom(server.url, '127.0.4.1', '/api/auth/login', { email: user.email, password: user.password })).toBe(200)
    }
  })
})

describe('parallel writes through SQLite transactions', () => {
  it('10 parallel sign-ups all succeed, each with its own account and workspace', async () => {
    const emails = Array.from({ length: 10 }, (_, i) => uniqueEmail(`crowd${i}`))
    const answers = await Promise.all(emails.map((email, i) => api('POST', '/api/auth/signup', { body: { name: `Crowd ${i}`, email, password: 'a good long password' } })))
    expect(answers.map(a => a.status)).toEqual(Array(10).fill(201))
    const slugs = new Set(answers.map(a => a.json.workspace.slug))
    expect(slugs.size).toBe(10)
    const rows = await queryDb<{ n: number }>(server.dbFile, `SELECT COUNT(*) AS n FROM users WHERE email IN (${emails.map(() => '?').join(',')})`, emails)
    expect(rows[0]!.n).toBe(10)
  })

  it('10 parallel sign-ups with one address make exactly one account', async () => {
    const email = uniqueEmail('same')
    const answers = await Promise.all(Array.from({ length: 10 }, (_, i) =>
      api('POST', '/api/auth/signup', { body: { name: `Same ${i}`, email, password: 'a good long password' } })))
    expect(answers.every(a => a.status < 500)).toBe(true)
    const rows = await queryDb<{ n: number }>(server.dbFile, 'SELECT COUNT(*) AS n FROM users WHERE email = ?', [email])
    expect(rows[0]!.n).toBe(1)
  })

  it('five parallel accepts of one invitation: one joins, four are told the link is used', async () => {
    const admin = await signUp('Host')
    const email = uniqueEmail('guest')
    expect((await api('POST', `/api/workspaces/${admin.workspace}/invitations`, { cookie: admin.cookie, body: { email, role: 'designer' } })).status).toBe(201)
    const token = linkIn((await mailsTo(server.dbFile, email))[0]!.text_body, '/invite/').split('/invite/')[1]!
    const guest = await signUp('Guest', email)
    const answers = await Promise.all(Array.from({ length: 5 }, () => api('POST', `/api/invitations/${token}/accept`, { cookie: guest.cookie })))
    expect(answers.map(a => a.status).sort()).toEqual([200, 404, 404, 404, 404])
    const rows = await queryDb<{ role: string }>(server.dbFile,
      'SELECT m.role FROM memberships m JOIN workspaces w ON w.id = m.workspace_id WHERE w.slug = ? AND m.user_id = ?', [admin.workspace, guest.id])
    expect(rows).toEqual([{ role: 'designer' }])
  })

  it('parallel accepts of different invitations all succeed', async () => {
    const admin = await signUp('Many')
    const guests = await Promise.all(Array.from({ length: 5 }, (_, i) => signUp(`Invitee ${i}`)))
    const tokens: string[] = []
    for (const guest of guests) {
      expect((await api('POST', `/api/workspaces/${admin.workspace}/invitations`, { cookie: admin.cookie, body: { email: guest.email, role: 'reviewer' } })).status).toBe(201)
      tokens.push(linkIn((await mailsTo(server.dbFile, guest.email))[0]!.text_body, '/invite/').split('/invite/')[1]!)
    }
    const answers = await Promise.all(guests.map((guest, i) => api('POST', `/api/invitations/${tokens[i]}/accept`, { cookie: guest.cookie })))
    expect(answers.map(a => a.status)).toEqual(Array(5).fill(200))
  })

  it('two admins demoting each other at the same moment leave one admin, every time', async () => {
    for (let round = 0; round < 5; round++) {
      const first = await signUp(`First ${round}`)
      const second = await signUp(`Second ${round}`)
      await api('POST', `/api/workspaces/${first.workspace}/invitations`, { cookie: first.cookie, body: { email: second.email, role: 'admin' } })
      const token = linkIn((await mailsTo(server.dbFile, second.email))[0]!.text_body, '/invite/').split('/invite/')[1]!
      expect((await api('POST', `/api/invitations/${token}/accept`, { cookie: second.cookie })).status).toBe(200)
      const [a, b] = await Promise.all([
        api('PATCH', `/api/workspaces/${first.workspace}/members/${second.id}`, { cookie: first.cookie, body: { role: 'designer' } }),
        api('PATCH', `/api/workspaces/${first.workspace}/members/${first.id}`, { cookie: second.cookie, body: { role: 'designer' } }),
      ])
      // One demotion lands; the other admin is then the last one (422), or was already demoted (403).
      expect([a.status, b.status].filter(s => s === 200)).toHaveLength(1)
      expect([a.status, b.status].every(s => [200, 403, 422].includes(s))).toBe(true)
      const [row] = await queryDb<{ n: number }>(server.dbFile,
        "SELECT COUNT(*) AS n FROM memberships m JOIN workspaces w ON w.id = m.workspace_id WHERE w.slug = ? AND m.role = 'admin'", [first.workspace])
      expect(row!.n).toBe(1)
    }
  })
})
