// Reopens a thread: its author, designers and admins (a reviewer may reopen only their own).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { comment, access } = await requireComment(event, id)
  if (comment.parentId !== null) throw createError({ statusCode: 400, message: 'id: a reply cannot be reopened on its own; reopen its thread.' })
  if (!canResolve(comment, access.user, access.role)) {
    throw createError({ statusCode: 403, message: 'Only the thread\'s author, designers and admins can reopen it.' })
  }
  await comment.update({ resolvedAt: null, resolvedBy: null })
  publishReviewEvent({ kind: 'comments', boardId: comment.boardId, id: comment.id })
  return publicCommentOf(comment)
})
