// Measured data onto a band: interpolation modes and the outside-range report.
import { describe, expect, it } from 'vitest'
import { blend, interpolateComplex, interpolateMatrices, locate } from '../../../shared/rf/index'

describe('interpolateComplex', () => {
  const f = [100, 200, 400]
  const v = [{ re: 1, im: 0 }, { re: 3, im: -2 }, { re: 0, im: 4 }]

  it('is linear in re and im between points and exact at them', () => {
    const { values, outsideHz } = interpolateComplex(f, v, [100, 150, 300, 400])
    expect(outsideHz).toEqual([])
    expect(values[0]).toEqual(v[0])
    expect(values[1]!.re).toBeCloseTo(2, 14)
    expect(values[1]!.im).toBeCloseTo(-1, 14)
    expect(values[2]!.re).toBeCloseTo(1.5, 14)
    expect(values[2]!.im).toBeCloseTo(1, 14)
    expect(values[3]).toEqual(v[2])
  })

  it('reports frequencies outside the measured range and gives them no value', () => {
    const { values, outsideHz } = interpolateComplex(f, v, [50, 100, 250, 401, 900])
    expect(outsideHz).toEqual([50, 401, 900])
    expect(values[0]).toBeNull()
    expect(values[3]).toBeNull()
    expect(values[2]).not.toBeNull()
  })

  it('counts a band edge a rounding error past the last point as inside', () => {
    expect(locate([800e6, 1000e6], 1000e6 * (1 + 1e-12))).toEqual({ k: 0, t: 1 })
    expect(locate([800e6, 1000e6], 1000e6 * (1 + 1e-6))).toBeNull()
  })

  it('in magPhase mode keeps a rotating phasor on its circle, the short way round', () => {
    const a = { re: Math.cos(170 * Math.PI / 180), im: Math.sin(170 * Math.PI / 180) }
    const b = { re: Math.cos(-170 * Math.PI / 180), im: Math.sin(-170 * Math.PI / 180) }
    const mid = blend(a, b, 0.5, 'magPhase')
    expect(mid.re).toBeCloseTo(-1, 12)
    expect(mid.im).toBeCloseTo(0, 12)
    const straight = blend(a, b, 0.5, 'reIm')
    expect(Math.hypot(straight.re, straight.im)).toBeLessThan(0.99)
  })

  it('interpolates matrices element by element', () => {
    const s = [[[{ re: 0, im: 0 }]], [[{ re: 1, im: 1 }]]]
    const { values, outsideHz } = interpolateMatrices([1, 2], s, [1.25, 3])
    expect(values[0]![0]![0]!.re).toBeCloseTo(0.25, 14)
    expect(values[1]).toBeNull()
    expect(outsideHz).toEqual([3])
  })

  it('refuses mismatched lengths', () => {
    expect(() => interpolateComplex([1, 2], [{ re: 0, im: 0 }], [1])).toThrow(/1 values for 2 frequencies/)
  })
})
