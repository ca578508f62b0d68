// Migrations on an empty database and on one left at the previous migration, through the same
// functions the server and scripts use (no HTTP): SQLite in the server project, PostgreSQL in the
// postgres project (the same migrations run on both engines).
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterEach, describe, expect, it } from 'vitest'
import type { Sequelize } from 'sequelize'
import { isPostgres, openPostgres, openSequelize } from '../../server/database/connection'
import { migrateToLatest, migrator } from '../../server/database/migrate'
import { migrations } from '../../server/migrations'
import { seedDemo } from '../../server/database/seed'
import { TABLES } from '../support/db'
import { createDatabase, projectServices } from '../support/services'

let open: Sequelize | undefined
afterEach(async () => {
  await open?.close()
  open = undefined
})

const { postgres } = projectServices()

async function freshDb(): Promise<Sequelize> {
  open = postgres
    ? await openPostgres(await createDatabase(postgres, 'migrate'))
    : await openSequelize(join(mkdtempSync(join(tmpdir(), 'gammaboard-migrate-')), 'db.sqlite'))
  return open
}

async function tableNames(sequelize: Sequelize): Promise<string[]> {
  const [rows] = await sequelize.query(isPostgres(sequelize)
    ? "SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' ORDER BY name"
    : "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name")
  return (rows as { name: string }[]).map(r => r.name).sort()
}

describe('migrations', () => {
  it('bring an empty database to the latest schema, once', async () => {
    const sequelize = await freshDb()
    expect(await migrateToLatest(sequelize)).toEqual(migrations.map(m => m.name))
    expect(await tableNames(sequelize)).toEqual([...TABLES, 'schema_migrations'].sort())
    expect(await migrateToLatest(sequelize)).toEqual([])
    if (isPostgres(sequelize)) return
    const [journal] = await sequelize.query('PRAGMA journal_mode')
    expect((journal as { journal_mode: string }[])[0]!.journal_mode).toBe('wal')
  })

  it('apply only what is pending to a database at the previous migration, keeping its rows', async () => {
    const sequelize = await freshDb()
    const previous = migrations[migrations.length - 2]!.name
    await migrator(sequelize).up({ to: previous })
    // The last migration (0010) adds the parts library; the one before it (0007) the review tables.
    expect(await tableNames(sequelize)).toEqual(expect.arrayContaining(['sessions', 'comments', 'verdicts']))
    expect(await tableNames(sequelize)).not.toContain('parts')
    // Rows written by the previous schema: the demo seed touches every table it had.
    expect(await seedDemo(sequelize)).toBe(true)
    const [before] = await sequelize.query('SELECT id, name, summary FROM boards ORDER BY id')

    expect(await migrateToLatest(sequelize)).toEqual([migrations[migrations.length - 1]!.name])
    const [after] = await sequelize.query('SELECT id, name, summary FROM boards ORDER BY id')
    expect(after).toEqual(before)
    expect((before as unknown[]).length).toBeGreaterThan(0)
    expect(await tableNames(sequelize)).toContain('parts')
    const [users] = await sequelize.query('SELECT email FROM users ORDER BY id')
    expect((users as { email: string }[]).map(u => u.email)).toEqual(['mara@brackwater.example', 'tomas@brackwater.example', 'ines@brackwater.example'])
  })

  it('roll back to nothing and forward again', async () => {
    const sequelize = await freshDb()
    await migrateToLatest(sequelize)
    await migrator(sequelize).down({ to: 0 })
    expect(await tableNames(sequelize)).toEqual(['schema_migrations'])
    expect(await migrateToLatest(sequelize)).toHaveLength(migrations.length)
  })

  it('the seed runs only on a database without users', async () => {
    const sequelize = await freshDb()
    await migrateToLatest(sequelize)
    expect(await seedDemo(sequelize)).toBe(true)
    expect(await seedDemo(sequelize)).toBe(false)
    const [rows] = await sequelize.query('SELECT COUNT(*) AS n FROM workspaces')
    expect(Number((rows as { n: number | string }[])[0]!.n)).toBe(1)
  })
})
