// Throwaway PostgreSQL and Redis servers for the tests and benchmarks: Debian's binaries, a data
// folder under the temp dir, a free loopback port, no persistence worth keeping. Each is stopped by
// its own PID and its folder removed. PostgreSQL refuses to run as root, so as root the cluster
// belongs to Debian's `postgres` user (Node sets the uid/gid of the child itself).
import { spawn, spawnSync, type ChildProcess } from 'node:child_process'
import { chownSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import pg from 'pg'
import { inject } from 'vitest'
import { freePort } from './ports'

/**
 * The project's shared services, provided by the postgres project's global setup: the cluster on
 * which each server gets a database of its own, and the Redis its nodes share. Outside a test
 * worker (the global setup itself) pass them explicitly.
 */
export interface TestServices {
  postgres?: string
  redis?: string
}

export function projectServices(): TestServices {
  try {
    return { postgres: inject('testPostgres') || undefined, redis: inject('testRedis') || undefined }
  }
  catch {
    // Not in a test worker.
    return {}
  }
}

export interface RunningService {
  url: string
  pid: number
  stop: () => Promise<void>
}

/** Debian installs each PostgreSQL major under /usr/lib/postgresql/N/bin; take the newest. */
export function postgresBinDir(): string {
  const root = '/usr/lib/postgresql'
  const majors = existsSync(root) ? readdirSync(root).filter(v => /^\d+$/.test(v)).sort((a, b) => Number(b) - Number(a)) : []
  const found = majors.map(v => join(root, v, 'bin')).find(dir => existsSync(join(dir, 'initdb')))
  if (!found) throw new Error('PostgreSQL server binaries not found under /usr/lib/postgresql (bash scripts/ensure-system-deps.sh installs them)')
  return found
}

/** uid/gid of a system user from /etc/passwd (no extra dependency for one lookup). */
function userIds(name: string): { uid: number, gid: number } {
  const line = readFileSync('/etc/passwd', 'utf8').split('\n').find(l => l.startsWith(`${name}:`))
  if (!line) throw new Error(`no system user ${name}`)
  const [, , uid, gid] = line.split(':')
  return { uid: Number(uid), gid: Number(gid) }
}

function collect(child: ChildProcess): () => string {
  let log = ''
  child.stdout?.on('data', (d) => { log += d })
  child.stderr?.on('data', (d) => { log += d })
  return () => log
}

function stopper(child: ChildProcess, signal: NodeJS.Signals, folder: string): () => Promise<void> {
  return () => new Promise<void>((ok) => {
    const done = () => {
      rmSync(folder, { recursive: true, force: true })
      ok()
    }
    if (child.exitCode !== null || child.signalCode !== null) return done()
    const timer = setTimeout(() => child.kill('SIGKILL'), 10_000)
    child.once('exit', () => {
      clearTimeout(timer)
      done()
    })
    child.kill(signal)
  })
}

async function waitFor(check: () => Promise<boolean>, child: ChildProcess, log: () => string, what: string) {
  const deadline = Date.now() + 30_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`${what} exited early (${child.exitCode}):\n${log()}`)
    if (await check().catch(() => false)) return
    if (Date.now() > deadline) {
      child.kill('SIGKILL')
      throw new Error(`${what} did not start within 30 s:\n${log()}`)
    }
    await new Promise(r => setTimeout(r, 100))
  }
}

/**
 * A PostgreSQL cluster in a temp folder, trust auth on 127.0.0.1 only, superuser `gammaboard`.
 * The url names the `postgres` maintenance database; createDatabase() makes one per server.
 */
export async function startPostgres(): Promise<RunningService> {
  const bin = postgresBinDir()
  const folder = mkdtempSync(join(tmpdir(), 'gammaboard-pg-'))
  const ids = process.getuid?.() === 0 ? userIds('postgres') : undefined
  if (ids) chownSync(folder, ids.uid, ids.gid)
  const asOwner = { ...(ids ?? {}), env: { PATH: process.env.PATH, LANG: 'C.UTF-8', HOME: folder } }
  const data = join(folder, 'data')
  const init = spawnSync(join(bin, 'initdb'), ['-D', data, '-U', 'gammaboard', '--auth=trust', '-E', 'UTF8', '--no-sync'], { ...asOwner, encoding: 'utf8' })
  if (init.status !== 0) throw new Error(`initdb failed (${init.status}): ${init.stderr || init.error}`)
  const port = await freePort()
  // Throwaway data: durability settings off for speed (a crash of this server loses the test run only).
  const child = spawn(join(bin, 'postgres'), [
    '-D', data, '-p', String(port), '-k', folder, '-c', 'listen_addresses=127.0.0.1',
    '-c', 'fsync=off', '-c', 'synchronous_commit=off', '-c', 'full_page_writes=off', '-c', 'max_connections=200',
  ], { ...asOwner, stdio: ['ignore', 'pipe', 'pipe'] })
  const log = collect(child)
  const url = `postgres://gammaboard@127.0.0.1:${port}/postgres`
  await waitFor(async () => {
    const client = new pg.Client({ connectionString: url })
    await client.connect()
    await client.end()
    return true
  }, child, log, 'postgres')
  // SIGINT is PostgreSQL's fast shutdown: open sessions are ended, no wait for clients.
  return { url, pid: child.pid!, stop: stopper(child, 'SIGINT', folder) }
}

let databaseCount = 0

/** A new empty database on the cluster at `serverUrl`; returns its URL. */
export async function createDatabase(serverUrl: string, prefix = 'gb'): Promise<string> {
  const name = `${prefix}_${process.pid}_${++databaseCount}_${Date.now().toString(36)}`
  const client = new pg.Client({ connectionString: serverUrl })
  await client.connect()
  try {
    await client.query(`CREATE DATABASE ${name}`)
  }
  finally {
    await client.end()
  }
  const url = new URL(serverUrl)
  url.pathname = `/${name}`
  return url.toString()
}

/** A Redis server on a loopback port that keeps nothing on disk. */
export async function startRedis(): Promise<RunningService> {
  const folder = mkdtempSync(join(tmpdir(), 'gammaboard-redis-'))
  const port = await freePort()
  const child = spawn('redis-server', [
    '--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--dir', folder,
    '--protected-mode', 'yes', '--loglevel', 'warning',
  ], { stdio: ['ignore', 'pipe', 'pipe'] })
  const log = collect(child)
  const url = `redis://127.0.0.1:${port}`
  await waitFor(async () => {
    const probe = spawnSync('redis-cli', ['-p', String(port), 'ping'], { encoding: 'utf8' })
    return probe.stdout.trim() === 'PONG'
  }, child, log, 'redis-server')
  return { url, pid: child.pid!, stop: stopper(child, 'SIGTERM', folder) }
}

/** A new database for one server: PostgreSQL in the postgres project, else a temp SQLite file. */
export async function freshDatabase(services = projectServices()): Promise<string> {
  if (services.postgres) return createDatabase(services.postgres)
  return join(mkdtempSync(join(tmpdir(), 'gammaboard-test-')), 'test.sqlite')
}

export const isPostgresUrl = (database: string) => /^postgres(ql)?:\/\//.test(database)

/** The server's environment for a database (a SQLite file or a postgres:// URL). */
export function databaseEnv(database: string): Record<string, string> {
  return isPostgresUrl(database)
    ? { GAMMABOARD_DATABASE_URL: database }
    : { GAMMABOARD_DB: database, GAMMABOARD_DATABASE_URL: '' }
}

/**
 * With the project's Redis, nodes on the same database form one group: the key prefix is taken
 * from the database, so the servers of other test files on the same Redis never hear them.
 */
export function redisEnv(database: string, redis = projectServices().redis): Record<string, string> {
  if (!redis) return { GAMMABOARD_REDIS_URL: '' }
  const name = isPostgresUrl(database) ? new URL(database).pathname.slice(1) : database.replace(/[^A-Za-z0-9]+/g, '_')
  return { GAMMABOARD_REDIS_URL: redis, GAMMABOARD_REDIS_PREFIX: `gb:${name}:` }
}

declare module 'vitest' {
  export interface ProvidedContext {
    /** postgres:// URL of the project's cluster ('' in the SQLite project). */
    testPostgres: string
    /** redis:// URL of the project's Redis ('' in the SQLite project). */
    testRedis: string
  }
}
