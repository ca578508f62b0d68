import { z } from 'zod'
import { serializeMember } from '../../../../models'
import { liveBridge } from '../../../../database/live-bridge'

const ParamsSchema = z.object({ slug: SlugSchema, userId: z.coerce.number().int().positive('is not a user id') })
const BodySchema = z.object({ role: RoleSchema })

// Admins change roles; the last admin cannot be demoted.
export default defineEventHandler(async (event) => {
  const { slug, userId } = await paramsAs(event, ParamsSchema)
  const { role } = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { workspace: slug }, 'admin')
  const membership = await findMember(access.workspace.id, userId)
  await assertKeepsAnAdmin(access.workspace.id, membership.role, role)
  membership.role = role
  await membership.save()
  liveBridge()?.refreshRole?.(userId, access.workspace.id, role)
  const { User } = await useModels()
  return serializeMember(membership, (await User.findByPk(userId))!)
})
