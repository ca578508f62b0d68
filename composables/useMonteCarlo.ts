// The client-side owner of the Monte Carlo worker: starts a run, follows its progress, cancels it,
// and keeps the last result (yield, histogram) and its cloud of end points here; the board store
// exposes the cloud to the chart (composables sit below stores and never import them). One worker and one run at a time for the page; state is shared by every caller.
//
// Test hook (for the browser test and the benchmark): while a board page is open,
// `window.__gammaboardMonteCarlo.run(input, sliceMs?)` runs `input` (a MonteCarloInput) in the
// worker and resolves to { yield, trials, elapsedMs, status }; progress and cancel go through
// the same state as the panel's; `progress()` and `cloud()` read that state.
import { shallowRef, ref } from 'vue'
import { histogramOf, type Complex, type Histogram, type MonteCarloInput } from '#shared/rf'
import type { MonteCarloWorkerReply, MonteCarloWorkerRequest } from '../workers/montecarlo-protocol'

export type MonteCarloStatus = 'idle' | 'running' | 'done' | 'cancelled' | 'error'

export interface MonteCarloSummary {
  trials: number
  passes: number
  yield: number
  nominalWorstReturnLossDb: number
  histogram: Histogram
  /** Lowest and median worst in-band return loss over the trials (dB). */
  lowestReturnLossDb: number
  medianReturnLossDb: number
  elapsedMs: number
  /** The analysis key the run was made for (see `isStale`). */
  key: string
}

export interface RunOutcome {
  status: MonteCarloStatus
  yield: number | null
  trials: number
  elapsedMs: number | null
}

const status = ref<MonteCarloStatus>('idle')
const completed = ref(0)
const total = ref(0)
const error = ref<string | null>(null)
const summary = shallowRef<MonteCarloSummary | null>(null)
/** The last run's end points (the chart's cloud); shallow: a few thousand plain points. */
const cloudPoints = shallowRef<Complex[] | null>(null)

let worker: Worker | null = null
let runId = 0
let settle: ((outcome: RunOutcome) => void) | null = null
let runKey = ''

function median(values: Float64Array): number {
  if (values.length === 0) return NaN
  const sorted = Float64Array.from(values).sort()
  return sorted[Math.floor(sorted.length / 2)]!
}

function finish(outcome: RunOutcome): void {
  settle?.(outcome)
  settle = null
}

function onReply(message: MonteCarloWorkerReply): void {
  if (message.runId !== runId) return // an answer to a superseded run
  switch (message.type) {
    case 'progress':
      completed.value = message.completed
      total.value = message.total
      break
    case 'done': {
      const r = message.result
      completed.value = r.trials
      status.value = 'done'
      summary.value = {
        trials: r.trials,
        passes: r.passes,
        yield: r.yield,
        nominalWorstReturnLossDb: r.nominalWorstReturnLossDb,
        histogram: histogramOf(r.worstReturnLossDb, 0.5),
        lowestReturnLossDb: r.worstReturnLossDb.reduce((a, b) => Math.min(a, b), Infinity),
        medianReturnLossDb: median(r.worstReturnLossDb),
        elapsedMs: message.elapsedMs,
        key: runKey,
      }
      const cloud: Complex[] = Array.from(r.cloudRe, (re, i) => ({ re, im: r.cloudIm[i]! }))
      cloudPoints.value = cloud
      finish({ status: 'done', yield: r.yield, trials: r.trials, elapsedMs: message.elapsedMs })
      break
    }
    case 'cancelled':
      status.value = 'cancelled'
      completed.value = message.completed
      finish({ status: 'cancelled', yield: null, trials: message.completed, elapsedMs: null })
      break
    case 'error':
      status.value = 'error'
      error.value = message.message
      finish({ status: 'error', yield: null, trials: 0, elapsedMs: null })
      break
  }
}

function ensureWorker(): Worker {
  if (!worker) {
    worker = new Worker(new URL('../workers/montecarlo.worker.ts', import.meta.url), { type: 'module' })
    worker.onmessage = (event: MessageEvent<MonteCarloWorkerReply>) => onReply(event.data)
    worker.onerror = (event) => {
      status.value = 'error'
      error.value = event.message || 'The analysis worker failed to start.'
      finish({ status: 'error', yield: null, trials: 0, elapsedMs: null })
    }
  }
  return worker
}

function post(request: MonteCarloWorkerRequest): void {
  ensureWorker().postMessage(request)
}

/** Starts a run of `input` (plain data only: no reactive proxies); resolves when it ends. */
function start(input: MonteCarloInput, key = '', sliceMs?: number): Promise<RunOutcome> {
  finish({ status: 'cancelled', yield: null, trials: completed.value, elapsedMs: null })
  runId += 1
  runKey = key
  status.value = 'running'
  completed.value = 0
  total.value = input.trials
  error.value = null
  return new Promise((resolve) => {
    settle = resolve
    try {
      post({ type: 'start', runId, input, sliceMs })
    }
    catch (e) {
      // e.g. a DataCloneError for input that is not plain data
      status.value = 'error'
      error.value = e instanceof Error ? e.message : String(e)
      finish({ status: 'error', yield: null, trials: 0, elapsedMs: null })
    }
  })
}

function cancel(): void {
  if (status.value === 'running') post({ type: 'cancel', runId })
}

/** Forgets the result and the chart's cloud (e.g. when the board closes). */
function clear(): void {
  if (status.value === 'running') cancel()
  summary.value = null
  status.value = 'idle'
  completed.value = 0
  cloudPoints.value = null
}

function installTestHook(): void {
  if (typeof window === 'undefined') return
  ;(window as unknown as Record<string, unknown>).__gammaboardMonteCarlo = {
    run: (input: MonteCarloInput, sliceMs?: number) => start(input, 'test-hook', sliceMs),
    cancel,
    progress: () => ({ status: status.value, completed: completed.value, total: total.value }),
    cloud: () => cloudPoints.value,
  }
}

export function useMonteCarlo() {
  return { status, completed, total, error, summary, cloud: cloudPoints, start, cancel, clear, installTestHook }
}
