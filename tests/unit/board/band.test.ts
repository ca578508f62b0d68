import { describe, expect, it } from 'vitest'
import { bandFrequencies, bandVerdict, withReferenceFrequency } from '../../../shared/board/band'

describe('bandFrequencies', () => {
  it('spaces points evenly and includes both ends', () => {
    const f = bandFrequencies({ bandStartHz: 902e6, bandStopHz: 928e6, bandPoints: 27 })
    expect(f).toHaveLength(27)
    expect(f[0]).toBe(902e6)
    expect(f[26]).toBe(928e6)
    for (let i = 1; i < f.length; i++) expect(f[i]! - f[i - 1]!).toBeCloseTo(1e6, 3)
  })
})

describe('bandVerdict', () => {
  const f = [1, 2, 3, 4, 5]
  const spec = { minReturnLossDb: 10, f1Hz: 2, f2Hz: 4 }
  it('looks only inside the spec window', () => {
    const v = bandVerdict(f, [3, 12, 11, 15, 2], spec)
    expect(v).toEqual({ isPass: true, worstReturnLossDb: 11, worstFrequencyHz: 3, pointsInSpec: 3 })
  })
  it('fails when one point inside misses', () => {
    expect(bandVerdict(f, [30, 12, 9.9, 15, 30], spec).isPass).toBe(false)
  })
  it('cannot pass when no point falls inside the window', () => {
    const v = bandVerdict(f, [30, 30, 30, 30, 30], { minReturnLossDb: 10, f1Hz: 6, f2Hz: 7 })
    expect(v.isPass).toBe(false)
    expect(v.pointsInSpec).toBe(0)
  })
  it('passes an exact match (infinite return loss)', () => {
    expect(bandVerdict(f, [Infinity, Infinity, Infinity, Infinity, Infinity], spec).isPass).toBe(true)
  })
})

describe('withReferenceFrequency', () => {
  it('gives lines and stubs without fRef the design frequency and leaves the rest', () => {
    const ladder = [
      { kind: 'line', z0: 50, deg: 30 },
      { kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 30, fRef: 1e9 },
      { kind: 'L', placement: 'series', value: 1e-9 },
    ]
    const out = withReferenceFrequency(ladder, 915e6)
    expect(out[0]).toEqual({ kind: 'line', z0: 50, deg: 30, fRef: 915e6 })
    expect(out[1]).toBe(ladder[1])
    expect(out[2]).toBe(ladder[2])
  })
})
