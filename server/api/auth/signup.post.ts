import { z } from 'zod'
import { serializeUser } from '../../models'
import { createUser, createWorkspace, setMembership } from '../../database/accounts'

const BodySchema = z.object({
  name: NameSchema,
  email: EmailSchema,
  password: PasswordSchema,
  /** The personal workspace's name; defaults to "<name>'s boards". */
  workspaceName: NameSchema.optional(),
})

// A new account comes with a personal workspace where the new user is the admin.
export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, BodySchema)
  const sequelize = await useDb()
  const { User } = await useModels()
  if (await User.count({ where: { email: body.email } })) {
    throw createError({ statusCode: 422, message: 'email: an account with this e-mail address already exists; sign in or reset the password.' })
  }
  const passwordHash = await hashPassword(body.password)
  const { user, workspace } = await sequelize.transaction(async (transaction) => {
    const user = await createUser(sequelize, { email: body.email, name: body.name, passwordHash }, transaction)
    const workspace = await createWorkspace(sequelize, { name: body.workspaceName ?? `${body.name}'s boards`.slice(0, 120) }, transaction)
    await setMembership(sequelize, { userId: user.id, workspaceId: workspace.id, role: 'admin' }, transaction)
    return { user, workspace }
  })
  await startSession(event, user)
  setResponseStatus(event, 201)
  return { user: serializeUser(user), workspace: { slug: workspace.slug, name: workspace.name }, workspaces: await workspacesOf(user.id) }
})
