import { randomUUID } from 'node:crypto'
import { serializeVerdict } from '../../../models'

// A verdict on a snapshot: approved or changes requested, with a note. Reviewers and admins give
// them, never the snapshot's own author (a design is not approved by the one who drew it).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { verdict, note } = await readBodyAs(event, VerdictSchema)
  const access = await requireMember(event, { snapshotId: id }, 'reviewer')
  if (access.role === 'designer') throw createError({ statusCode: 403, message: 'Verdicts are given by reviewers and admins.' })
  if (access.snapshot!.authorId === access.user.id) throw createError({ statusCode: 403, message: 'The snapshot\'s own author cannot give it a verdict.' })
  const { Verdict } = await useModels()
  const row = await Verdict.create({ id: randomUUID(), snapshotId: id, giverId: access.user.id, verdict, note: note?.trim() || null })
  publishReviewEvent({ kind: 'verdicts', boardId: access.board!.id, id })
  setResponseStatus(event, 201)
  return serializeVerdict(row, access.user)
})
