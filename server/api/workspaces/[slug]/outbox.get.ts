import { serializeOutboxMessage } from '../../../models'

// The mail catcher's messages that concern this workspace (invitations, shared snapshots), for its
// admins. Password-reset mail belongs to no workspace and is never shown here.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'admin')
  const { OutboxMessage } = await useModels()
  const messages = await OutboxMessage.findAll({
    where: { workspaceId: access.workspace.id },
    attributes: { exclude: ['raw'] },
    order: [['id', 'DESC']],
    limit: 200,
  })
  return messages.map(serializeOutboxMessage)
})
