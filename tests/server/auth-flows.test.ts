// Sign-up, sign-in, sign-out, password reset and invitations end to end, with the mails read from
// the local catcher's outbox table; tokens are single-use and expire; sign-in is rate limited.
// Runs its own server: the failed sign-ins here must not lock other test files out.
import { execFile } from 'node:child_process'
import { promisify } from 'node:util'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../support/server'
import { apiClient, postFrom as sharedPostFrom } from '../support/api'
import { linkIn, mailsTo, waitForMails, queryDb, writeDb } from '../support/db'
import { databaseEnv } from '../support/services'

let server: RunningServer
let base = ''

beforeAll(async () => {
  server = await startServer()
  base = server.url
})
afterAll(async () => {
  await server?.stop()
})

const api: ReturnType<typeof apiClient> = (...args) => apiClient(base)(...args)

let serial = 0
const uniqueEmail = (who: string) => `${who}-${Date.now()}-${++serial}@flows.example`

async function signUp(name: string, email = uniqueEmail(name.toLowerCase()), password = 'a good long password') {
  const res = await api('POST', '/api/auth/signup', { body: { name, email, password } })
  expect(res.status).toBe(201)
  return { email, password, cookie: res.cookie, workspace: res.json.workspace.slug as string, id: res.json.user.id as number }
}

const postFrom = (localAddress: string, path: string, body: unknown, extraHeaders: Record<string, string> = {}) =>
  sharedPostFrom(base, localAddress, path, body, extraHeaders)

describe('sign-up, sign-in and sign-out', () => {
  it('signs up into a personal workspace, signs out, and signs back in', async () => {
    const user = await signUp('Petra')
    const me = await api('GET', '/api/auth/me', { cookie: user.cookie })
    expect(me.status).toBe(200)
    expect(me.json.workspaces).toEqual([{ slug: user.workspace, name: "Petra's boards", role: 'admin' }])

    const out = await api('POST', '/api/auth/logout', { cookie: user.cookie })
    expect(out.status).toBe(200)
    // The browser is told to forget the cookie; what it sends next carries no session.
    expect(out.res.headers.getSetCookie().join(';')).toMatch(/nuxt-session=;|Max-Age=0/i)
    expect((await api('GET', '/api/auth/me', { cookie: out.cookie })).status).toBe(401)

    const back = await api('POST', '/api/auth/login', { body: { email: user.email.toUpperCase(), password: user.password } })
    expect(back.status).toBe(200)
    expect(back.json.workspaces[0].slug).toBe(user.workspace)
  })

  it('stores a scrypt hash, never the password', async () => {
    const user = await signUp('Hashed')
    const [row] = await queryDb<{ password_hash: string }>(server.dbFile, 'SELECT password_hash FROM users WHERE email = ?', [user.email])
    expect(row!.password_hash.startsWith('$scrypt$')).toBe(true)
    expect(row!.password_hash).not.toContain(user.password)
  })

  it('gives one vague message for an unknown address and for a wrong password', async () => {
    const user = await signUp('Vague')
    const wrong = await api('POST', '/api/auth/login', { body: { email: user.email, password: 'not the password' } })
    const unknown = await api('POST', '/api/auth/login', { body: { email: uniqueEmail('ghost'), password: 'whatever it is' } })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.json.message).toBe(unknown.json.message)
    // Whatever cookie a failure leaves carries no user.
    expect((await api('GET', '/api/auth/me', { cookie: wrong.cookie })).status).toBe(401)
  })

  it('sign-out everywhere ends every session of the account at once', async () => {
    const user = await signUp('Everywhere')
    const second = await api('POST', '/api/auth/login', { body: { email: user.email, password: user.password } })
    expect((await api('GET', '/api/auth/me', { cookie: second.cookie })).status).toBe(200)
    expect((await api('POST', '/api/auth/logout-everywhere', { cookie: user.cookie })).status).toBe(200)
    expect((await api('GET', '/api/auth/me', { cookie: second.cookie })).status).toBe(401)
    expect((await api('GET', `/api/workspaces/${user.workspace}`, { cookie: user.cookie })).status).toBe(401)
    // A fresh sign-in works again.
    const again = await api('POST', '/api/auth/login', { body: { email: user.email, password: user.password } })
    expect((await api('GET', '/api/auth/me', { cookie: again.cookie })).status).toBe(200)
  })

  it('refuses a second account with the same address', async () => {
    const user = await signUp('Twice')
    const res = await api('POST', '/api/auth/signup', { body: { name: 'Twice Again', email: user.email, password: 'another password' } })
    expect(res.status).toBe(422)
  })
})

describe('forgotten password', () => {
  it('mails a one-time link that sets a new password and ends older sessions', async () => {
    const user = await signUp('Forgetful')
    const answer = await api('POST', '/api/auth/forgot', { body: { email: user.email } })
    const ghost = await api('POST', '/api/auth/forgot', { body: { email: uniqueEmail('nobody') } })
    expect(answer.status).toBe(200)
    expect(ghost.json).toEqual(answer.json)

    const [mail] = await waitForMails(server.dbFile, user.email)
    expect(mail!.kind).toBe('password-reset')
    expect(mail!.workspace_id).toBeNull()
    expect(mail!.text_body).toMatch(/expires in 1 hour/)
    expect(mail!.html_body).toMatch(/<a href="http:\/\/127\.0\.0\.1:\d+\/reset\//)
    const token = linkIn(mail!.text_body, '/reset/').split('/reset/')[1]!

    const reset = await api('POST', '/api/auth/reset', { body: { token, password: 'a brand new password' } })
    expect(reset.status).toBe(200)
    expect((await api('GET', '/api/auth/me', { cookie: reset.cookie })).status).toBe(200)
    expect((await api('GET', '/api/auth/me', { cookie: user.cookie })).status).toBe(401)
    expect((await api('POST', '/api/auth/login', { body: { email: user.email, password: user.password } })).status).toBe(401)
    expect((await api('POST', '/api/auth/login', { body: { email: user.email, password: 'a brand new password' } })).status).toBe(200)

    const reuse = await api('POST', '/api/auth/reset', { body: { token, password: 'yet another password' } })
    expect(reuse.status).toBe(400)
    expect(reuse.json.message).toMatch(/invalid, already used or expired/)
  })

  it('refuses a link past its hour', async () => {
    const user = await signUp('Late')
    await api('POST', '/api/auth/forgot', { body: { email: user.email } })
    const token = linkIn((await waitForMails(server.dbFile, user.email))[0]!.text_body, '/reset/').split('/reset/')[1]!
    const [reset] = await queryDb<{ id: number, expires_at: string, created_at: string }>(server.dbFile,
      'SELECT r.id, r.expires_at, r.created_at FROM password_resets r JOIN users u ON u.id = r.user_id WHERE u.email = ?', [user.email])
    // Issued with one hour to live.
    expect(Date.parse(reset!.expires_at) - Date.parse(reset!.created_at)).toBeCloseTo(3600_000, -3)
    await writeDb(server.dbFile, 'UPDATE password_resets SET expires_at = ? WHERE id = ?', ['2000-01-01 00:00:00.000 +00:00', reset!.id])
    expect((await api('POST', '/api/auth/reset', { body: { token, password: 'too late password' } })).status).toBe(400)
    expect((await api('POST', '/api/auth/login', { body: { email: user.email, password: user.password } })).status).toBe(200)
  })
})

describe('invitations and membership', () => {
  async function invite(admin: { cookie: string, workspace: string }, email: string, role: string) {
    const res = await api('POST', `/api/workspaces/${admin.workspace}/invitations`, { cookie: admin.cookie, body: { email, role } })
    expect(res.status).toBe(201)
    const [mail] = await mailsTo(server.dbFile, email)
    return { mail: mail!, token: linkIn(mail!.text_body, '/invite/').split('/invite/')[1]! }
  }

  it('invites by mail; the invitee signs up, accepts once, and works with the invited role', async () => {
    const admin = await signUp('Ada')
    const email = uniqueEmail('newcomer')
    const { mail, token } = await invite(admin, email, 'designer')
    expect(mail.kind).toBe('invitation')
    expect(mail.subject).toBe("Join Ada's boards on Gammaboard")
    expect(mail.html_body).toContain('/invite/')

    // The admin reads it in the workspace outbox.
    const outbox = await api('GET', `/api/workspaces/${admin.workspace}/outbox`, { cookie: admin.cookie })
    expect(outbox.json.map((m: { to: string[] }) => m.to[0])).toContain(email)

    const preview = await api('GET', `/api/invitations/${token}`)
    expect(preview.status).toBe(200)
    expect(preview.json).toMatchObject({ email, role: 'designer', workspace: { slug: admin.workspace } })

    const newcomer = await signUp('Newcomer', email)
    const accepted = await api('POST', `/api/invitations/${token}/accept`, { cookie: newcomer.cookie })
    expect(accepted.status).toBe(200)
    expect(accepted.json.workspaces.map((w: { slug: string, role: string }) => [w.slug, w.role])).toContainEqual([admin.workspace, 'designer'])
    expect((await api('POST', `/api/invitations/${token}/accept`, { cookie: newcomer.cookie })).status).toBe(404)
    expect((await api('GET', `/api/invitations/${token}`)).status).toBe(404)

    const board = await api('POST', '/api/boards', { cookie: newcomer.cookie, body: { workspace: admin.workspace, name: 'Newcomer board' } })
    expect(board.status).toBe(201)

    // Demoted to reviewer: the next request is refused, no new sign-in needed.
    const demote = await api('PATCH', `/api/workspaces/${admin.workspace}/members/${newcomer.id}`, { cookie: admin.cookie, body: { role: 'reviewer' } })
    expect(demote.status).toBe(200)
    expect((await api('POST', '/api/boards', { cookie: newcomer.cookie, body: { workspace: admin.workspace, name: 'Not allowed' } })).status).toBe(403)
    expect((await api('PATCH', `/api/boards/${board.json.id}`, { cookie: newcomer.cookie, body: { name: 'Nope' } })).status).toBe(403)

    // Removed: the workspace and its boards vanish for them at once.
    expect((await api('DELETE', `/api/workspaces/${admin.workspace}/members/${newcomer.id}`, { cookie: admin.cookie })).status).toBe(200)
    expect((await api('GET', `/api/workspaces/${admin.workspace}`, { cookie: newcomer.cookie })).status).toBe(404)
    expect((await api('GET', `/api/boards/${board.json.id}`, { cookie: newcomer.cookie })).status).toBe(404)
  })

  it('an existing user accepts while signed in; the last admin can neither leave nor be demoted', async () => {
    const admin = await signUp('Bea')
    const colleague = await signUp('Cyd')
    const { token } = await invite(admin, colleague.email, 'admin')
    expect((await api('POST', `/api/invitations/${token}/accept`)).status).toBe(401)
    expect((await api('POST', `/api/invitations/${token}/accept`, { cookie: colleague.cookie })).status).toBe(200)

    const members = await api('GET', `/api/workspaces/${admin.workspace}/members`, { cookie: admin.cookie })
    expect(members.json.map((m: { email: string, role: string }) => [m.email, m.role])).toEqual([[admin.email, 'admin'], [colleague.email, 'admin']])

    // With two admins one may step down; then the other is the last and is held.
    expect((await api('PATCH', `/api/workspaces/${admin.workspace}/members/${colleague.id}`, { cookie: admin.cookie, body: { role: 'designer' } })).status).toBe(200)
    expect((await api('PATCH', `/api/workspaces/${admin.workspace}/members/${admin.id}`, { cookie: admin.cookie, body: { role: 'designer' } })).status).toBe(422)
    expect((await api('DELETE', `/api/workspaces/${admin.workspace}/members/${admin.id}`, { cookie: admin.cookie })).status).toBe(422)
    // Any member may leave.
    expect((await api('DELETE', `/api/workspaces/${admin.workspace}/members/${colleague.id}`, { cookie: colleague.cookie })).status).toBe(200)
  })

  it('refuses an invitation accepted by someone other than the invited address, and keeps it open for them', async () => {
    const admin = await signUp('Dov')
    const invitedEmail = uniqueEmail('invited')
    const { token } = await invite(admin, invitedEmail, 'designer')
    const bystander = await signUp('Bystander')
    const refused = await api('POST', `/api/invitations/${token}/accept`, { cookie: bystander.cookie })
    expect(refused.status).toBe(403)
    expect(refused.json.message).toMatch(/sent to another address/)
    expect((await api('GET', `/api/workspaces/${admin.workspace}`, { cookie: bystander.cookie })).status).toBe(404)
    // The invited person can still use the link.
    const invited = await signUp('Invited', invitedEmail)
    expect((await api('POST', `/api/invitations/${token}/accept`, { cookie: invited.cookie })).status).toBe(200)
  })

  it('signing up through an invitation takes the invited address and joins in one step', async () => {
    const admin = await signUp('Eda')
    const invitedEmail = uniqueEmail('Invited.Person')
    const { token } = await invite(admin, invitedEmail, 'reviewer')
    // Another address with the invitation token is refused, and no account is made.
    const usersBefore = (await queryDb<{ n: number }>(server.dbFile, 'SELECT COUNT(*) AS n FROM users'))[0]!.n
    const wrong = await api('POST', '/api/auth/signup', { body: { name: 'Forwarded', email: uniqueEmail('forwarded'), password: 'a good long password', invitation: token } })
    expect(wrong.status).toBe(403)
    expect(wrong.json.message).toMatch(/this invitation was sent to another address/i)
    expect((await queryDb<{ n: number }>(server.dbFile, 'SELECT COUNT(*) AS n FROM users'))[0]!.n).toBe(usersBefore)
    expect((await api('GET', `/api/invitations/${token}`)).status).toBe(200)

    // Without an e-mail of its own, the account gets the invited one (stored lower-cased).
    const joined = await api('POST', '/api/auth/signup', { body: { name: 'Invited Person', password: 'a good long password', invitation: token } })
    expect(joined.status).toBe(201)
    expect(joined.json.user.email).toBe(invitedEmail.toLowerCase())
    expect(joined.json.joined).toEqual({ slug: admin.workspace, name: "Eda's boards" })
    const me = await api('GET', '/api/auth/me', { cookie: joined.cookie })
    expect(me.json.workspaces.map((w: { slug: string, role: string }) => [w.slug, w.role])).toContainEqual([admin.workspace, 'reviewer'])
    // Used up: the link no longer opens.
    expect((await api('GET', `/api/invitations/${token}`)).status).toBe(404)
  })

  it('the invited address may be typed in another case when signing up through the invitation', async () => {
    const admin = await signUp('Fay')
    const invitedEmail = uniqueEmail('casey')
    const { token } = await invite(admin, invitedEmail, 'designer')
    const res = await api('POST', '/api/auth/signup', { body: { name: 'Casey', email: invitedEmail.toUpperCase(), password: 'a good long password', invitation: token } })
    expect(res.status).toBe(201)
    expect(res.json.user.email).toBe(invitedEmail)
    expect(res.json.joined.slug).toBe(admin.workspace)
  })

  it('refuses an expired invitation', async () => {
    const admin = await signUp('Dee')
    const email = uniqueEmail('slow')
    const { token } = await invite(admin, email, 'reviewer')
    await writeDb(server.dbFile, 'UPDATE invitations SET expires_at = ? WHERE email = ?', ['2000-01-01 00:00:00.000 +00:00', email])
    const invitee = await signUp('Slow', email)
    expect((await api('GET', `/api/invitations/${token}`)).status).toBe(404)
    expect((await api('POST', `/api/invitations/${token}/accept`, { cookie: invitee.cookie })).status).toBe(404)
  })
})

describe('operators', () => {
  it('a user made with `npm run admin -- user:add` signs in through the API', async () => {
    const email = uniqueEmail('operator')
    const { stdout } = await promisify(execFile)('npx', ['tsx', 'scripts/admin.ts', 'user:add', '--email', email, '--password', 'made on the command line',
      '--name', 'Olu Operator', '--workspace', 'ops-bench', '--role', 'designer'], { env: { ...process.env, ...databaseEnv(server.dbFile) } })
    expect(stdout).toMatch(/created workspace ops-bench/)
    const login = await api('POST', '/api/auth/login', { body: { email, password: 'made on the command line' } })
    expect(login.status).toBe(200)
    expect(login.json.workspaces).toEqual([{ slug: 'ops-bench', name: 'Ops Bench', role: 'designer' }])
  }, 60_000)
})

describe('sign-in rate limit', () => {
  it('blocks an account after 10 failures in 15 minutes, from any address', async () => {
    const user = await signUp('Target')
    for (let i = 0; i < 10; i++) {
      expect(await postFrom(`127.0.0.${10 + i}`, '/api/auth/login', { email: user.email, password: `guess ${i}` })).toBe(401)
    }
    // The right password from a fresh address is still refused: the account is locked for now.
    expect(await postFrom('127.0.0.40', '/api/auth/login', { email: user.email, password: user.password })).toBe(429)
  })

  it('blocks an address after 10 failures, and a forged X-Forwarded-For does not reset it', async () => {
    const victim = await signUp('Bystander')
    for (let i = 0; i < 10; i++) {
      expect(await postFrom('127.0.0.50', '/api/auth/login', { email: uniqueEmail(`spray${i}`), password: 'spray' })).toBe(401)
    }
    expect(await postFrom('127.0.0.50', '/api/auth/login', { email: victim.email, password: victim.password })).toBe(429)
    expect(await postFrom('127.0.0.50', '/api/auth/login', { email: victim.email, password: victim.password }, { 'x-forwarded-for': '203.0.113.9' })).toBe(429)
    expect(await postFrom('127.0.0.50', '/api/auth/login', { email: victim.email, password: victim.password }, { 'x-real-ip': '203.0.113.10' })).toBe(429)
    // Another client is unaffected.
    expect(await postFrom('127.0.0.51', '/api/auth/login', { email: victim.email, password: victim.password })).toBe(200)
    const [row] = await queryDb<{ n: number }>(server.dbFile, "SELECT COUNT(*) AS n FROM login_failures WHERE scope = 'address' AND key LIKE '%127.0.0.50'")
    expect(row!.n).toBe(10)
  })
})
