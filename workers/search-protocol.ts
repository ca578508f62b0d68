// Messages between useHuntWorker and the match-search worker (structured-cloned).
import type { SearchInput, SearchResult } from '../shared/rf/search'

export type HuntWorkerRequest =
  | { type: 'start', runId: number, input: SearchInput, sliceMs?: number }
  | { type: 'cancel', runId: number }

export type HuntWorkerReply =
  | { type: 'progress', runId: number, completed: number, total: number }
  | { type: 'done', runId: number, result: SearchResult, elapsedMs: number }
  | { type: 'cancelled', runId: number, completed: number, total: number }
  | { type: 'error', runId: number, message: string }
