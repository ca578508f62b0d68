import { z } from 'zod'
import { serializeUser } from '../../models'
import { createUser, createWorkspace, setMembership } from '../../database/accounts'
import { lockWithin } from '../../database/connection'

const BodySchema = z.object({
  name: NameSchema,
  /** Required, unless signing up through an invitation: then the invited address is the account's. */
  email: EmailSchema.optional(),
  password: PasswordSchema,
  /** The personal workspace's name; defaults to "<name>'s boards". */
  workspaceName: NameSchema.optional(),
  /** An invitation link's token: the account gets the invited address and joins at once. */
  invitation: TokenSchema.optional(),
}).refine(b => b.email !== undefined || b.invitation !== undefined, { message: 'is required', path: ['email'] })

// A new account comes with a personal workspace where the new user is the admin; through an
// invitation it also joins the inviting workspace, under the address the invitation was sent to.
export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, BodySchema)
  const invited = body.invitation ? (await findOpenInvitation(body.invitation)).invitation : null
  if (invited && body.email && body.email !== invited.email.toLowerCase()) throw sentToAnotherAddress(invited.email)
  const email = invited ? invited.email.toLowerCase() : body.email!
  const sequelize = await useDb()
  const { User } = await useModels()
  const passwordHash = await hashPassword(body.password)
  const { user, workspace, joined } = await sequelize.transaction(async (transaction) => {
    // Checked inside the transaction: parallel sign-ups with one address make one account.
    await lockWithin(sequelize, transaction, `account:${email}`)
    if (await User.count({ where: { email }, transaction })) {
      throw createError({ statusCode: 422, message: 'email: an account with this e-mail address already exists; sign in or reset the password.' })
    }
    const user = await createUser(sequelize, { email, name: body.name, passwordHash }, transaction)
    const workspace = await createWorkspace(sequelize, { name: body.workspaceName ?? `${body.name}'s boards`.slice(0, 120) }, transaction)
    await setMembership(sequelize, { userId: user.id, workspaceId: workspace.id, role: 'admin' }, transaction)
    const joined = body.invitation ? await acceptInvitation(body.invitation, user, transaction) : null
    return { user, workspace, joined }
  })
  await startSession(event, user)
  setResponseStatus(event, 201)
  return { user: serializeUser(user), workspace: { slug: workspace.slug, name: workspace.name }, joined, workspaces: await workspacesOf(user.id) }
})
