import { z } from 'zod'
import { serializeBoardListEntry } from '../../models'

const BodySchema = z.object({ name: NameSchema })

// Rename (the name lives in the row, not in the document).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  const { name } = await readBodyAs(event, BodySchema)
  const { board } = await requireMember(event, { boardId: id }, 'designer')
  board!.name = name
  await board!.save()
  return serializeBoardListEntry(board!)
})
