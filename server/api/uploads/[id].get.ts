// GET /api/uploads/:id — a stored measured file's parsed data (as parseTouchstone gives it, with
// id and fileName), for any member of its workspace; 404 for everyone else.
import { z } from 'zod'

const ParamsSchema = z.object({ id: z.string().uuid('must be an upload id') })

export default defineEventHandler(async (event) => {
  await requireSignedIn(event)
  const { id } = await paramsAs(event, ParamsSchema)
  const found = await findUploadWorkspace(id)
  if (!found) throw createError({ statusCode: 404, message: `No upload ${id}, or you are not a member of its workspace.` })
  await requireMember(event, { workspace: found.workspaceSlug }, 'reviewer')
  const upload = await readMeasuredUpload(id)
  if (!upload) throw createError({ statusCode: 404, message: `No upload ${id}, or you are not a member of its workspace.` })
  return upload
})
