// Everyone in the workspace may see who else is in it.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'reviewer')
  return membersOf(access.workspace.id)
})
