import { serializeSnapshot } from '../../../models'

// Designers and admins restore: the present state is kept as a snapshot first, then the
// snapshot's content becomes a new forward change that live editors receive like any edit.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const access = await requireMember(event, { snapshotId: id }, 'designer')
  const kept = await restoreSnapshot(access.board!, access.snapshot!, access.user)
  return { board: await loadBoard(access.board!.id), kept: serializeSnapshot(kept, access.user) }
})
