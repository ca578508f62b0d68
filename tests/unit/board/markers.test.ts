// Band figures around markers: nearest band point, worst return loss, bandwidth at a return loss.
import { describe, expect, it } from 'vitest'
import { bandwidthAt, nearestIndex, worstReturnLoss } from '../../../shared/board/markers'

const f = [900, 910, 920, 930, 940, 950]
const rl = [6, 12, 20, 14, 8, 11]

describe('band figures', () => {
  it('finds the nearest band point', () => {
    expect(nearestIndex(f, 914)).toBe(1)
    expect(nearestIndex(f, 2000)).toBe(5)
    expect(nearestIndex([], 1)).toBe(-1)
  })

  it('finds the worst return loss across the whole band', () => {
    expect(worstReturnLoss(f, rl)).toEqual({ returnLossDb: 6, frequencyHz: 900 })
    expect(worstReturnLoss([], [])).toBeNull()
  })

  it('measures the widest stretch at a return loss, edges interpolated between points', () => {
    const bw = bandwidthAt(f, rl, 10)!
    // 6→12 dB crosses 10 dB two thirds of the way from 900 to 910; 14→8 crosses at 2/3 from 930 to 940.
    expect(bw.lowHz).toBeCloseTo(900 + 10 * (4 / 6), 10)
    expect(bw.highHz).toBeCloseTo(930 + 10 * (4 / 6), 10)
    expect(bw.widthHz).toBeCloseTo(30, 10)
    expect(bw.fractional).toBeCloseTo(30 / ((bw.lowHz + bw.highHz) / 2), 12)
    expect(bw.isClippedByBand).toBe(false)
  })

  it('says when the stretch reaches the band edge, and when nothing meets the threshold', () => {
    expect(bandwidthAt(f, rl, 5)!.isClippedByBand).toBe(true)
    expect(bandwidthAt(f, rl, 5)!.widthHz).toBe(50)
    expect(bandwidthAt(f, rl, 30)).toBeNull()
  })
})
