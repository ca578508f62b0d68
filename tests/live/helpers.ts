// Shared by the live tests: a fresh board per test file (so the demo boards stay as seeded for
// other suites) and closing every client a test opened.
import { DEMO_USERS, signIn } from '../support/auth'
import type { LiveClient } from '../support/live-client'

export async function createBoard(baseUrl: string, cookie: string, name: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/boards`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie },
    body: JSON.stringify({ workspace: 'brackwater', name }),
  })
  if (res.status !== 201) throw new Error(`creating a board failed: ${res.status} ${await res.text()}`)
  return (await res.json() as { id: string }).id
}

export async function signInAll(baseUrl: string) {
  const [admin, designer, reviewer] = await Promise.all([
    signIn(baseUrl, DEMO_USERS.admin.email, DEMO_USERS.admin.password),
    signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password),
    signIn(baseUrl, DEMO_USERS.reviewer.email, DEMO_USERS.reviewer.password),
  ])
  return { admin, designer, reviewer }
}

export function clientPool() {
  const open: LiveClient[] = []
  return {
    track<T extends LiveClient>(client: T): T {
      open.push(client)
      return client
    },
    destroyAll() {
      for (const client of open.splice(0)) client.destroy()
    },
  }
}

export const b64 = (bytes: Uint8Array) => Buffer.from(bytes).toString('base64')
