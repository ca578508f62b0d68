// POST /api/rf/solve-l — every lossless two-element L network from `from` to `to` (element arrays).
// Public: a pure computation on the request's own data.
import { solveL } from '../../../shared/rf/index'

export default defineEventHandler(async (event) => {
  refuseDeclaredOversize(event, RF_MAX_BODY_BYTES)
  const body = await readBodyAs(event, SolveLBodySchema)
  return answerRf(() => solveL(body))
})
