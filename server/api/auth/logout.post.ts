// Ends this browser's session only; see logout-everywhere for the others.
export default defineEventHandler(async (event) => {
  await clearUserSession(event)
  return { ok: true }
})
