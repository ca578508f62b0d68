import { z } from 'zod'
import { serializeBoardListEntry } from '../../models'
import { liveBridge } from '../../database/live-bridge'

const QuerySchema = z.object({ workspace: SlugSchema })

// The workspace's boards with their design frequency, band and last edit, newest first, and who
// is in each one now (from the live rooms; nothing about presence is stored).
export default defineEventHandler(async (event) => {
  const { workspace } = await queryAs(event, QuerySchema)
  const access = await requireMember(event, { workspace }, 'reviewer')
  const { Board } = await useModels()
  const boards = await Board.findAll({
    where: { workspaceId: access.workspace.id },
    attributes: { exclude: ['state'] },
    order: [['updatedAt', 'DESC'], ['id', 'ASC']],
  })
  const present = await liveBridge()?.presentInMany?.(boards.map(board => board.id))
  return boards.map(board => ({ ...serializeBoardListEntry(board), present: present?.get(board.id) ?? [] }))
})
