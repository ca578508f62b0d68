// The server's one database handle. Opened and migrated once at start (server/plugins/database.ts);
// handlers `await useDb()` so no query runs before the migrations have finished.
import type { Sequelize } from 'sequelize'
import { databaseFile, openSequelize } from '../database/connection'
import { migrateToLatest } from '../database/migrate'

let ready: Promise<Sequelize> | undefined

export function useDb(): Promise<Sequelize> {
  ready ??= (async () => {
    const sequelize = await openSequelize(databaseFile())
    await migrateToLatest(sequelize)
    return sequelize
  })()
  return ready
}
