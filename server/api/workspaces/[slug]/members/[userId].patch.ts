import { z } from 'zod'
import { serializeMember } from '../../../../models'
import { liveBridge } from '../../../../database/live-bridge'

const ParamsSchema = z.object({ slug: SlugSchema, userId: UserIdSchema })
const BodySchema = z.object({ role: RoleSchema })

// Admins change roles; the last admin cannot be demoted.
export default defineEventHandler(async (event) => {
  const { slug, userId } = await paramsAs(event, ParamsSchema)
  const { role } = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { workspace: slug }, 'admin')
  const membership = await changeMembership(access.workspace.id, userId, role)
  liveBridge()?.refreshRole?.(userId, access.workspace.id, role)
  const { User } = await useModels()
  return serializeMember(membership, (await User.findByPk(userId))!)
})
