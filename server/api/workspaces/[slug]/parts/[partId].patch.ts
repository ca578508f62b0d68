import { z } from 'zod'
import { PartIdSchema, PartInputSchema } from '../../../../../shared/library/part'

const ParamsSchema = z.object({ slug: SlugSchema, partId: PartIdSchema })

// PATCH /api/workspaces/:slug/parts/:partId — replaces the part's fields (designers and admins).
export default defineEventHandler(async (event) => {
  const { slug, partId } = await paramsAs(event, ParamsSchema)
  const part = await readBodyAs(event, PartInputSchema)
  const access = await requireMember(event, { workspace: slug }, 'designer')
  return updatePart(access.workspace.id, partId, part)
})
