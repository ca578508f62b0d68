// Worker thread: reads one uploaded Touchstone file at a time, off the server's event loop, and
// answers its JSON text (or where it went wrong). Bundled at build time into a string by
// bundle.ts and started with `eval: true`, so the built server needs no extra file on disk.
import { parentPort } from 'node:worker_threads'
import { TouchstoneError, parseTouchstone } from '../../shared/rf/touchstone'
import type { TouchstoneParseReply, TouchstoneParseRequest } from './touchstone-protocol'

const decoder = new TextDecoder('utf-8')

function answer(request: TouchstoneParseRequest): TouchstoneParseReply {
  const { id } = request
  try {
    const parsed = parseTouchstone(decoder.decode(request.bytes), request.fileName, request.limits)
    const json = JSON.stringify(parsed)
    if (json.length > request.maxJsonChars) {
      const mb = Math.round(request.maxJsonChars / 1024 / 1024)
      return { id, ok: false, failure: { message: `${request.fileName}: the parsed file would be larger than ${mb} MB`, line: null, code: 'too-large' } }
    }
    const f = parsed.frequencies
    return { id, ok: true, json, summary: { ports: parsed.ports, frequencies: f.length, fMinHz: f[0]!, fMaxHz: f[f.length - 1]! } }
  }
  catch (error) {
    if (error instanceof TouchstoneError) {
      const failure = { message: error.message, line: error.line, code: error.code }
      return { id, ok: false, failure: error.column === undefined ? failure : { ...failure, column: error.column } }
    }
    return { id, ok: false, internal: error instanceof Error ? error.message : String(error) }
  }
}

parentPort!.on('message', (request: TouchstoneParseRequest) => parentPort!.postMessage(answer(request)))
