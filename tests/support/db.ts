// Direct access to a test server's SQLite file: row counts read-only, and (for expiry tests) a
// single write. WAL mode lets these run beside the server; the busy timeout covers its writes.
import sqlite3 from 'sqlite3'

export const TABLES = [
  'users', 'workspaces', 'memberships', 'invitations', 'password_resets', 'boards', 'board_updates', 'snapshots',
  'templates', 'uploads', 'outbox', 'login_failures', 'sessions',
] as const

function open(file: string, mode: number): Promise<sqlite3.Database> {
  return new Promise((ok, fail) => {
    const db = new sqlite3.Database(file, mode, error => error ? fail(error) : ok(db))
  })
}

function all<T>(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<T[]> {
  return new Promise((ok, fail) => db.all(sql, params, (error, rows) => error ? fail(error) : ok(rows as T[])))
}

function close(db: sqlite3.Database): Promise<void> {
  return new Promise(ok => db.close(() => ok()))
}

export async function queryDb<T = Record<string, unknown>>(file: string, sql: string, params: unknown[] = []): Promise<T[]> {
  const db = await open(file, sqlite3.OPEN_READONLY)
  try {
    db.configure('busyTimeout', 5000)
    return await all<T>(db, sql, params)
  }
  finally {
    await close(db)
  }
}

export async function writeDb(file: string, sql: string, params: unknown[] = []): Promise<void> {
  const db = await open(file, sqlite3.OPEN_READWRITE)
  try {
    db.configure('busyTimeout', 5000)
    await new Promise<void>((ok, fail) => db.run(sql, params, error => error ? fail(error) : ok()))
  }
  finally {
    await close(db)
  }
}

/** Row count of every table, for "nothing changed" assertions. */
export async function rowCounts(file: string): Promise<Record<string, number>> {
  const counts: Record<string, number> = {}
  for (const table of TABLES) {
    const [row] = await queryDb<{ n: number }>(file, `SELECT COUNT(*) AS n FROM ${table}`)
    counts[table] = row!.n
  }
  return counts
}

/** Caught mails to an address, newest first. */
export async function mailsTo(file: string, address: string) {
  return queryDb<{ id: number, subject: string, text_body: string, html_body: string, kind: string, workspace_id: number | null }>(
    file, 'SELECT id, subject, text_body, html_body, kind, workspace_id FROM outbox WHERE mail_to LIKE ? ORDER BY id DESC', [`%${address}%`])
}

/** The first link to this site found in a mail's text part. */
export function linkIn(text: string, pathPrefix: string): string {
  const match = new RegExp(`https?://[^\\s]+${pathPrefix}[A-Za-z0-9_-]+`).exec(text)
  if (!match) throw new Error(`no ${pathPrefix} link in mail:\n${text}`)
  return match[0]
}

/** Waits for at least `count` caught mails to an address (some are sent after the answer), newest first. */
export async function waitForMails(file: string, address: string, count = 1, timeoutMs = 5000) {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const mails = await mailsTo(file, address)
    if (mails.length >= count) return mails
    if (Date.now() > deadline) throw new Error(`expected ${count} mail(s) to ${address} within ${timeoutMs} ms, found ${mails.length}`)
    await new Promise(r => setTimeout(r, 50))
  }
}
