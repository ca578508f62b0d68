import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  OPEN, RfInputError, deliveredPowerFraction, gammaOf, impedanceOf, mismatchLossDb, nodeQ,
  returnLossDb, vswr,
} from '../../../shared/rf/index'
import { REFERENCE_SOURCE, casesWhere, expectComplexClose, expectRealClose, refComplex, refReal } from './reference'

const gammaCases = casesWhere((c) => c.op === 'gamma')

describe(`reflection against ${REFERENCE_SOURCE}`, () => {
  it('has the five reflection cases', () => expect(gammaCases).toHaveLength(5))

  it.each(gammaCases.map((c) => [c.id, c] as const))('%s', (_id, c) => {
    const z = refComplex(c.input.z)
    const z0 = typeof c.input.z0 === 'number' ? c.input.z0 : refComplex(c.input.z0)
    const e = c.expected
    const g = gammaOf(z, z0)
    expectComplexClose(g, refComplex(e.gamma), `${c.id} gamma`, 1e-12)
    expectRealClose(Math.hypot(g.re, g.im), e.mag, `${c.id} |gamma|`, 1e-12)
    if (e.mag > 0) expectRealClose((Math.atan2(g.im, g.re) * 180) / Math.PI, e.angleDeg, `${c.id} angle`, 1e-9)
    expectRealClose(vswr(g), refReal(e.vswr), `${c.id} vswr`)
    expectRealClose(returnLossDb(g), refReal(e.returnLossDb), `${c.id} return loss`)
    expectRealClose(mismatchLossDb(g), refReal(e.mismatchLossDb), `${c.id} mismatch loss`)
    expectRealClose(deliveredPowerFraction(g), e.transmittedPowerFraction, `${c.id} delivered power`)
    // The inverse returns the impedance (an open comes back as OPEN).
    const back = impedanceOf(g, z0)
    if (c.input.z === 'open') expect(back).toEqual(OPEN)
    else expectComplexClose(back, z, `${c.id} impedanceOf`, 1e-9)
  })

  it('the VSWR / return-loss table (common practice; values from the reference file)', () => {
    const [table] = casesWhere((c) => c.id === 'vswr-table')
    const z0 = table!.input.z0 as number
    for (const row of table!.expected.table) {
      for (const r of [row.rPureHighOhm, row.rPureLowOhm]) {
        const g = gammaOf({ re: r, im: 0 }, z0)
        const m = Math.hypot(g.re, g.im)
        expectRealClose(m, row.gammaMag, `VSWR ${row.vswr}: |Γ| of ${r} Ω`, 1e-12)
        expectRealClose(vswr(g), row.vswr, `VSWR ${row.vswr} of ${r} Ω`)
        expectRealClose(returnLossDb(m), refReal(row.returnLossDb), `VSWR ${row.vswr} return loss`)
        expectRealClose(mismatchLossDb(m), row.mismatchLossDb, `VSWR ${row.vswr} mismatch loss`)
        expectRealClose(100 * (1 - deliveredPowerFraction(m)), row.reflectedPowerPct, `VSWR ${row.vswr} reflected %`)
      }
    }
  })
})

describe('reflection properties and special values', () => {
  it('gammaOf and impedanceOf are inverse for real and complex references (seeded)', () => {
    const rng = seedrandom('gamma-roundtrip')
    for (let k = 0; k < 500; k++) {
      const z = { re: rng() * 300, im: (rng() - 0.5) * 600 }
      const ref = rng() < 0.5 ? 10 + rng() * 90 : { re: 5 + rng() * 100, im: (rng() - 0.5) * 100 }
      expectComplexClose(impedanceOf(gammaOf(z, ref), ref), z, 'round trip', 1e-9)
    }
  })

  it('the power wave is zero at the conjugate match and |Γ| ≤ 1 for passive z', () => {
    const rng = seedrandom('power-wave')
    for (let k = 0; k < 300; k++) {
      const zs = { re: 1 + rng() * 100, im: (rng() - 0.5) * 200 }
      const g0 = gammaOf({ re: zs.re, im: -zs.im }, zs)
      expect(Math.hypot(g0.re, g0.im)).toBeLessThan(1e-12)
      const g = gammaOf({ re: rng() * 500, im: (rng() - 0.5) * 1000 }, zs)
      expect(Math.hypot(g.re, g.im)).toBeLessThanOrEqual(1 + 1e-12)
    }
  })

  it('open, short and match', () => {
    expect(gammaOf(OPEN, 50)).toEqual({ re: 1, im: 0 })
    expect(gammaOf(OPEN, { re: 30, im: 10 })).toEqual({ re: 1, im: 0 })
    expect(impedanceOf({ re: 1, im: 0 }, 50)).toEqual(OPEN)
    expectComplexClose(impedanceOf({ re: -1, im: 0 }, 50), { re: 0, im: 0 }, 'Γ = −1 is a short')
    expect(vswr(1)).toBe(Infinity)
    expect(vswr(1 + 1e-12)).toBe(Infinity) // rounding on a lossless ladder
    expect(returnLossDb(0)).toBe(Infinity)
    expect(mismatchLossDb(0)).toBe(0)
  })

  it('node Q = |X|/|R|, Infinity when lossless, 0 at a short or open', () => {
    expect(nodeQ({ re: 25, im: -50 })).toBe(2)
    expect(nodeQ({ re: 0, im: 5 })).toBe(Infinity)
    expect(nodeQ({ re: 0, im: 0 })).toBe(0)
    expect(nodeQ(OPEN)).toBe(0)
  })

  it('rejects bad arguments by name instead of returning NaN', () => {
    const argOf = (fn: () => unknown) => {
      try {
        fn()
      } catch (e) {
        return e instanceof RfInputError ? e.argument : 'not an RfInputError'
      }
      return 'no error'
    }
    expect(argOf(() => gammaOf({ re: NaN, im: 0 }, 50))).toBe('z')
    expect(argOf(() => gammaOf({ re: 1, im: 0 }, 0))).toBe('z0')
    expect(argOf(() => gammaOf({ re: 1, im: 0 }, { re: -5, im: 1 }))).toBe('z0')
    expect(argOf(() => vswr(1.5))).toBe('gamma')
    expect(argOf(() => mismatchLossDb({ re: 0, im: 2 }))).toBe('gamma')
    expect(argOf(() => returnLossDb(NaN))).toBe('gamma')
    expect(argOf(() => nodeQ({ re: 1, im: NaN }))).toBe('z')
  })
})
