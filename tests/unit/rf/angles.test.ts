import { describe, expect, it } from 'vitest'
import { electricalCosSin, isUniformGrid } from '../../../shared/rf/angles'

describe('electrical angles across a band', () => {
  const band = Float64Array.from({ length: 1001 }, (_, i) => 2.0e9 + (0.9e9 * i) / 1000)

  it('the rotation recurrence on a uniform grid matches Math.cos and Math.sin to 1e-13', () => {
    expect(isUniformGrid(band)).toBe(true)
    const c = new Float64Array(band.length)
    const s = new Float64Array(band.length)
    for (const deg of [1, 30, 123.4, 720, 5000]) {
      electricalCosSin(deg, 2.44e9, band, true, c, s)
      band.forEach((f, i) => {
        const t = ((deg * Math.PI) / 180) * (f / 2.44e9)
        expect(Math.abs(c[i]! - Math.cos(t))).toBeLessThan(1e-13)
        expect(Math.abs(s[i]! - Math.sin(t))).toBeLessThan(1e-13)
      })
    }
  })

  it('whole multiples of 90° at f = fRef are exact, on the uniform and the direct path', () => {
    const c = new Float64Array(band.length)
    const s = new Float64Array(band.length)
    const fRef = band[500]!
    for (const uniform of [true, false]) {
      electricalCosSin(90, fRef, band, uniform, c, s)
      expect([c[500], s[500]]).toEqual([0, 1])
      electricalCosSin(180, fRef, band, uniform, c, s)
      expect([c[500], s[500]]).toEqual([-1, 0])
    }
  })

  it('tells uniform grids from others', () => {
    expect(isUniformGrid(Float64Array.from([1e9, 2e9, 3.000001e9]))).toBe(false)
    expect(isUniformGrid(Float64Array.from([1e9, 1e9, 1e9]))).toBe(false)
    expect(isUniformGrid(Float64Array.from([1e9, 2e9]))).toBe(false)
  })
})
