import { revokeSession, type SessionClaims } from '../utils/sessions'

// Clearing a session cookie (our sign-out, nuxt-auth-utils' DELETE /api/_auth/session, a stale
// cookie seen by currentUser) also revokes its row, so a copy of the cookie is worthless.
export default defineNitroPlugin(() => {
  sessionHooks.hook('clear', async (session) => {
    await revokeSession(session as SessionClaims)
  })
})
