/// <reference lib="webworker" />
// Runs a match search off the main thread, in time slices: between slices it posts its progress
// and yields to its message queue, so a `cancel` is seen within one slice (about 50 ms). A new
// `start` supersedes a running one.
import { createMatchSearch } from '../shared/rf/search'
import { yieldToMessages } from './yield-to-messages'
import type { HuntWorkerReply, HuntWorkerRequest } from './search-protocol'

const scope = self as unknown as DedicatedWorkerGlobalScope
let current: { runId: number, isCancelled: boolean } | null = null

function reply(message: HuntWorkerReply): void {
  scope.postMessage(message)
}

async function run(request: Extract<HuntWorkerRequest, { type: 'start' }>): Promise<void> {
  if (current) current.isCancelled = true
  const state = { runId: request.runId, isCancelled: false }
  current = state
  const started = performance.now()
  try {
    const search = createMatchSearch(request.input)
    const sliceMs = request.sliceMs ?? 50
    reply({ type: 'progress', runId: state.runId, completed: 0, total: search.total })
    while (!search.isDone) {
      const sliceStart = performance.now()
      while (!search.isDone && performance.now() - sliceStart < sliceMs) search.step(1)
      reply({ type: 'progress', runId: state.runId, completed: search.completed, total: search.total })
      await yieldToMessages()
      if (state.isCancelled) {
        reply({ type: 'cancelled', runId: state.runId, completed: search.completed, total: search.total })
        return
      }
    }
    reply({ type: 'done', runId: state.runId, result: search.result(), elapsedMs: performance.now() - started })
  }
  catch (error) {
    reply({ type: 'error', runId: state.runId, message: error instanceof Error ? error.message : String(error) })
  }
  finally {
    if (current === state) current = null
  }
}

scope.onmessage = (event: MessageEvent<HuntWorkerRequest>) => {
  const request = event.data
  if (request.type === 'cancel') {
    if (current && current.runId === request.runId) current.isCancelled = true
    return
  }
  if (request.type === 'start') void run(request)
}
