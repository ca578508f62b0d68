// Messages between server/utils/search-worker.ts and the match-search worker thread.
import type { SearchInput, SearchResult } from '../../shared/rf/index'

export type SearchThreadRequest = { id: number, input: SearchInput }

export type SearchThreadReply =
  | { id: number, ok: true, result: SearchResult }
  | { id: number, ok: false, argument: string, message: string }
  | { id: number, ok: false, internal: string }
