import { liveBridge } from '../../database/live-bridge'

// Deletes the board with its snapshots; templates published from it keep their own copy. Anyone
// with it open is disconnected at once (their later edits would otherwise vanish unsaved).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  const { board } = await requireMember(event, { boardId: id }, 'designer')
  await board!.destroy()
  liveBridge()?.closeBoard?.(id)
  return { ok: true }
})
