// One built server for each server-side project; tests read its address with inject('baseUrl').
// The "postgres" project first starts a throwaway PostgreSQL cluster and Redis (services.ts) and
// provides them, so this server and every server its tests start use them.
import type { TestProject } from 'vitest/node'
import { startServer } from './server'
import { startPostgres, startRedis, type RunningService, type TestServices } from './services'

export async function setup(project: TestProject) {
  let services: TestServices = {}
  const started: RunningService[] = []
  if (project.name === 'postgres') {
    const [postgres, redis] = await Promise.all([startPostgres(), startRedis()])
    started.push(postgres, redis)
    services = { postgres: postgres.url, redis: redis.url }
  }
  project.provide('testPostgres', services.postgres ?? '')
  project.provide('testRedis', services.redis ?? '')
  const stopServices = async () => {
    for (const service of started.reverse()) await service.stop()
  }
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' }, services }).catch(async (error) => {
    await stopServices()
    throw error
  })
  project.provide('baseUrl', server.url)
  project.provide('dbFile', server.dbFile)
  return async () => {
    await server.stop()
    await stopServices()
  }
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    /** The server's SQLite file, or its postgres:// URL in the postgres project. */
    dbFile: string
  }
}
