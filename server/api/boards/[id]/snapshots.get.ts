import { serializeSnapshot } from '../../../models'

// The board's snapshots, newest first, with label, author and time.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  await requireMember(event, { boardId: id }, 'reviewer')
  const { Snapshot, User } = await useModels()
  const snapshots = await Snapshot.findAll({
    where: { boardId: id },
    attributes: { exclude: ['state'] },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
    order: [['createdAt', 'DESC'], ['id', 'ASC']],
  })
  return snapshots.map(s => serializeSnapshot(s, authorOf(s)))
})
