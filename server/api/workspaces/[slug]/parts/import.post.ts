import { z } from 'zod'
import { PartCsvError, parsePartsCsv } from '../../../../utils/parts-csv'

const BodySchema = z.object({ csv: z.string().min(1, 'must hold the stock list').max(1_000_000, 'at most 1 MB of CSV') })

// POST /api/workspaces/:slug/parts/import { csv } — a stock list (columns: shared/library/csv-columns.ts).
// The first bad row refuses the whole file (422 naming row and column); nothing is half-imported.
export default defineEventHandler(async (event) => {
  const { slug } = await paramsAs(event, SlugParams)
  const { csv } = await readBodyAs(event, BodySchema)
  const access = await requireMember(event, { workspace: slug }, 'designer')
  let parts
  try {
    parts = parsePartsCsv(csv)
  }
  catch (error) {
    if (!(error instanceof PartCsvError)) throw error
    throw createError({ statusCode: 422, message: error.message, data: { row: error.row, column: error.column } })
  }
  return importParts(access.workspace.id, parts)
})
