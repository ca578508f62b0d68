// Messages between useMonteCarlo and the Monte Carlo worker (structured-cloned; result arrays
// are transferred, not copied).
import type { MonteCarloInput, MonteCarloResult } from '../shared/rf/montecarlo'

export type MonteCarloWorkerRequest =
  | { type: 'start', runId: number, input: MonteCarloInput, sliceMs?: number }
  | { type: 'cancel', runId: number }

export type MonteCarloWorkerReply =
  | { type: 'progress', runId: number, completed: number, total: number }
  | { type: 'done', runId: number, result: MonteCarloResult, elapsedMs: number }
  | { type: 'cancelled', runId: number, completed: number, total: number }
  | { type: 'error', runId: number, message: string }
