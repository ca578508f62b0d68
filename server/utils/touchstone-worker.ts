// Uploaded Touchstone files are read in a worker thread (one at a time), so a large or hostile
// file never blocks the event loop. A file past PARSE_TIMEOUT_MS, or one that runs the thread out
// of its heap, ends that thread (the next file gets a fresh one) and its caller gets a 422; past
// MAX_WAITING files in line, callers get a 503.
import workerSource from '#touchstone-worker-source'
import type { TouchstoneLimits } from '../../shared/rf/touchstone'
import type { TouchstoneParseReply, TouchstoneParseRequest, TouchstoneSummary } from '../workers/touchstone-protocol'

const PARSE_TIMEOUT_MS = 15_000
const WORKER_HEAP_MB = 384
const MAX_WAITING = 16

export interface ParsedTouchstoneText {
  /** The parsed data as JSON text (as parseTouchstone returns it). */
  json: string
  summary: TouchstoneSummary
}

let pool: ReturnType<typeof createThreadPool<TouchstoneParseRequest, TouchstoneParseReply>> | undefined
let nextId = 1

/**
 * Parses `data` (the file's bytes; the thread gets a copy) in the worker. Answers the JSON text
 * and a summary; throws a 422 with data { line, column?, code } for a file that cannot be read
 * within `limits` and `maxJsonChars`.
 */
export async function parseTouchstoneOffThread(data: Uint8Array, fileName: string, limits: TouchstoneLimits, maxJsonChars: number): Promise<ParsedTouchstoneText> {
  pool ??= createThreadPool<TouchstoneParseRequest, TouchstoneParseReply>({
    source: workerSource, size: 1, timeoutMs: PARSE_TIMEOUT_MS, maxWaiting: MAX_WAITING, heapMb: WORKER_HEAP_MB,
  })
  let reply: TouchstoneParseReply
  try {
    reply = await pool.run({ id: nextId++, bytes: data, fileName, limits, maxJsonChars })
  }
  catch (error) {
    if (!(error instanceof ThreadPoolError)) throw error
    if (error.reason === 'busy') throw createError({ statusCode: 503, message: 'Too many files are being read right now; try again in a moment.' })
    const why = error.reason === 'timeout' ? error.message : `could not be read within the reader's ${WORKER_HEAP_MB} MB memory limit`
    throw createError({ statusCode: 422, message: `${fileName.slice(0, 40)}: ${why}`, data: { line: null, code: 'too-large' } })
  }
  if (reply.ok) return { json: reply.json, summary: reply.summary }
  if ('failure' in reply) {
    const { message, ...where } = reply.failure
    throw createError({ statusCode: 422, message, data: where })
  }
  throw new Error(`Touchstone worker: ${reply.internal}`)
}
