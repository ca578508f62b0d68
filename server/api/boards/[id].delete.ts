// Deletes the board with its snapshots; templates published from it keep their own copy.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  const { board } = await requireMember(event, { boardId: id }, 'designer')
  await board!.destroy()
  return { ok: true }
})
