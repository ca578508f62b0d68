import { z } from 'zod'
import { serializeSnapshot } from '../../../models'

const BodySchema = z.object({ label: NameSchema })

// Every member may take a snapshot, reviewers included (it does not change the board).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  const { label } = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { boardId: id }, 'reviewer')
  const snapshot = await takeSnapshot(access.board!, label, access.user)
  setResponseStatus(event, 201)
  return serializeSnapshot(snapshot, access.user)
})
