import { randomUUID } from 'node:crypto'
import { z } from 'zod'
import { serializeTemplate } from '../../../models'

const BodySchema = z.object({ name: NameSchema.optional() })

// Admins publish a snapshot as a workspace template (a copy: it outlives the board).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const body = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { snapshotId: id }, 'admin')
  const snapshot = access.snapshot!
  const { Template } = await useModels()
  const template = await Template.create({
    id: randomUUID(), workspaceId: access.workspace.id, snapshotId: snapshot.id,
    name: body.name ?? snapshot.label, state: snapshot.state, summary: snapshot.summary, publishedBy: access.user.id,
  })
  setResponseStatus(event, 201)
  return serializeTemplate(template, access.user)
})
