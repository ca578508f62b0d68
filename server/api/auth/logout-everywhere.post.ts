// Ends every session of the account at once: the rows are revoked, the session version is raised
// (cookies issued before now stop working), and the user's open live sockets are closed.
export default defineEventHandler(async (event) => {
  const user = await requireSignedIn(event)
  const sequelize = await useDb()
  await sequelize.transaction(async (transaction) => {
    await revokeAllSessions(user.id, transaction)
    await user.increment('sessionVersion', { transaction })
  })
  closeUserSockets(user.id)
  await clearUserSession(event)
  return { ok: true }
})
