// POST /api/rf/trace — the impedances after 0…n elements at one frequency, as trace() gives them.
// Public: a pure computation on the request's own data. An open is sent as { re: "Infinity", im: 0 }.
import { trace } from '../../../shared/rf/index'

export default defineEventHandler(async (event) => {
  refuseDeclaredOversize(event, RF_MAX_BODY_BYTES)
  const body = await readBodyAs(event, TraceBodySchema)
  return answerRf(() => trace(body))
})
