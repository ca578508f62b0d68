import { PartInputSchema } from '../../../../../shared/library/part'

// POST /api/workspaces/:slug/parts — adds a part (designers and admins); 409 for an identifier in use.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const part = await readBodyAs(event, PartInputSchema)
  const access = await requireMember(event, { workspace: slug }, 'designer')
  setResponseStatus(event, 201)
  return createPart(access.workspace.id, part)
})
