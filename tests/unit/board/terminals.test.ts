import { describe, expect, it } from 'vitest'
import { goalOf, reflectionReference, terminalImpedance, terminalImpedances } from '../../../shared/board/terminals'

describe('terminals', () => {
  it('reads a fixed impedance, a Z0 source and an R-L-C model', () => {
    expect(terminalImpedance({ kind: 'impedance', z: { re: 18, im: -32 } }, 915e6, 50)).toEqual({ re: 18, im: -32 })
    expect(terminalImpedance({ kind: 'z0' }, 915e6, 75)).toEqual({ re: 75, im: 0 })
    // Series R + C: X = −1/(2π f C), by hand.
    const z = terminalImpedance({ kind: 'rlc', topology: 'series', r: 24, c: 2.55e-12 }, 868e6, 50)
    expect(z.re).toBeCloseTo(24, 9)
    expect(z.im).toBeCloseTo(-1 / (2 * Math.PI * 868e6 * 2.55e-12), 9)
  })
  it('sweeps an R-L-C model per frequency', () => {
    const zs = terminalImpedances({ kind: 'rlc', topology: 'series', r: 25, l: 1.1e-9 }, [2.4e9, 2.5e9], 50)
    expect(zs[0]!.im).toBeCloseTo(2 * Math.PI * 2.4e9 * 1.1e-9, 9)
    expect(zs[1]!.im).toBeCloseTo(2 * Math.PI * 2.5e9 * 1.1e-9, 9)
  })
  it('aims at the conjugate of the source and measures against the source (or z0)', () => {
    expect(goalOf({ re: 42, im: 9 })).toEqual({ re: 42, im: -9 })
    const settings = { source: { kind: 'impedance', z: { re: 42, im: 9 } }, z0: 50 } as const
    expect(reflectionReference({ re: 42, im: 9 }, settings)).toEqual({ re: 42, im: 9 })
    expect(reflectionReference({ re: 50, im: 0 }, { source: { kind: 'z0' }, z0: 50 })).toBe(50)
    // A source without resistance has no power wave: fall back to z0.
    expect(reflectionReference({ re: 0, im: 20 }, settings)).toBe(50)
  })
})
