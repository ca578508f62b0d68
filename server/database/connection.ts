// Opens the database through Sequelize: PostgreSQL when GAMMABOARD_DATABASE_URL is set (several
// nodes share it), else the SQLite file named by GAMMABOARD_DB. Explicit imports only (no Nitro
// auto-imports) so that command-line tools (scripts/admin.ts) can share this file with the server.
import { mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import pg from 'pg'
import sqlite3 from 'sqlite3'
import { Sequelize, Transaction } from 'sequelize'

export const DEFAULT_DB_FILE = 'data/gammaboard.sqlite'

export type DatabaseTarget =
  | { dialect: 'sqlite', file: string }
  | { dialect: 'postgres', url: string }

/** Resolve the SQLite path from GAMMABOARD_DB (default data/gammaboard.sqlite). */
export function databaseFile(env: NodeJS.ProcessEnv = process.env): string {
  return resolve(env.GAMMABOARD_DB || DEFAULT_DB_FILE)
}

export const BUSY_TIMEOUT_MS = 5000

/** Which database this process uses: GAMMABOARD_DATABASE_URL (postgres://…) wins over GAMMABOARD_DB. */
export function databaseTarget(env: NodeJS.ProcessEnv = process.env): DatabaseTarget {
  const url = env.GAMMABOARD_DATABASE_URL?.trim()
  if (!url) return { dialect: 'sqlite', file: databaseFile(env) }
  if (!/^postgres(ql)?:\/\//.test(url)) throw new Error('GAMMABOARD_DATABASE_URL must be a postgres:// URL')
  return { dialect: 'postgres', url }
}

/** Opens the database this environment names (see databaseTarget). */
export function openDatabase(env: NodeJS.ProcessEnv = process.env): Promise<Sequelize> {
  const target = databaseTarget(env)
  return target.dialect === 'postgres' ? openPostgres(target.url) : openSequelize(target.file)
}

/**
 * Open the SQLite file with WAL journaling (readers never block the writer) and a busy timeout
 * (a second writer waits instead of failing with SQLITE_BUSY), foreign keys enforced.
 */
export async function openSequelize(file: string): Promise<Sequelize> {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true })
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    dialectModule: sqlite3,
    storage: file,
    logging: false,
    // BEGIN IMMEDIATE takes the write lock up front. A deferred transaction that reads and then
    // writes cannot wait for the lock (SQLite answers SQLITE_BUSY at once to avoid a deadlock).
    transactionType: Transaction.TYPES.IMMEDIATE,
  })
  configureEveryConnection(sequelize)
  serializeTransactions(sequelize)
  await sequelize.query('PRAGMA journal_mode = WAL')
  await sequelize.query('PRAGMA foreign_keys = ON')
  await sequelize.query('PRAGMA synchronous = NORMAL')
  return sequelize
}

/**
 * Sequelize's SQLite dialect opens a new connection for every transaction (no pool, no
 * afterConnect hook), so a PRAGMA run once reaches only the default connection: transactions had
 * no busy timeout and failed with SQLITE_BUSY under concurrency. Every new handle gets it here.
 */
function configureEveryConnection(sequelize: Sequelize): void {
  const manager = sequelize.connectionManager as unknown as { getConnection: (options?: object) => Promise<sqlite3.Database> }
  const getConnection = manager.getConnection.bind(manager)
  const configured = new WeakSet<sqlite3.Database>()
  manager.getConnection = async (options) => {
    const connection = await getConnection(options)
    if (!configured.has(connection)) {
      connection.configure('busyTimeout', BUSY_TIMEOUT_MS)
      configured.add(connection)
    }
    return connection
  }
}

/**
 * One managed transaction at a time in this process. SQLite has one writer anyway; queueing here
 * keeps waiting writers off libuv's four worker threads, where a busy wait could starve the very
 * transaction holding the lock. Other processes (scripts/admin.ts) still meet the busy timeout.
 * WARNING: so never open a transaction inside another one's callback; pass the outer one down.
 */
function serializeTransactions(sequelize: Sequelize): void {
  const transaction = sequelize.transaction.bind(sequelize) as (...args: unknown[]) => Promise<unknown>
  let tail: Promise<unknown> = Promise.resolve()
  sequelize.transaction = ((...args: unknown[]) => {
    // Unmanaged transactions (no callback) are committed by their caller: not queued.
    if (typeof args[args.length - 1] !== 'function') return transaction(...args)
    const run = tail.then(() => transaction(...args))
    tail = run.catch(() => {})
    return run
  }) as Sequelize['transaction']
}

/**
 * Open PostgreSQL. The driver is passed in (dialectModule) so the bundler traces it; a first query
 * proves the server answers before migrations start.
 */
export async function openPostgres(url: string): Promise<Sequelize> {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: 10, min: 0, idle: 30_000, acquire: 20_000 },
  })
  await sequelize.authenticate()
  return sequelize
}

/** True for a PostgreSQL handle (row locks and advisory locks exist only there). */
export function isPostgres(sequelize: Sequelize): boolean {
  return sequelize.getDialect() === 'postgres'
}

/**
 * Serialises check-then-write transactions that share `key` (an account's address, a workspace's
 * admins, the sign-in limit). SQLite runs one transaction at a time already; PostgreSQL's read
 * committed lets two of them read the same rows before either writes, so there an advisory lock,
 * released at commit or rollback, makes the second wait. Holds across every node on the database.
 */
export async function lockWithin(sequelize: Sequelize, transaction: Transaction, key: string): Promise<void> {
  if (!isPostgres(sequelize)) return
  await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', { replacements: { key }, transaction })
}
