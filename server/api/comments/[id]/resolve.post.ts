// Resolves a thread: its author, designers and admins (a reviewer may resolve only their own).
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { comment, access } = await requireComment(event, id)
  if (comment.parentId !== null) throw createError({ statusCode: 400, message: 'id: a reply cannot be resolved on its own; resolve its thread.' })
  if (!canResolve(comment, access.user, access.role)) {
    throw createError({ statusCode: 403, message: 'Only the thread\'s author, designers and admins can resolve it.' })
  }
  await comment.update({ resolvedAt: new Date(), resolvedBy: access.user.id })
  publishReviewEvent({ kind: 'comments', boardId: comment.boardId, id: comment.id })
  return publicCommentOf(comment)
})
