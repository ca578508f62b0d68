// A small pool of worker threads started from a bundled source string (server/workers/bundle.ts),
// for CPU-heavy work that must never stall the event loop (live editing shares it). Each job has
// a time limit: a job past it ends its thread (the next job gets a fresh one) and rejects with
// ThreadPoolError 'timeout'; past `maxWaiting` queued jobs a new one rejects with 'busy'.
import { Worker } from 'node:worker_threads'

export type ThreadPoolOptions = {
  /** The worker's bundled CommonJS source (run with eval: true). */
  source: string
  /** Threads at most (each takes one core while it works). */
  size: number
  timeoutMs: number
  maxWaiting: number
  heapMb?: number
}

export class ThreadPoolError extends Error {
  constructor(readonly reason: 'timeout' | 'busy' | 'crashed', message: string) {
    super(message)
    this.name = 'ThreadPoolError'
  }
}

type Job = { message: { id: number }, resolve: (reply: unknown) => void, reject: (error: Error) => void }
type Slot = { worker: Worker, job?: Job, timer?: NodeJS.Timeout }

/** Messages must carry a numeric `id`; the worker answers each with one message of the same `id`. */
export function createThreadPool<Request extends { id: number }, Reply extends { id: number }>(options: ThreadPoolOptions) {
  const idle: Slot[] = []
  const busy = new Set<Slot>()
  const waiting: Job[] = []

  function settle(slot: Slot): Job | undefined {
    const job = slot.job
    clearTimeout(slot.timer)
    slot.job = undefined
    busy.delete(slot)
    return job
  }

  function discard(slot: Slot, error: ThreadPoolError): void {
    const job = settle(slot)
    slot.worker.removeAllListeners()
    void slot.worker.terminate()
    job?.reject(error)
    setImmediate(next)
  }

  function start(): Slot {
    const worker = new Worker(options.source, { eval: true, resourceLimits: options.heapMb ? { maxOldGenerationSizeMb: options.heapMb } : undefined })
    worker.unref() // never keeps the server process alive on shutdown
    const slot: Slot = { worker }
    worker.on('message', (reply: Reply) => {
      if (!slot.job || reply.id !== slot.job.message.id) return
      const job = settle(slot)!
      idle.push(slot)
      job.resolve(reply)
      setImmediate(next)
    })
    worker.on('error', error => discard(slot, new ThreadPoolError('crashed', `the worker stopped: ${error.message}`)))
    worker.on('exit', () => discard(slot, new ThreadPoolError('crashed', 'the worker stopped before answering')))
    return slot
  }

  function next(): void {
    while (waiting.length > 0 && (idle.length > 0 || busy.size < options.size)) {
      const job = waiting.shift()!
      const slot = idle.pop() ?? start()
      slot.job = job
      busy.add(slot)
      slot.timer = setTimeout(() => discard(slot, new ThreadPoolError('timeout', `took longer than ${options.timeoutMs / 1000} s`)), options.timeoutMs)
      slot.worker.postMessage(job.message)
    }
  }

  return {
    run(message: Request): Promise<Reply> {
      if (waiting.length >= options.maxWaiting) return Promise.reject(new ThreadPoolError('busy', 'too many jobs are waiting'))
      return new Promise<Reply>((resolve, reject) => {
        waiting.push({ message, resolve: resolve as (reply: unknown) => void, reject })
        next()
      })
    },
  }
}
