import { serializeWorkspace } from '../../../models'

export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'reviewer')
  return { ...serializeWorkspace(access.workspace), role: access.role }
})
