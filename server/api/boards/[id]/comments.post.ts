// A new thread on the board. Every member may comment, reviewers included (comments never change
// the ladder); mentioned members are mailed a link to the thread.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  const { body, anchor } = await readBodyAs(event, NewCommentSchema)
  const access = await requireMember(event, { boardId: id }, 'reviewer')
  await checkAnchor(id, anchor)
  const comment = await createComment({ boardId: id, author: access.user, body, anchor })
  publishReviewEvent({ kind: 'comments', boardId: id, id: comment.id })
  await mailMentions(event, { text: body, workspaceId: access.workspace.id, writer: access.user, boardId: id, boardName: access.board!.name, threadId: comment.id })
  setResponseStatus(event, 201)
  return publicCommentOf(comment)
})
