// Direct access to a test server's database, a SQLite file or a postgres:// URL: row counts
// read-only, and (for expiry tests) a single write. SQL uses `?` placeholders on both engines.
// WAL mode lets SQLite reads run beside the server; the busy timeout covers its writes.
import pg from 'pg'
import sqlite3 from 'sqlite3'
import { isPostgresUrl } from './services'

// COUNT(*) is a bigint in PostgreSQL, which pg hands back as text; test counts fit a number.
pg.types.setTypeParser(20, value => Number.parseInt(value, 10))

async function postgresQuery<T>(url: string, sql: string, params: unknown[]): Promise<T[]> {
  let n = 0
  const client = new pg.Client({ connectionString: url })
  await client.connect()
  try {
    return (await client.query(sql.replace(/\?/g, () => `$${++n}`), params)).rows as T[]
  }
  finally {
    await client.end()
  }
}

export const TABLES = [
  'users', 'workspaces', 'memberships', 'invitations', 'password_resets', 'boards', 'board_updates', 'snapshots',
  'templates', 'uploads', 'outbox', 'login_failures', 'sessions', 'comments', 'verdicts', 'parts',
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
  if (isPostgresUrl(file)) return postgresQuery<T>(file, sql, params)
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
  if (isPostgresUrl(file)) {
    await postgresQuery(file, sql, params)
    return
  }
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

/** Caught mails to an address (in any letter case, as SQLite LIKE matches), newest first. */
export async function mailsTo(file: string, address: string) {
  return queryDb<{ id: number, subject: string, text_body: string, html_body: string, kind: string, workspace_id: number | null }>(
    file, 'SELECT id, subject, text_body, html_body, kind, workspace_id FROM outbox WHERE LOWER(mail_to) LIKE ? ORDER BY id DESC', [`%${address.toLowerCase()}%`])
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
