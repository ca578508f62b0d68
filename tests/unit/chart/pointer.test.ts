import { describe, expect, it } from 'vitest'
import { draggedPointGamma } from '../../../shared/chart/pointer'
import { gammaOf, trace } from '../../../shared/rf/index'
import { withDefaultQ } from '../../../shared/rf/losses'

describe('draggedPointGamma', () => {
  // A series C then a shunt L from 18 − j32 Ω at 915 MHz, with the board's default Q (L 40, C 200).
  const elements = [
    { id: 'c', kind: 'C', placement: 'series', value: 4.7e-12 },
    { id: 'l', kind: 'L', placement: 'shunt', value: 12e-9 },
  ] as const
  const lossy = trace({ z0: 50, frequency: 915e6, load: { re: 18, im: -32 }, elements: withDefaultQ(elements, { L: 40, C: 200 }) })
  const lossless = trace({ z0: 50, frequency: 915e6, load: { re: 18, im: -32 }, elements: [...elements] })

  it('is the lossy point after the dragged element, the end point for the last one', () => {
    const g = draggedPointGamma(lossy, ['c', 'l'], 'l', 50)!
    const end = gammaOf(lossy[2]!, 50)
    expect(g.re).toBeCloseTo(end.re, 12)
    expect(g.im).toBeCloseTo(end.im, 12)
    // and not the lossless point the pointer steers along
    const free = gammaOf(lossless[2]!, 50)
    expect(Math.hypot(g.re - free.re, g.im - free.im)).toBeGreaterThan(1e-3)
    const mid = draggedPointGamma(lossy, ['c', 'l'], 'c', 50)!
    expect(mid.re).toBeCloseTo(gammaOf(lossy[1]!, 50).re, 12)
  })
  it('is null without a drag or for an element not in the trace', () => {
    expect(draggedPointGamma(lossy, ['c', 'l'], null, 50)).toBeNull()
    expect(draggedPointGamma(lossy, ['c', 'l'], 'gone', 50)).toBeNull()
  })
})
