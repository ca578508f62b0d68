// Liveness and readiness for a load balancer: 200 when the database answers (open and migrated)
// and, on a node joined to others, Redis answers too; 503 with the same body when either is down.
// Each check gives up after a second, so a hung dependency never hangs the probe.
const CHECK_TIMEOUT_MS = 1000

async function withTimeout<T>(work: Promise<T>): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined
  const late = new Promise<never>((_, fail) => { timer = setTimeout(() => fail(new Error('timed out')), CHECK_TIMEOUT_MS) })
  try {
    return await Promise.race([work, late])
  }
  finally {
    clearTimeout(timer)
  }
}

export default defineEventHandler(async () => {
  const sequelize = await useDb()
  const migrations = await withTimeout(sequelize.query('SELECT name FROM schema_migrations ORDER BY name'))
    .then(([rows]) => (rows as { name: string }[]).map(r => r.name), () => null)
  const database = migrations ? 'up' : 'down'
  const redis = !useRedis() ? 'not used' : (await redisIsUp(CHECK_TIMEOUT_MS) ? 'up' : 'down')
  const state = { database, redis, dialect: sequelize.getDialect() }
  if (database === 'down' || redis === 'down') {
    throw createError({ statusCode: 503, message: `Not ready: database ${database}, Redis ${redis}.`, data: state })
  }
  return { ok: true, ...state, migrations }
})
