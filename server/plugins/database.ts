// Open the database and apply pending migrations as the server starts; a failure stops the server
// rather than serving requests against a half-migrated schema.
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
