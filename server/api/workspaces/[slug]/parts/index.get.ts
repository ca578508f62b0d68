// GET /api/workspaces/:slug/parts — the parts library, for every member (reviewers read it).
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'reviewer')
  return listParts(access.workspace.id)
})
