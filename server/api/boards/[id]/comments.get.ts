// The board's review threads, oldest first, each with its author's name, replies and resolution.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  await requireMember(event, { boardId: id }, 'reviewer')
  return listThreads(id)
})
