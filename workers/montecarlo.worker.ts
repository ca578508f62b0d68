/// <reference lib="webworker" />
// Runs a Monte Carlo tolerance analysis off the main thread. The run is taken in time slices;
// between slices the worker posts its progress and yields to its message queue, so a `cancel`
// sent meanwhile is seen within one slice (about 50 ms). A new `start` supersedes a running one.
import { createMonteCarlo } from '../shared/rf/montecarlo'
import { yieldToMessages } from './yield-to-messages'
import type { MonteCarloWorkerRequest, MonteCarloWorkerReply } from './montecarlo-protocol'

const scope = self as unknown as DedicatedWorkerGlobalScope
let current: { runId: number, isCancelled: boolean } | null = null

function reply(message: MonteCarloWorkerReply, transfer: Transferable[] = []): void {
  scope.postMessage(message, transfer)
}

async function run(request: Extract<MonteCarloWorkerRequest, { type: 'start' }>): Promise<void> {
  if (current) current.isCancelled = true
  const state = { runId: request.runId, isCancelled: false }
  current = state
  const started = performance.now()
  try {
    const mc = createMonteCarlo(request.input)
    const sliceMs = request.sliceMs ?? 50
    reply({ type: 'progress', runId: state.runId, completed: 0, total: mc.total })
    while (mc.completed < mc.total) {
      const sliceStart = performance.now()
      while (mc.completed < mc.total && performance.now() - sliceStart < sliceMs) mc.step(64)
      reply({ type: 'progress', runId: state.runId, completed: mc.completed, total: mc.total })
      await yieldToMessages()
      if (state.isCancelled) {
        reply({ type: 'cancelled', runId: state.runId, completed: mc.completed, total: mc.total })
        return
      }
    }
    const result = mc.result()
    const elapsedMs = performance.now() - started
    reply({ type: 'done', runId: state.runId, result, elapsedMs },
      [result.worstReturnLossDb.buffer, result.cloudRe.buffer, result.cloudIm.buffer])
  }
  catch (error) {
    reply({ type: 'error', runId: state.runId, message: error instanceof Error ? error.message : String(error) })
  }
  finally {
    if (current === state) current = null
  }
}

scope.onmessage = (event: MessageEvent<MonteCarloWorkerRequest>) => {
  const request = event.data
  if (request.type === 'cancel') {
    if (current && current.runId === request.runId) current.isCancelled = true
    return
  }
  if (request.type === 'start') void run(request)
}
