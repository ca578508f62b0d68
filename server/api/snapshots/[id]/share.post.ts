import { z } from 'zod'

const BodySchema = z.object({
  email: EmailSchema,
  note: z.string({ error: 'must be text' }).trim().max(500, 'must be at most 500 characters').optional(),
})

// Mails a link to the snapshot's board to another member of the workspace (only members: this
// must not become a way to send mail to anyone).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const body = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { snapshotId: id }, 'reviewer')
  const { User, Membership } = await useModels()
  const recipient = await User.findOne({ where: { email: body.email }, attributes: ['id', 'email'] })
  if (!recipient || !await Membership.count({ where: { userId: recipient.id, workspaceId: access.workspace.id } })) {
    throw createError({ statusCode: 422, message: 'email: only members of this workspace can receive a shared snapshot.' })
  }
  const link = `${publicOrigin()}/boards/${access.board!.id}?snapshot=${access.snapshot!.id}`
  await sendMail({
    to: recipient.email, kind: 'snapshot-shared', workspaceId: access.workspace.id,
    ...snapshotSharedMail({ senderName: access.user.name, boardName: access.board!.name, label: access.snapshot!.label, link, note: body.note }),
  })
  return { ok: true }
})
