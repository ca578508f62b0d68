// Liveness and readiness: answers once the database is open and migrated.
export default defineEventHandler(async () => {
  const sequelize = await useDb()
  const [rows] = await sequelize.query('SELECT name FROM schema_migrations ORDER BY name')
  return { ok: true, migrations: (rows as { name: string }[]).map(r => r.name) }
})
