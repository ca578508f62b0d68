// POST /api/rf/solve-stub — every single-stub match as [{ d, l }] in wavelengths.
// Public: a pure computation on the request's own data.
import { solveStub } from '../../../shared/rf/index'

export default defineEventHandler(async (event) => {
  refuseDeclaredOversize(event, RF_MAX_BODY_BYTES)
  const body = await readBodyAs(event, SolveStubBodySchema)
  return answerRf(() => solveStub(body))
})
