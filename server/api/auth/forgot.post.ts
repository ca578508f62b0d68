import { z } from 'zod'

const BodySchema = z.object({ email: EmailSchema })

// Always the same answer, whether or not the address has an account, so this form cannot be used
// to find out who has one.
export default defineEventHandler(async (event) => {
  const { email } = await readBodyAs(event, BodySchema)
  const { User } = await useModels()
  const user = await User.findOne({ where: { email } })
  if (user) await sendPasswordReset(event, user)
  return { ok: true, message: 'If that address has an account, a link to choose a new password is on its way.' }
})
