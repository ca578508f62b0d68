// Raises the session version: every session cookie issued before now stops working at once,
// because each request compares its version with the database.
export default defineEventHandler(async (event) => {
  const user = await requireSignedIn(event)
  await user.increment('sessionVersion')
  await clearUserSession(event)
  return { ok: true }
})
