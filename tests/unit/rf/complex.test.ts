import { describe, expect, it } from 'vitest'
import ComplexJs from 'complex.js'
import { OPEN, RfInputError, SHORT, asComplex, divideParts, fromComplexJs, reciprocal, toComplexJs } from '../../../shared/rf/index'

describe('complex values and the point at infinity', () => {
  it('any infinite part is the one open, as complex.js treats it', () => {
    expect(asComplex({ re: Infinity, im: 3 }, 'z', true)).toEqual(OPEN)
    expect(asComplex({ re: 0, im: -Infinity }, 'z', true)).toEqual(OPEN)
    expect(toComplexJs(OPEN).isInfinite()).toBe(true)
    expect(fromComplexJs(ComplexJs.INFINITY)).toEqual(OPEN)
    expect(fromComplexJs(new ComplexJs(1, 0).div(0))).toEqual(OPEN)
  })

  it('NaN is refused, never passed on', () => {
    expect(() => asComplex({ re: NaN, im: 0 }, 'load')).toThrow(RfInputError)
    expect(() => fromComplexJs(new ComplexJs(0, 0).div(0), 'ratio')).toThrow(/ratio/)
    expect(() => asComplex({ re: Infinity, im: 0 }, 'z0')).toThrow(/z0: must be finite/)
    expect(() => asComplex('50', 'z')).toThrow(/z: must be/)
  })

  it('a real number is a real complex value', () => {
    expect(asComplex(75, 'z')).toEqual({ re: 75, im: 0 })
  })

  it('division with Smith scaling survives huge and tiny parts', () => {
    const q = divideParts(1e300, 1e300, 1e300, -1e300)
    expect(q.re).toBeCloseTo(0, 12)
    expect(q.im).toBeCloseTo(1, 12)
    const r = divideParts(3e-300, 4e-300, 1e-300, 0)
    expect(r.re).toBeCloseTo(3, 12)
    expect(divideParts(1, 2, 0, 0)).toEqual(OPEN)
  })

  it('reciprocal is exact at the special points', () => {
    expect(reciprocal(OPEN)).toEqual(SHORT)
    expect(reciprocal(SHORT)).toEqual(OPEN)
    const y = reciprocal({ re: 30, im: 40 })
    expect(y.re).toBeCloseTo(0.012, 15)
    expect(y.im).toBeCloseTo(-0.016, 15)
  })
})
