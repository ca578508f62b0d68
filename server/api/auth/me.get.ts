import { serializeUser } from '../../models'

// Who is signed in, and where they belong (the client picks the first workspace after sign-in).
export default defineEventHandler(async (event) => {
  const user = await requireSignedIn(event)
  return { user: serializeUser(user), workspaces: await workspacesOf(user.id) }
})
