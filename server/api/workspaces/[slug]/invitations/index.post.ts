import { z } from 'zod'
import { serializeInvitation } from '../../../../models'

const BodySchema = z.object({ email: EmailSchema, role: RoleSchema })

// Admins invite by e-mail: a one-time link that adds the membership when accepted.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const body = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { workspace: slug }, 'admin')
  const invitation = await inviteToWorkspace(access, body.email, body.role)
  setResponseStatus(event, 201)
  return serializeInvitation(invitation)
})
