import { serializeTemplate, type UserInstance } from '../../../models'

// The template gallery: every member may start from a published template.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'reviewer')
  const { Template, User } = await useModels()
  const templates = await Template.findAll({
    where: { workspaceId: access.workspace.id },
    attributes: { exclude: ['state'] },
    include: [{ model: User, as: 'publisher', attributes: ['id', 'name'] }],
    order: [['createdAt', 'DESC']],
  })
  return templates.map(t => serializeTemplate(t, (t as unknown as { publisher: UserInstance | null }).publisher))
})
