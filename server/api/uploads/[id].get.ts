// GET /api/uploads/:id — a stored measured file's parsed data (as parseTouchstone gives it, with
// id and fileName), for any member of its workspace; 404 for everyone else.
import { z } from 'zod'

const ParamsSchema = z.object({ id: z.string().uuid('must be an upload id') })

// The same 404 for a missing upload and for one in another workspace, never naming that workspace.
const notFound = (id: string) => createError({ statusCode: 404, message: `No upload ${id}, or you are not a member of its workspace.` })

export default defineEventHandler(async (event) => {
  await requireSignedIn(event)
  const { id } = await paramsAs(event, ParamsSchema)
  const found = await findUploadWorkspace(id)
  if (!found) throw notFound(id)
  try {
    await requireMember(event, { workspace: found.workspaceSlug }, 'reviewer')
  }
  catch (error) {
    throw (error as { statusCode?: number }).statusCode === 404 ? notFound(id) : error
  }
  const upload = await readMeasuredUpload(id)
  if (!upload) throw notFound(id)
  return upload
})
