import { z } from 'zod'

const ParamsSchema = z.object({ token: TokenSchema })

// What an invitation link offers (no sign-in needed: the link itself is the secret).
export default defineEventHandler(async (event) => {
  const { token } = await paramsAs(event, ParamsSchema)
  const { invitation, workspace } = await findOpenInvitation(token)
  return { workspace: { slug: workspace.slug, name: workspace.name }, email: invitation.email, role: invitation.role, expiresAt: invitation.expiresAt.toISOString() }
})
