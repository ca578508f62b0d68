// Open the database, apply pending migrations and seed the demo team (GAMMABOARD_SEED=demo) as the
// server starts; a failure stops the server rather than serving a half-migrated schema.
export default defineNitroPlugin(async (nitroApp) => {
  try {
    await useDb()
  }
  catch (error) {
    console.error('[gammaboard] database start-up failed:', error)
    process.exit(1)
  }
  nitroApp.hooks.hook('close', async () => {
    const sequelize = await useDb()
    await sequelize.close()
  })
})
