// The signed-in user's workspaces with their role in each.
export default defineEventHandler(async (event) => {
  const user = await requireSignedIn(event)
  return workspacesOf(user.id)
})
