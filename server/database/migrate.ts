// Migration runner (umzug). Migrations are listed explicitly so the bundled server finds them
// without a file glob; add a new one at the end of server/migrations/index.ts.
import { Umzug, SequelizeStorage } from 'umzug'
import type { Sequelize } from 'sequelize'
import { migrations } from '../migrations'

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
