// The server's one database handle. Opened, migrated and (with GAMMABOARD_SEED=demo, on a database
// without users) seeded once at start (server/plugins/database.ts); handlers `await useDb()` so no
// query runs before that has finished.
import type { Sequelize } from 'sequelize'
import { openDatabase } from '../database/connection'
import { migrateToLatest, underStartupLock } from '../database/migrate'
import { seedDemo } from '../database/seed'
import { modelsFor, type Models } from '../models'

let ready: Promise<Sequelize> | undefined

export function useDb(): Promise<Sequelize> {
  ready ??= (async () => {
    const sequelize = await openDatabase()
    await underStartupLock(sequelize, async () => {
      await migrateToLatest(sequelize)
      if (process.env.GAMMABOARD_SEED === 'demo' && await seedDemo(sequelize)) {
        console.info('[gammaboard] seeded the demo workspace "brackwater"')
      }
    })
    return sequelize
  })()
  return ready
}

/** The models bound to the server's database handle. */
export async function useModels(): Promise<Models> {
  return modelsFor(await useDb())
}
