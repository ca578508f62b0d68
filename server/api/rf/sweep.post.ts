// POST /api/rf/sweep — the source-end impedance at each frequency, as sweep() gives it.
// Public: a pure computation on the request's own data. An open is sent as { re: "Infinity", im: 0 }.
import { sweep } from '../../../shared/rf/index'

export default defineEventHandler(async (event) => {
  refuseDeclaredOversize(event, RF_MAX_BODY_BYTES)
  const body = await readBodyAs(event, SweepBodySchema)
  return answerRf(() => sweep(body))
})
