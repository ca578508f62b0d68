// Edits a comment's text: its author only.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { body } = await readBodyAs(event, ReplySchema)
  const { comment, access } = await requireComment(event, id)
  if (comment.authorId !== access.user.id) throw createError({ statusCode: 403, message: 'Only its author can edit a comment.' })
  await comment.update({ body, editedAt: new Date() })
  publishReviewEvent({ kind: 'comments', boardId: comment.boardId, id: comment.parentId ?? comment.id })
  return publicCommentOf(comment)
})
