import { describe, expect, it } from 'vitest'
import Complex from 'complex.js'
import seedrandom from 'seedrandom'
import {
  OPEN, RfInputError, applyElement, electricalDegrees, elementAdmittance, elementImpedance, rlcImpedance,
  type Element,
} from '../../../shared/rf/index'
import { expectComplexClose } from './reference'

// Independent check: the textbook closed forms written directly with complex.js (tan/cot, 1/z),
// against the homogeneous kernel.
function direct(z: { re: number; im: number }, e: Element, f: number): { re: number; im: number } {
  const w = 2 * Math.PI * f
  const zc = new Complex(z.re, z.im)
  const part = (): Complex => {
    if (e.kind === 'L') return new Complex(e.q ? (w * e.value) / e.q : 0, w * e.value)
    if (e.kind === 'C') return new Complex(e.q ? 1 / (w * e.value * e.q) : 0, -1 / (w * e.value))
    if (e.kind === 'R') return new Complex(e.value, 0)
    if (e.kind === 'stub') {
      const t = (electricalDegrees(e, f) * Math.PI) / 180
      return e.end === 'open' ? new Complex(0, -e.z0 / Math.tan(t)) : new Complex(0, e.z0 * Math.tan(t))
    }
    throw new Error('two-port')
  }
  let out: Complex
  if (e.kind === 'line') {
    const t = Math.tan((electricalDegrees(e, f) * Math.PI) / 180)
    const j = new Complex(0, 1)
    out = zc.add(j.mul(e.z0 * t)).div(new Complex(e.z0, 0).add(j.mul(zc).mul(t))).mul(e.z0)
  } else if (e.kind === 'xfmr') {
    out = zc.mul(e.ratio * e.ratio)
  } else if (e.kind !== 'block' && e.placement === 'series') {
    out = zc.add(part())
  } else {
    out = zc.inverse().add(part().inverse()).inverse()
  }
  return { re: out.re, im: out.im }
}

describe('applyElement agrees with the closed forms written directly (seeded)', () => {
  const rng = seedrandom('elements-direct')
  const kinds: Element[] = []
  for (let k = 0; k < 400; k++) {
    const f = 1e6 * 10 ** (rng() * 4)
    const w = 2 * Math.PI * f
    const placement = rng() < 0.5 ? 'series' : 'shunt'
    const pick = Math.floor(rng() * 6)
    const q = rng() < 0.5 ? 20 + rng() * 300 : undefined
    const e: Element = [
      { kind: 'L', placement, value: (5 + rng() * 300) / w, ...(q ? { q } : {}) },
      { kind: 'C', placement, value: 1 / (w * (5 + rng() * 300)), ...(q ? { q } : {}) },
      { kind: 'R', placement, value: 1 + rng() * 300 },
      { kind: 'line', z0: 20 + rng() * 100, deg: 1 + rng() * 170, fRef: f * (0.5 + rng()) },
      { kind: 'stub', end: rng() < 0.5 ? 'open' : 'short', placement, z0: 20 + rng() * 100, deg: 3 + rng() * 80, fRef: f },
      { kind: 'xfmr', ratio: 0.2 + rng() * 3 },
    ][pick] as Element
    kinds.push(e)
    const z = { re: rng() * 200, im: (rng() - 0.5) * 400 }
    it(`#${k} ${e.kind}`, () => expectComplexClose(applyElement(z, e, f), direct(z, e, f), `${JSON.stringify(e)} on ${z.re}+j${z.im}`))
  }
})

describe('element impedance and admittance', () => {
  const f = 868e6
  it('finite Q is a series ESR of |X|/Q on L and C', () => {
    const zl = elementImpedance({ kind: 'L', placement: 'shunt', value: 10e-9, q: 50 }, f)
    expect(zl.re).toBeCloseTo(zl.im / 50, 12)
    const zc = elementImpedance({ kind: 'C', placement: 'series', value: 1e-12, q: 400 }, f)
    expect(zc.re).toBeCloseTo(-zc.im / 400, 12)
  })

  it('a capacitor of 0 F has infinite impedance and an inductor of 0 H infinite admittance', () => {
    expect(elementImpedance({ kind: 'C', placement: 'series', value: 0 }, f)).toEqual(OPEN)
    expect(elementAdmittance({ kind: 'L', placement: 'shunt', value: 0 }, f)).toEqual(OPEN)
    expectComplexClose(elementAdmittance({ kind: 'R', placement: 'shunt', value: 200 }, f), { re: 0.005, im: 0 }, '1/200 Ω')
  })

  it('lines and transformers have no single impedance', () => {
    expect(() => elementImpedance({ kind: 'line', z0: 50, deg: 10 }, f)).toThrow(RfInputError)
    expect(() => elementImpedance({ kind: 'xfmr', ratio: 2 }, f)).toThrow(/two-port/)
  })

  it('electrical length scales with f/fRef and defaults to the stated degrees', () => {
    expect(electricalDegrees({ deg: 90, fRef: 1e9 }, 2e9)).toBe(180)
    expect(electricalDegrees({ deg: 37 }, 5e9)).toBe(37)
  })

  it('R-L-C terminals: series and parallel, absent parts left out', () => {
    const w = 2 * Math.PI * f
    expectComplexClose(rlcImpedance({ topology: 'series', r: 42, l: 28e-9, c: 1.1e-12 }, f), { re: 42, im: w * 28e-9 - 1 / (w * 1.1e-12) }, 'series RLC')
    const y = new Complex(1 / 300, 0).add(new Complex(0, -1 / (w * 12e-9))).add(new Complex(0, w * 2e-12))
    const z = y.inverse()
    expectComplexClose(rlcImpedance({ topology: 'parallel', r: 300, l: 12e-9, c: 2e-12 }, f), { re: z.re, im: z.im }, 'parallel RLC')
    expect(rlcImpedance({ topology: 'parallel' }, f)).toEqual(OPEN)
    expect(rlcImpedance({ topology: 'series', c: 0 }, f)).toEqual(OPEN)
    expect(() => rlcImpedance({ topology: 'series', r: -1 }, f)).toThrow(/model\.r/)
  })
})
