import { z } from 'zod'
import { serializeUser } from '../../models'

const BodySchema = z.object({ token: TokenSchema, password: PasswordSchema })

// Sets the new password, uses up the link, ends every other session, and signs this browser in.
export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, BodySchema)
  const user = await resetPassword(body.token, await hashPassword(body.password))
  await useLoginLimiter().clearAccount(user.email)
  await startSession(event, user)
  return { user: serializeUser(user), workspaces: await workspacesOf(user.id) }
})
