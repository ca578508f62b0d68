// One built server for the whole "server" project; tests read its address with inject('baseUrl').
import type { TestProject } from 'vitest/node'
import { startServer, type RunningServer } from './server'

let server: RunningServer | undefined

export async function setup(project: TestProject) {
  server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  project.provide('baseUrl', server.url)
  project.provide('dbFile', server.dbFile)
}

export async function teardown() {
  await server?.stop()
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    dbFile: string
  }
}
