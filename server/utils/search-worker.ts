// Match searches run in worker threads (two at most, one per core), so the live server keeps
// answering while they work; a search past SEARCH_TIMEOUT_MS is ended and answered 503.
import workerSource from '#search-worker-source'
import type { SearchInput, SearchResult } from '../../shared/rf/index'
import type { SearchThreadReply, SearchThreadRequest } from '../workers/search-protocol'

export const SEARCH_TIMEOUT_MS = Number(process.env.GAMMABOARD_SEARCH_TIMEOUT_MS) || 20_000
const SEARCH_THREADS = 2
const SEARCH_MAX_WAITING = 8

let pool: ReturnType<typeof createThreadPool<SearchThreadRequest, SearchThreadReply>> | undefined
let nextId = 1

/** The search's result, a 400 naming a bad argument, or a 503 when it runs too long or too many wait. */
export async function searchOffThread(input: SearchInput): Promise<SearchResult> {
  pool ??= createThreadPool<SearchThreadRequest, SearchThreadReply>({
    source: workerSource, size: SEARCH_THREADS, timeoutMs: SEARCH_TIMEOUT_MS, maxWaiting: SEARCH_MAX_WAITING, heapMb: 256,
  })
  let reply: SearchThreadReply
  try {
    reply = await pool.run({ id: nextId++, input })
  }
  catch (error) {
    if (error instanceof ThreadPoolError && error.reason !== 'crashed') {
      const message = error.reason === 'timeout'
        ? `The search ${error.message}; try fewer frequencies, fewer parts or a coarser series.`
        : 'Too many searches are running right now; try again in a moment.'
      throw createError({ statusCode: 503, message })
    }
    throw error
  }
  if (reply.ok) return reply.result
  if ('argument' in reply) throw createError({ statusCode: 400, message: reply.message, data: { argument: reply.argument } })
  throw new Error(`search worker: ${reply.internal}`)
}
