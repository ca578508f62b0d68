// Reading speed of a large file, in a file of its own: vitest gives each test file a fresh worker,
// so the heap left behind by other tests does not add garbage-collection time to the measurement.
import { describe, expect, it } from 'vitest'
import { parseTouchstone } from '../../../shared/rf/index'
import { sampleS2p } from '../../../bench/touchstone-sample'

describe('parseTouchstone speed', () => {
  it('parses a generated 100,000-line .s2p in under 300 ms (best of 3)', () => {
    const text = sampleS2p(100_000)
    let best = Infinity
    for (let run = 0; run < 3; run++) {
      const start = performance.now()
      const points = parseTouchstone(text, 'big.s2p').frequencies.length
      best = Math.min(best, performance.now() - start)
      expect(points).toBe(100_000)
    }
    expect(best).toBeLessThan(300)
  })
})
