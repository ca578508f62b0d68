// @mentions in comment text: "@Name" of a member of the board's workspace (names may hold spaces,
// so the members' names are matched, longest first, case-insensitively), each mailed once with a
// link that opens the board at the thread.
import type { H3Event } from 'h3'
import type { UserInstance } from '../models'

/** The members of `workspaceId` whose name follows an @ in `text` (the writer excluded). */
export async function mentionedMembers(text: string, workspaceId: number, writerId: number): Promise<UserInstance[]> {
  if (!text.includes('@')) return []
  const { Membership, User } = await useModels()
  const memberships = await Membership.findAll({ where: { workspaceId }, include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }] })
  const users = memberships.map(m => (m as unknown as { user: UserInstance }).user).filter(u => u && u.id !== writerId)
  const lower = text.toLowerCase()
  return users
    .filter(u => u.name.trim() !== '')
    .filter((u) => {
      const tag = `@${u.name.toLowerCase()}`
      let at = lower.indexOf(tag)
      while (at >= 0) {
        // The name must end there: "@Ada" is not a mention of "Adam".
        const after = lower[at + tag.length]
        if (after === undefined || !/[\p{L}\p{N}_]/u.test(after)) return true
        at = lower.indexOf(tag, at + 1)
      }
      return false
    })
}

/** Mails each member mentioned in a comment; a link opens the board at the thread. */
export async function mailMentions(event: H3Event, input: { text: string, workspaceId: number, writer: UserInstance, boardId: string, boardName: string, threadId: string }) {
  const people = await mentionedMembers(input.text, input.workspaceId, input.writer.id)
  const link = `${publicOrigin(event)}/boards/${encodeURIComponent(input.boardId)}?comment=${input.threadId}`
  for (const person of people) {
    await sendMail({
      to: person.email, kind: 'comment-mention', workspaceId: input.workspaceId,
      ...commentMentionMail({ writerName: input.writer.name, boardName: input.boardName, excerpt: input.text, link }),
    })
  }
  return people.length
}
