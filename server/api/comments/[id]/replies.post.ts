// A reply to a thread (a reply to a reply joins the same thread); any member may reply.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { body } = await readBodyAs(event, ReplySchema)
  const { comment, access } = await requireComment(event, id)
  const thread = await threadOf(comment)
  const reply = await createComment({ boardId: thread.boardId, author: access.user, body, parentId: thread.id })
  publishReviewEvent({ kind: 'comments', boardId: thread.boardId, id: thread.id })
  await mailMentions(event, { text: body, workspaceId: access.workspace.id, writer: access.user, boardId: thread.boardId, boardName: access.board!.name, threadId: thread.id })
  setResponseStatus(event, 201)
  return publicCommentOf(reply)
})
