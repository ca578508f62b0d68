// Opens the SQLite file through Sequelize. Explicit imports only (no Nitro auto-imports) so that
// command-line tools (scripts/admin.ts) can share this file with the server.
import { mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import sqlite3 from 'sqlite3'
import { Sequelize } from 'sequelize'

export const DEFAULT_DB_FILE = 'data/gammaboard.sqlite'

/** Resolve the database path from GAMMABOARD_DB (default data/gammaboard.sqlite). */
export function databaseFile(env: NodeJS.ProcessEnv = process.env): string {
  return resolve(env.GAMMABOARD_DB || DEFAULT_DB_FILE)
}

/**
 * Open the database with WAL journaling (readers never block the writer) and a busy timeout
 * (a second writer waits instead of failing with SQLITE_BUSY), foreign keys enforced.
 */
export async function openSequelize(file: string): Promise<Sequelize> {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true })
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    dialectModule: sqlite3,
    storage: file,
    logging: false,
    // One connection: SQLite serialises writers anyway, and PRAGMAs are per connection.
    pool: { max: 1, min: 0, idle: 60_000 },
  })
  await sequelize.query('PRAGMA journal_mode = WAL')
  await sequelize.query('PRAGMA busy_timeout = 5000')
  await sequelize.query('PRAGMA foreign_keys = ON')
  await sequelize.query('PRAGMA synchronous = NORMAL')
  return sequelize
}
