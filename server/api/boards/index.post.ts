import { z } from 'zod'
import { boardJson, createBoardRow, stateBytes } from '../../database/board-store'

const BodySchema = z.object({ workspace: SlugSchema, name: NameSchema, templateId: UuidSchema.optional() })

// A blank board, or one that starts as a copy of a template's state (designers and admins).
export default defineEventHandler(async (event) => {
  const body = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { workspace: body.workspace }, 'designer')
  let state: Uint8Array | undefined
  if (body.templateId) {
    const { Template } = await useModels()
    const template = await Template.findOne({ where: { id: body.templateId, workspaceId: access.workspace.id } })
    if (!template) throw createError({ statusCode: 404, message: 'templateId: no such template in this workspace.' })
    state = stateBytes(template)
  }
  const board = await createBoardRow(await useDb(), { workspaceId: access.workspace.id, name: body.name, createdBy: access.user.id, state })
  setResponseStatus(event, 201)
  return boardJson(board, access.workspace.slug)
})
