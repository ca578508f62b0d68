import { z } from 'zod'
import { liveBridge } from '../../../../database/live-bridge'

const ParamsSchema = z.object({ slug: SlugSchema, userId: UserIdSchema })

// Admins remove anyone; any member may remove themselves (leave). The last admin can do neither.
// Access is checked on every request, so a removed member loses access at once.
export default defineEventHandler(async (event) => {
  const { slug, userId } = await paramsAs(event, ParamsSchema)
  const access = await requireMember(event, { workspace: slug }, 'reviewer')
  if (userId !== access.user.id && access.role !== 'admin') {
    throw createError({ statusCode: 403, message: 'Only an admin can remove other members.' })
  }
  await changeMembership(access.workspace.id, userId, null)
  liveBridge()?.refreshRole?.(userId, access.workspace.id, null)
  return { ok: true }
})
