import { Op } from 'sequelize'
import { serializeInvitation } from '../../../../models'

// Pending (unused, unexpired) invitations, for admins.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'admin')
  const { Invitation } = await useModels()
  const pending = await Invitation.findAll({
    where: { workspaceId: access.workspace.id, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [['createdAt', 'DESC']],
  })
  return pending.map(serializeInvitation)
})
