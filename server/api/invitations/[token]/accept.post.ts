import { z } from 'zod'

const ParamsSchema = z.object({ token: TokenSchema })

// The signed-in user (who may just have signed up) joins the workspace with the invited role.
export default defineEventHandler(async (event) => {
  const { token } = await paramsAs(event, ParamsSchema)
  const user = await requireSignedIn(event)
  const workspace = await acceptInvitation(token, user)
  return { workspace, workspaces: await workspacesOf(user.id) }
})
