// Starts the built server (.output) on a free loopback port with its own database: a fresh SQLite
// file, or in the postgres project a fresh PostgreSQL database and the project's Redis (see
// freshDatabase). Used by the global setups and by tests that need a server of their own.
import { spawn, type ChildProcess } from 'node:child_process'
import { resolve } from 'node:path'
import { freePort } from './ports'
import { databaseEnv, freshDatabase, projectServices, redisEnv, type TestServices } from './services'

export { freePort }

export const SESSION_PASSWORD = 'test-session-password-at-least-32-characters-long'

export interface RunningServer {
  url: string
  port: number
  /** The SQLite file, or the postgres:// URL of the server's database. */
  dbFile: string
  process: ChildProcess
  stop: (signal?: NodeJS.Signals) => Promise<void>
}

export interface StartOptions {
  /** A SQLite file or a postgres:// URL; default freshDatabase(). Two nodes share one by passing it. */
  dbFile?: string
  port?: number
  env?: Record<string, string>
  /** PostgreSQL cluster and Redis to use; default the project's (none in the SQLite project). */
  services?: TestServices
}

export async function startServer(options: StartOptions = {}): Promise<RunningServer> {
  const port = options.port ?? await freePort()
  const services = options.services ?? projectServices()
  const dbFile = options.dbFile ?? await freshDatabase(services)
  const entry = resolve(process.env.GAMMABOARD_OUTPUT ?? '.output', 'server/index.mjs')
  const url = `http://127.0.0.1:${port}`
  const child = spawn(process.execPath, [entry], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      NITRO_HOST: '127.0.0.1',
      NUXT_SESSION_PASSWORD: SESSION_PASSWORD,
      ...databaseEnv(dbFile),
      ...redisEnv(dbFile, services.redis),
      GAMMABOARD_ENV: 'test',
      // Mailed links point here; an empty value in options.env starts a server without one.
      GAMMABOARD_PUBLIC_URL: url,
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let log = ''
  child.stdout!.on('data', (d) => { log += d })
  child.stderr!.on('data', (d) => { log += d })
  const deadline = Date.now() + 30_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early (${child.exitCode}):\n${log}`)
    try {
      const res = await fetch(`${url}/api/health`)
      if (res.ok) break
    }
    catch { /* not listening yet */ }
    if (Date.now() > deadline) {
      child.kill('SIGKILL')
      throw new Error(`server did not answer /api/health within 30 s:\n${log}`)
    }
    await new Promise(r => setTimeout(r, 150))
  }
  const stop = (signal: NodeJS.Signals = 'SIGTERM') => new Promise<void>((ok) => {
    if (child.exitCode !== null || child.signalCode !== null) return ok()
    child.once('exit', () => ok())
    child.kill(signal)
  })
  return { url, port, dbFile, process: child, stop }
}
