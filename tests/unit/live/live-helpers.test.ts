import { describe, expect, it, vi } from 'vitest'
import seedrandom from 'seedrandom'
import { reconnectDelayMs, RECONNECT_BASE_MS } from '../../../shared/live/backoff'
import { presenceColourFor, PRESENCE_COLOURS, readPresence, sanitizePresence } from '../../../shared/live/presence'
import { createSaveScheduler } from '../../../server/utils/live/persistence'

describe('reconnectDelayMs', () => {
  it('stays between half and all of the capped exponential step, and varies', () => {
    const random = seedrandom('backoff')
    for (const attempt of [0, 1, 2, 3, 5, 8, 30]) {
      const step = Math.min(2500, RECONNECT_BASE_MS * 2 ** Math.min(attempt, 20))
      const delays = Array.from({ length: 50 }, () => reconnectDelayMs(attempt, random, 2500))
      expect(Math.min(...delays)).toBeGreaterThanOrEqual(step / 2)
      expect(Math.max(...delays)).toBeLessThanOrEqual(step)
      expect(new Set(delays).size).toBeGreaterThan(5)
    }
  })
})

describe('presence', () => {
  const user = { id: 4, name: 'Tomas', colour: '#1f5f8b', role: 'designer' as const }
  it.each([
    [{ pointer: { re: 0.2, im: -0.1 } }, { re: 0.2, im: -0.1 }, null],
    [{ pointer: { re: 'x', im: 0 } }, null, null],
    [{ pointer: { re: 9, im: 0 } }, null, null],
    [{ dragging: { elementId: 'e1', value: 2e-9 } }, null, { elementId: 'e1', value: 2e-9 }],
    [{ dragging: { elementId: '', value: 2e-9 } }, null, null],
    [null, null, null],
  ])('keeps only well-formed fields of %j', (raw, pointer, dragging) => {
    expect(sanitizePresence(raw, user)).toEqual({ user, pointer, dragging })
  })
  it('never shows a reviewer dragging, and ignores a client-chosen user', () => {
    const reviewer = { ...user, role: 'reviewer' as const }
    expect(sanitizePresence({ dragging: { elementId: 'e1', value: 1 }, user: { id: 1, name: 'X' } }, reviewer))
      .toEqual({ user: reviewer, pointer: null, dragging: null })
    expect(readPresence({ pointer: { re: 0, im: 0 } })).toBeNull()
  })
  it('gives each account one colour from our palette', () => {
    expect(presenceColourFor(3)).toBe(presenceColourFor(3))
    const colours = new Set(Array.from({ length: 40 }, (_, i) => presenceColourFor(i + 1)))
    expect(colours.size).toBeGreaterThan(4)
    for (const c of colours) expect(PRESENCE_COLOURS).toContain(c)
  })
})

describe('createSaveScheduler', () => {
  it('debounces, caps the wait, never overlaps writes and flushes what is pending', async () => {
    vi.useFakeTimers()
    try {
      let active = 0
      let maxActive = 0
      const writes: number[] = []
      const saver = createSaveScheduler({
        debounceMs: 100,
        maxWaitMs: 300,
        save: async () => {
          active++
          maxActive = Math.max(maxActive, active)
          await new Promise(r => setTimeout(r, 50))
          writes.push(Date.now())
          active--
        },
      })
      const t0 = Date.now()
      saver.markDirty()
      await vi.advanceTimersByTimeAsync(99)
      expect(writes).toHaveLength(0)
      await vi.advanceTimersByTimeAsync(60)
      expect(writes.map(t => t - t0)).toEqual([150])
      // An edit every 60 ms never leaves 100 ms quiet: the 300 ms cap forces writes.
      for (let i = 0; i < 10; i++) {
        saver.markDirty()
        await vi.advanceTimersByTimeAsync(60)
      }
      expect(writes.length).toBeGreaterThanOrEqual(2)
      saver.markDirty()
      const flushed = saver.flush()
      await vi.advanceTimersByTimeAsync(200)
      await flushed
      expect(saver.isDirty).toBe(false)
      expect(maxActive).toBe(1)
      saver.dispose()
    }
    finally {
      vi.useRealTimers()
    }
  })

  it('keeps changes after a failed write and retries', async () => {
    let fail = true
    let saved = 0
    const errors: unknown[] = []
    const saver = createSaveScheduler({
      debounceMs: 10,
      maxWaitMs: 50,
      save: async () => { if (fail) throw new Error('locked'); saved++ },
      onError: e => errors.push(e),
    })
    saver.markDirty()
    await new Promise(r => setTimeout(r, 30))
    expect(errors.length).toBeGreaterThanOrEqual(1)
    expect(saver.isDirty).toBe(true)
    fail = false
    await saver.flush()
    expect(saved).toBe(1)
    saver.dispose()
  })
})
