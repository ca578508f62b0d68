import { z } from 'zod'
import { PartIdSchema } from '../../../../../shared/library/part'

const ParamsSchema = z.object({ slug: SlugSchema, partId: PartIdSchema })

// DELETE /api/workspaces/:slug/parts/:partId — removes it from the library (designers and admins).
// Boards that use it keep their copy of its model and identifier.
export default defineEventHandler(async (event) => {
  const { slug, partId } = await paramsAs(event, ParamsSchema)
  const access = await requireMember(event, { workspace: slug }, 'designer')
  await deletePart(access.workspace.id, partId)
  return { ok: true }
})
