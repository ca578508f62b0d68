import { z } from 'zod'
import { normalizeEmail, serializeUser } from '../../models'
import { isPlainText } from '../../../shared/accounts/fields'

const BodySchema = z.object({
  email: z.string({ error: 'must be text' }).min(1, 'must not be empty').max(254, 'must be at most 254 characters')
    .refine(isPlainText, 'must not contain control characters'),
  password: z.string({ error: 'must be text' }).min(1, 'must not be empty').max(200, 'must be at most 200 characters'),
})

// One message for every failed sign-in (unknown address, wrong password, anything else): a more
// helpful answer would tell an attacker which addresses have accounts here.
const SIGN_IN_FAILED = 'Sign-in failed: that e-mail address and password do not match an account.'

// Compared against when the address is unknown, so both failures take the same scrypt time.
let decoyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, BodySchema)
  const email = normalizeEmail(body.email)
  // Counted before scrypt runs, so parallel guesses cannot all slip under the limit.
  const attempt = await useLoginLimiter().reserve(email, clientAddress(event))
  if (!attempt) {
    throw createError({ statusCode: 429, message: 'Too many failed sign-ins: wait 15 minutes, or reset your password.' })
  }
  const { User } = await useModels()
  const user = await User.findOne({ where: { email } })
  decoyHash ??= hashPassword('decoy password that matches nothing')
  const matches = await verifyPassword(user?.passwordHash ?? await decoyHash, body.password)
  if (!user || !matches) throw createError({ statusCode: 401, message: SIGN_IN_FAILED })
  await attempt.succeeded()
  await startSession(event, user)
  return { user: serializeUser(user), workspaces: await workspacesOf(user.id) }
})
