// Deletes a comment (a thread's first comment takes its replies with it): its author, or an admin.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { comment, access } = await requireComment(event, id)
  if (comment.authorId !== access.user.id && access.role !== 'admin') {
    throw createError({ statusCode: 403, message: 'Only its author or a workspace admin can delete a comment.' })
  }
  const { Comment } = await useModels()
  await (await useDb()).transaction(async (transaction) => {
    if (comment.parentId === null) await Comment.destroy({ where: { parentId: comment.id }, transaction })
    await comment.destroy({ transaction })
  })
  publishReviewEvent({ kind: 'comments', boardId: comment.boardId, id: comment.parentId ?? comment.id })
  return { ok: true, id }
})
