import { partsToCsv } from '../../../../utils/parts-csv'

// GET /api/workspaces/:slug/parts/export — the library as a stock-list CSV, for every member.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const access = await requireMember(event, { workspace: slug }, 'reviewer')
  const parts = await listParts(access.workspace.id)
  setHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setHeader(event, 'content-disposition', `attachment; filename="${slug}-parts.csv"`)
  return partsToCsv(parts)
})
