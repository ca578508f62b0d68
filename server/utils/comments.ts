// Review threads on a board: a thread's first comment carries the anchor and the resolution;
// replies hang off it (a reply to a reply joins the same thread). Element anchors follow the
// element by id, so a reordered ladder keeps them; a removed element is reported, not hidden.
import { randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'
import { Op } from 'sequelize'
import {
  anchorColumns, anchorOf, roleAtLeast, type CommentAnchor, type CommentInstance, type Role, type UserInstance,
} from '../models'

type Person = { id: number, name: string } | null
export interface PublicReply {
  id: string
  threadId: string
  body: string
  author: Person
  authorName: string | null
  createdAt: string
  editedAt: string | null
}

export interface PublicComment extends Omit<PublicReply, 'threadId'> {
  boardId: string
  anchor: CommentAnchor | null
  /** For an element anchor: its place in the ladder now (0 next to the load), or null once removed. */
  elementIndex: number | null
  elementRemoved: boolean
  resolved: boolean
  resolvedAt: string | null
  resolvedBy: Person
  replies: PublicReply[]
}

function replyOf(c: CommentInstance, names: Map<number, string>): PublicReply {
  const author = c.authorId !== null && names.has(c.authorId) ? { id: c.authorId, name: names.get(c.authorId)! } : null
  return {
    id: c.id, threadId: c.parentId ?? c.id, body: c.body, author, authorName: author?.name ?? null,
    createdAt: c.createdAt.toISOString(), editedAt: c.editedAt?.toISOString() ?? null,
  }
}

/** Every thread of the board, oldest first, each with its replies, as plain objects. */
export async function listThreads(boardId: string): Promise<PublicComment[]> {
  const { Comment, User } = await useModels()
  const rows = await Comment.findAll({ where: { boardId }, order: [['createdAt', 'ASC'], ['id', 'ASC']] })
  const ids = [...new Set(rows.flatMap(r => [r.authorId, r.resolvedBy]).filter((x): x is number => x !== null))]
  const users = ids.length ? await User.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'name'] }) : []
  const names = new Map(users.map(u => [u.id, u.name]))
  const board = await loadBoard(boardId)
  const elementIds = (board?.elements ?? []).map(e => e.id)
  const threads = rows.filter(r => r.parentId === null)
  return threads.map((t) => {
    const index = t.anchorKind === 'element' ? elementIds.indexOf(t.elementId!) : -1
    const { threadId: _thread, ...own } = replyOf(t, names)
    return {
      ...own,
      boardId: t.boardId,
      anchor: anchorOf(t),
      elementIndex: index >= 0 ? index : null,
      elementRemoved: t.anchorKind === 'element' && index < 0,
      resolved: t.resolvedAt !== null,
      resolvedAt: t.resolvedAt?.toISOString() ?? null,
      resolvedBy: t.resolvedBy !== null && names.has(t.resolvedBy) ? { id: t.resolvedBy, name: names.get(t.resolvedBy)! } : null,
      replies: rows.filter(r => r.parentId === t.id).map(r => replyOf(r, names)),
    }
  })
}

/** Checks an element anchor against the board as it is now (400 naming the field). */
export async function checkAnchor(boardId: string, anchor: CommentAnchor | undefined): Promise<void> {
  if (anchor?.kind !== 'element') return
  const board = await loadBoard(boardId)
  if (!board?.elements.some(e => e.id === anchor.elementId)) {
    throw createError({ statusCode: 400, message: 'Invalid body: anchor.elementId: there is no such element on this board.' })
  }
}

/** A comment and the board it lives on, with the caller's access; 404 for what the caller may not see. */
export async function requireComment(event: H3Event, id: string) {
  const { Comment } = await useModels()
  const comment = await Comment.findByPk(id)
  if (!comment) throw createError({ statusCode: 404, message: `No comment ${id}, or you are not a member of its workspace.` })
  try {
    const access = await requireMember(event, { boardId: comment.boardId }, 'reviewer')
    return { comment, access }
  }
  catch (error) {
    // Not the caller's to see: the same answer as a comment that does not exist.
    if ((error as { statusCode?: number }).statusCode === 404) throw createError({ statusCode: 404, message: `No comment ${id}, or you are not a member of its workspace.` })
    throw error
  }
}

export async function createComment(input: { boardId: string, author: UserInstance, body: string, anchor?: CommentAnchor, parentId?: string }) {
  const { Comment } = await useModels()
  return Comment.create({
    id: randomUUID(), boardId: input.boardId, parentId: input.parentId ?? null, authorId: input.author.id,
    body: input.body, ...anchorColumns(input.parentId ? undefined : input.anchor),
  })
}

/** May `user` with `role` resolve or reopen the thread? Its author, designers and admins. */
export function canResolve(thread: CommentInstance, user: UserInstance, role: Role): boolean {
  return thread.authorId === user.id || roleAtLeast(role, 'designer')
}

/** The thread a comment belongs to (itself for a first comment). */
export async function threadOf(comment: CommentInstance): Promise<CommentInstance> {
  if (comment.parentId === null) return comment
  const { Comment } = await useModels()
  return (await Comment.findByPk(comment.parentId))!
}

/** The comment as the API shows it: a thread with its replies, or a reply. */
export async function publicCommentOf(comment: CommentInstance): Promise<PublicComment | PublicReply> {
  const threads = await listThreads(comment.boardId)
  const thread = threads.find(t => t.id === (comment.parentId ?? comment.id))!
  return comment.parentId === null ? thread : thread.replies.find(r => r.id === comment.id)!
}
