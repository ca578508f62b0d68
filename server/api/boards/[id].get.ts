// GET /api/boards/:id — one board as JSON: { id, name, workspace, settings, elements, updatedAt },
// for any member of its workspace (404 for everyone else).
import { z } from 'zod'

const ParamsSchema = z.object({
  id: z.string().min(1).max(100).regex(/^[A-Za-z0-9-]+$/, 'must be letters, digits and dashes'),
})

export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, ParamsSchema)
  await requireMember(event, { boardId: id }, 'reviewer')
  const board = await loadBoard(id)
  if (!board) throw createError({ statusCode: 404, message: `No board with id ${id}` })
  return board
})
