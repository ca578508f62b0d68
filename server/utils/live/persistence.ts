// Debounced saving of one board: a save runs saveDebounceMs after the last edit, but never later
// than saveMaxWaitMs after the first unsaved one, and never two at once (an edit during a save
// schedules another). flush() writes what is pending now and waits for it.

export interface SaveScheduler {
  /** Call after every document change that must reach the database. */
  markDirty(): void
  /** Writes pending changes now (after any running write) and resolves when they are stored. */
  flush(): Promise<void>
  readonly isDirty: boolean
  /** Stops the timers; pending changes are NOT written. */
  dispose(): void
}

export interface SaveSchedulerOptions {
  save: () => Promise<void>
  debounceMs: number
  maxWaitMs: number
  onError?: (error: unknown) => void
}

export function createSaveScheduler(options: SaveSchedulerOptions): SaveScheduler {
  let dirty = false
  let firstDirtyAt = 0
  let timer: ReturnType<typeof setTimeout> | undefined
  let running: Promise<void> | undefined
  let disposed = false

  const clearTimer = () => {
    if (timer) clearTimeout(timer)
    timer = undefined
  }

  // One write at a time: the state is encoded when the write starts, so edits that land while it
  // runs stay dirty and get their own write afterwards.
  const writeNow = (): Promise<void> => {
    if (running) return running
    clearTimer()
    if (!dirty || disposed) return Promise.resolve()
    dirty = false
    running = options.save()
      .catch((error) => {
        // Keep the changes and retry after a full debounce, not in a tight loop.
        if (!dirty) firstDirtyAt = Date.now()
        dirty = true
        options.onError?.(error)
      })
      .finally(() => {
        running = undefined
        if (dirty && !disposed) schedule()
      })
    return running
  }

  function schedule() {
    clearTimer()
    const now = Date.now()
    const deadline = firstDirtyAt + options.maxWaitMs
    const delay = Math.max(0, Math.min(options.debounceMs, deadline - now))
    timer = setTimeout(() => { void writeNow() }, delay)
  }

  return {
    markDirty() {
      if (disposed) return
      if (!dirty) firstDirtyAt = Date.now()
      dirty = true
      if (!running) schedule()
    },
    async flush() {
      // A running write may have started before the latest edits: wait for it, then write again.
      // A few attempts only, so a database that keeps failing cannot hold a shutdown forever.
      for (let attempt = 0; attempt < 3 && !disposed; attempt++) {
        if (running) await running
        if (!dirty) return
        await writeNow()
        if (!dirty) return
      }
    },
    get isDirty() { return dirty },
    dispose() {
      disposed = true
      clearTimer()
    },
  }
}
