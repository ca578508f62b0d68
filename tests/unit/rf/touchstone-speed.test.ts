// Reading speed of a large file, in a file of its own: vitest gives each test file a fresh worker,
// so the heap left behind by other tests does not add garbage-collection time to the measurement.
// The budget is checked on this process's CPU time (best of 5), not wall time: on a shared 2-core
// machine other processes (builds, browsers) stretch wall time without saying anything about ours.
import { describe, expect, it } from 'vitest'
import { parseTouchstone } from '../../../shared/rf/index'
import { sampleS2p } from '../../../bench/touchstone-sample'

describe('parseTouchstone speed', () => {
  it('parses a generated 100,000-line .s2p in under 300 ms of CPU time (best of 5)', () => {
    const text = sampleS2p(100_000)
    let bestMs = Infinity
    for (let run = 0; run < 5; run++) {
      const before = process.cpuUsage()
      const points = parseTouchstone(text, 'big.s2p').frequencies.length
      const used = process.cpuUsage(before)
      bestMs = Math.min(bestMs, (used.user + used.system) / 1000)
      expect(points).toBe(100_000)
    }
    expect(bestMs).toBeLessThan(300)
  })
})
