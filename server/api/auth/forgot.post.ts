import { z } from 'zod'

const BodySchema = z.object({ email: EmailSchema })

const SENT = 'If that address has an account, a link to choose a new password is on its way.'

// The same answer, in the same time, whether or not the address has an account, so this form
// cannot be used to find out who has one: the mail is sent after the answer, never awaited.
// Requests are counted per address asked for and per client, whether or not it has an account.
export default defineEventHandler(async (event) => {
  const { email } = await readBodyAs(event, BodySchema)
  publicOrigin()
  if (!await useForgotLimiter().reserve(email, clientAddress(event))) {
    throw createError({ statusCode: 429, message: 'Too many requests for a new password: wait 15 minutes and try again.' })
  }
  const { User } = await useModels()
  const user = await User.findOne({ where: { email } })
  if (user) {
    sendPasswordReset(user).catch(error => console.error('[gammaboard] sending a password reset failed', error))
  }
  return { ok: true, message: SENT }
})
