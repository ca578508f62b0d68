import { z } from 'zod'
import { serializeBoardListEntry } from '../../models'

const QuerySchema = z.object({ workspace: SlugSchema })

// The workspace's boards with their design frequency, band and last edit, newest first.
export default defineEventHandler(async (event) => {
  const { workspace } = await queryAs(event, QuerySchema)
  const access = await requireMember(event, { workspace }, 'reviewer')
  const { Board } = await useModels()
  const boards = await Board.findAll({
    where: { workspaceId: access.workspace.id },
    attributes: { exclude: ['state'] },
    order: [['updatedAt', 'DESC'], ['id', 'ASC']],
  })
  return boards.map(serializeBoardListEntry)
})
