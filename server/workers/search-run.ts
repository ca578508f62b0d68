// The match-search worker thread: one search at a time, the result posted back. Bad arguments
// come back with the RfInputError's argument so the route can answer a 400 naming it.
import { parentPort } from 'node:worker_threads'
import { RfInputError, searchMatches } from '../../shared/rf/index'
import type { SearchThreadReply, SearchThreadRequest } from './search-protocol'

parentPort!.on('message', (request: SearchThreadRequest) => {
  let reply: SearchThreadReply
  try {
    reply = { id: request.id, ok: true, result: searchMatches(request.input) }
  }
  catch (error) {
    reply = error instanceof RfInputError
      ? { id: request.id, ok: false, argument: error.argument, message: error.message }
      : { id: request.id, ok: false, internal: error instanceof Error ? error.message : String(error) }
  }
  parentPort!.postMessage(reply)
})
