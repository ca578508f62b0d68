// Pointer moves can arrive faster than frames; only the latest one per frame is worth computing.
// `push` keeps the newest value and runs `run` once at the next frame with it.
export type FrameScheduler = (callback: () => void) => unknown

export interface FrameCoalescer<T> {
  push: (value: T) => void
  /** Runs a pending value now (e.g. before a release commits), if any. */
  flush: () => void
  /** Forgets a pending value. */
  drop: () => void
  readonly isPending: () => boolean
}

export function createFrameCoalescer<T>(run: (value: T) => void, schedule: FrameScheduler): FrameCoalescer<T> {
  let pending: { value: T } | null = null
  let scheduled = false
  const fire = () => {
    scheduled = false
    const p = pending
    pending = null
    if (p) run(p.value)
  }
  return {
    push(value) {
      pending = { value }
      if (!scheduled) {
        scheduled = true
        schedule(fire)
      }
    },
    flush() {
      const p = pending
      pending = null
      if (p) run(p.value)
    },
    drop() {
      pending = null
    },
    isPending: () => pending !== null,
  }
}
