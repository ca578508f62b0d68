// Migration runner (umzug). Migrations are listed explicitly so the bundled server finds them
// without a file glob; add a new one at the end of server/migrations/index.ts.
import { Umzug, SequelizeStorage } from 'umzug'
import type { Sequelize } from 'sequelize'
import { migrations } from '../migrations'
import { isPostgres, lockWithin } from './connection'

export function migrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: migrations.map(m => ({
      name: m.name,
      up: () => m.up(sequelize.getQueryInterface(), sequelize),
      down: () => m.down(sequelize.getQueryInterface(), sequelize),
    })),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  })
}

/** Apply every pending migration; returns the names applied. */
export async function migrateToLatest(sequelize: Sequelize): Promise<string[]> {
  const applied = await migrator(sequelize).up()
  return applied.map(m => m.name)
}

/**
 * Runs start-up work (migrations, the demo seed) one node at a time: on PostgreSQL two nodes
 * starting together would both create the same tables. A transaction holds an advisory lock
 * while the work runs on other pooled connections. SQLite (one node) needs no lock, and must not
 * get one this way: its transactions run one at a time, so the inner ones would wait forever.
 */
export async function underStartupLock<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  if (!isPostgres(sequelize)) return work()
  return sequelize.transaction(async (transaction) => {
    await lockWithin(sequelize, transaction, 'start-up')
    return work()
  })
}
