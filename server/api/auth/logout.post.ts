// Ends this browser's session on the server (the row is revoked, its live sockets close) and
// clears the cookie; see logout-everywhere for the others. The revocation runs in the session
// 'clear' hook (server/plugins/sessions.ts), so nuxt-auth-utils' own DELETE /api/_auth/session
// revokes too.
export default defineEventHandler(async (event) => {
  await clearUserSession(event)
  return { ok: true }
})
