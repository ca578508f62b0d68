// The durable side of a live room: accepted updates are batched and appended to the board's update
// log at most `intervalMs` after they arrive (one append at a time; a failed batch is kept and
// retried after `retryMs`), so a crash loses at most about that much. `lastId` is the id of the
// last batch known to be stored: a full save that encodes the document after that batch arrived
// covers every row up to it.
import * as Y from 'yjs'

export interface UpdateLog {
  push(update: Uint8Array): void
  /** Appends what is pending now (after any running append) and resolves when it is stored. */
  flush(): Promise<void>
  readonly lastId: number
  /** Stops the timers; pending updates are NOT written. */
  dispose(): void
}

export interface UpdateLogOptions {
  append: (update: Uint8Array) => Promise<number>
  intervalMs: number
  retryMs: number
  /** The id of the last row already merged into the loaded document. */
  initialId: number
  onError?: (error: unknown) => void
}

export function createUpdateLog(options: UpdateLogOptions): UpdateLog {
  let pending: Uint8Array[] = []
  let lastId = options.initialId
  let timer: ReturnType<typeof setTimeout> | undefined
  let running: Promise<void> | undefined
  let isDisposed = false

  const schedule = (delayMs: number) => {
    if (timer || running || isDisposed) return
    timer = setTimeout(() => { timer = undefined; void writeNow() }, delayMs)
  }

  const writeNow = (): Promise<void> => {
    if (running) return running
    if (timer) clearTimeout(timer)
    timer = undefined
    if (pending.length === 0 || isDisposed) return Promise.resolve()
    const batch = pending
    pending = []
    let delayMs = options.intervalMs
    running = options.append(batch.length === 1 ? batch[0]! : Y.mergeUpdates(batch))
      .then((id) => { lastId = Math.max(lastId, id) })
      .catch((error) => {
        pending = [...batch, ...pending]
        delayMs = options.retryMs
        options.onError?.(error)
      })
      .finally(() => {
        running = undefined
        if (pending.length) schedule(delayMs)
      })
    return running
  }

  return {
    push(update) {
      if (isDisposed) return
      pending.push(update)
      schedule(options.intervalMs)
    },
    async flush() {
      for (let attempt = 0; attempt < 3 && !isDisposed; attempt++) {
        if (running) await running
        if (pending.length === 0) return
        await writeNow()
      }
    },
    get lastId() { return lastId },
    dispose() {
      isDisposed = true
      if (timer) clearTimeout(timer)
      timer = undefined
      pending = []
    },
  }
}
