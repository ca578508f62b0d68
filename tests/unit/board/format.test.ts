import { describe, expect, it } from 'vitest'
import { formatComplex, formatFigure, withoutNoise } from '../../../shared/board/format'
import { cursorReadout } from '../../../shared/chart/pointer'

describe('zero shown as zero at the displayed precision', () => {
  it('drops rounding noise of a part far below the last shown digit', () => {
    expect(formatComplex({ re: 50, im: -6.322e-15 }, 'Ω')).toBe('50.00 + j0.000 Ω')
    expect(formatComplex({ re: 1e-17, im: 25 }, 'Ω')).toBe('0.000 + j25.00 Ω')
    expect(withoutNoise({ re: 50, im: -6e-15 })).toEqual({ re: 50, im: 0 })
  })
  it('keeps small parts that are real figures', () => {
    expect(formatComplex({ re: 50, im: -0.01 }, 'Ω')).toBe('50.00 − j0.01000 Ω')
    expect(formatComplex({ re: 18, im: -32 }, 'Ω')).toBe('18.00 − j32.00 Ω')
  })
  it('shows a node Q of rounding noise as 0', () => {
    expect(formatFigure(1.26e-16)).toBe('0')
    expect(formatFigure(0.5)).toBe('0.5')
  })
  it('does the same in the pointer readout', () => {
    const z = cursorReadout({ re: 0, im: 1e-17 }, 50).find(r => r.label === 'Z')!
    expect(z.text).toBe('50 Ω + j0 Ω')
  })
})
