// The client-side owner of the match-search worker (one per page, one run at a time). The hunt
// store calls `start` and `cancel`; the Worker object lives here, never in store state.
//
// Test hook (browser test and benchmark): `window.__gammaboardHunt.run(input, sliceMs?)` runs a
// SearchInput in the same worker and resolves to { status, elapsedMs, bestDb, candidates }.
import type { SearchInput, SearchResult } from '#shared/rf'
import type { HuntWorkerReply, HuntWorkerRequest } from '../workers/search-protocol'

export type HuntOutcome =
  | { status: 'done', result: SearchResult, elapsedMs: number }
  | { status: 'cancelled' | 'error', message?: string }

type Listener = { onProgress: (completed: number, total: number) => void, settle: (outcome: HuntOutcome) => void }

let worker: Worker | null = null
let runId = 0
let listener: Listener | null = null

function onReply(message: HuntWorkerReply): void {
  if (message.runId !== runId || !listener) return
  const l = listener
  switch (message.type) {
    case 'progress': l.onProgress(message.completed, message.total); return
    case 'done': listener = null; l.settle({ status: 'done', result: message.result, elapsedMs: message.elapsedMs }); return
    case 'cancelled': listener = null; l.settle({ status: 'cancelled' }); return
    case 'error': listener = null; l.settle({ status: 'error', message: message.message })
  }
}

function post(request: HuntWorkerRequest): void {
  if (!worker) {
    worker = new Worker(new URL('../workers/search.worker.ts', import.meta.url), { type: 'module' })
    worker.onmessage = (event: MessageEvent<HuntWorkerReply>) => onReply(event.data)
    worker.onerror = (event) => {
      const l = listener
      listener = null
      l?.settle({ status: 'error', message: event.message || 'The search worker failed to start.' })
    }
  }
  worker.postMessage(request)
}

/** Starts a search of `input` (plain data only); an earlier run is superseded (it settles 'cancelled'). */
function start(input: SearchInput, onProgress: Listener['onProgress'], sliceMs?: number): Promise<HuntOutcome> {
  listener?.settle({ status: 'cancelled' })
  runId += 1
  return new Promise((settle) => {
    listener = { onProgress, settle }
    try {
      post({ type: 'start', runId, input, sliceMs })
    }
    catch (e) {
      listener = null
      settle({ status: 'error', message: e instanceof Error ? e.message : String(e) })
    }
  })
}

function cancel(): void {
  if (listener) post({ type: 'cancel', runId })
}

function installTestHook(): void {
  if (typeof window === 'undefined') return
  ;(window as unknown as Record<string, unknown>).__gammaboardHunt = {
    run: async (input: SearchInput, sliceMs?: number) => {
      const outcome = await start(input, () => {}, sliceMs)
      return outcome.status === 'done'
        ? { status: 'done', elapsedMs: outcome.elapsedMs, bestDb: outcome.result.candidates[0]?.worstReturnLossDb ?? null, candidates: outcome.result.candidates.length }
        : { status: outcome.status, elapsedMs: null, bestDb: null, candidates: 0 }
    },
  }
}

export function useHuntWorker() {
  return { start, cancel, installTestHook }
}
