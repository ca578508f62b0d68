// Grid circles against points computed straight from Γ = (z − 1)/(z + 1); the mismatch ring
// against the power-wave reflection of the RF core.
import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import type { Complex } from '../../../shared/rf/types'
import { gammaOf } from '../../../shared/rf/gamma'
import {
  conductanceCircle, constantQCircle, distanceFromLocus, mismatchRing, reactanceCircle, resistanceCircle,
  susceptanceCircle, type GammaCircle,
} from '../../../shared/chart/circles'

function gammaNorm(z: Complex): Complex {
  const m = (z.re + 1) ** 2 + z.im ** 2
  return { re: (z.re * z.re + z.im * z.im - 1) / m, im: (2 * z.im) / m }
}
function fromY(y: Complex): Complex {
  const m = y.re * y.re + y.im * y.im
  return gammaNorm({ re: y.re / m, im: -y.im / m })
}
function off(c: GammaCircle, g: Complex): number {
  return distanceFromLocus({ kind: 'circle', ...c }, g.re, g.im)
}

const VALUES = [0.05, 0.2, 0.5, 1, 2, 5, 30]
const SWEEP = [-20, -3, -1, -0.4, 0, 0.3, 1, 2.5, 40]

describe('grid circles', () => {
  it('constant r and x circles hold the points r + jx', () => {
    for (const r of VALUES) {
      for (const x of SWEEP) {
        const g = gammaNorm({ re: r, im: x })
        expect(off(resistanceCircle(r), g)).toBeLessThan(1e-12)
        if (x !== 0) expect(off(reactanceCircle(x), g)).toBeLessThan(1e-12)
      }
    }
  })

  it('constant g and b circles hold the points of admittance g + jb', () => {
    for (const g of VALUES) {
      for (const b of SWEEP) {
        const p = fromY({ re: g, im: b })
        expect(off(conductanceCircle(g), p)).toBeLessThan(1e-12)
        if (b !== 0) expect(off(susceptanceCircle(b), p)).toBeLessThan(1e-12)
      }
    }
  })

  it('constant-Q circles hold every r + jx with |x|/r = Q, the upper one for x > 0', () => {
    for (const q of [0.5, 1, 2, 5]) {
      for (const r of VALUES) {
        expect(off(constantQCircle(q, 1), gammaNorm({ re: r, im: q * r }))).toBeLessThan(1e-12)
        expect(off(constantQCircle(q, -1), gammaNorm({ re: r, im: -q * r }))).toBeLessThan(1e-12)
      }
    }
  })
})

describe('mismatchRing', () => {
  it('is the plain VSWR circle about the centre for a Z0 goal', () => {
    const ring = mismatchRing({ re: 0, im: 0 }, { re: 0.3, im: -0.4 })!
    expect(ring.cx).toBe(0)
    expect(ring.cy).toBe(0)
    expect(ring.radius).toBeCloseTo(0.5, 15)
  })

  it('passes through the end point and keeps the power-wave |Γ| against the source', () => {
    const rng = seedrandom('mismatch-ring')
    const z0 = 50
    for (let i = 0; i < 100; i++) {
      const zs = { re: 5 + 100 * rng(), im: 120 * rng() - 60 }
      const goal = gammaOf({ re: zs.re, im: -zs.im }, z0)
      const zEnd = { re: 1 + 150 * rng(), im: 200 * rng() - 100 }
      const end = gammaOf(zEnd, z0)
      const ring = mismatchRing(goal, end)!
      expect(off(ring, end)).toBeLessThan(1e-12)
      const target = Math.hypot(gammaOf(zEnd, zs).re, gammaOf(zEnd, zs).im)
      for (let k = 0; k < 12; k++) {
        const a = (k / 12) * 2 * Math.PI
        const p = { re: ring.cx + ring.radius * Math.cos(a), im: ring.cy + ring.radius * Math.sin(a) }
        const m = (1 - p.re) ** 2 + p.im ** 2
        const z = { re: z0 * (1 - p.re * p.re - p.im * p.im) / m, im: z0 * (2 * p.im) / m }
        const g = gammaOf(z, zs)
        expect(Math.abs(Math.hypot(g.re, g.im) - target)).toBeLessThan(1e-9)
      }
    }
  })

  it('has no ring for an end point on the rim', () => {
    expect(mismatchRing({ re: 0.2, im: 0.1 }, { re: 0, im: 1 })).toBeNull()
  })
})
