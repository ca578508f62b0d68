import { serializeSnapshot, serializeVerdict, type UserInstance, type VerdictInstance } from '../../../models'

// The board's snapshots, newest first, with label, author and time, and each verdict (oldest
// first) with its giver's name.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  await requireMember(event, { boardId: id }, 'reviewer')
  const { Snapshot, User, Verdict } = await useModels()
  const snapshots = await Snapshot.findAll({
    where: { boardId: id },
    attributes: { exclude: ['state'] },
    include: [
      { model: User, as: 'author', attributes: ['id', 'name'] },
      { model: Verdict, as: 'verdicts', include: [{ model: User, as: 'giver', attributes: ['id', 'name'] }] },
    ],
    order: [['createdAt', 'DESC'], ['id', 'ASC']],
  })
  return snapshots.map((s) => {
    const verdicts = ((s as unknown as { verdicts?: VerdictInstance[] }).verdicts ?? [])
      .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime())
      .map(v => serializeVerdict(v, (v as unknown as { giver?: UserInstance | null }).giver ?? null))
    return { ...serializeSnapshot(s, authorOf(s)), verdicts }
  })
})
