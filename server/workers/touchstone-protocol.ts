// Messages between the server's Touchstone worker pool (server/utils/touchstone-worker.ts) and
// the worker (touchstone-parse.ts). The file travels as a transferred ArrayBuffer; the answer
// comes back as JSON text, so the main thread never walks the parsed arrays.
import type { TouchstoneErrorCode, TouchstoneLimits } from '../../shared/rf/touchstone'

export interface TouchstoneParseRequest {
  id: number
  bytes: Uint8Array
  fileName: string
  limits: TouchstoneLimits
  /** Longest JSON text the answer may be; past it the file is refused as too large. */
  maxJsonChars: number
}

export interface TouchstoneSummary {
  ports: number
  frequencies: number
  fMinHz: number
  fMaxHz: number
}

export interface TouchstoneParseFailure {
  message: string
  line: number | null
  column?: number
  code: TouchstoneErrorCode | 'too-large'
}

export type TouchstoneParseReply =
  | { id: number, ok: true, json: string, summary: TouchstoneSummary }
  | { id: number, ok: false, failure: TouchstoneParseFailure }
  | { id: number, ok: false, internal: string }
