// The drag constraint: seeded random properties (the point stays on its circle, the value
// reproduces the point through applyElement, the point is the nearest reachable one) and the
// sign clamp. Circles are written out here from Γ = (z − 1)/(z + 1) rather than taken from the
// code under test.
import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import type { Complex, Element } from '../../../shared/rf/types'
import { applyElement } from '../../../shared/rf/elements'
import { DRAG_T_MAX, DRAG_T_MIN, distanceFromLocus, dragElement, dragLocus, isDraggable } from '../../../shared/rf/drag'

const Z0 = 50
const F = 915e6
const W = 2 * Math.PI * F
const ON_CIRCLE = 1e-9

function gammaOf(z: Complex, z0: number): Complex {
  if (!Number.isFinite(z.re) || !Number.isFinite(z.im)) return { re: 1, im: 0 }
  const a = { re: z.re - z0, im: z.im }
  const b = { re: z.re + z0, im: z.im }
  const m = b.re * b.re + b.im * b.im
  return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m }
}

function gap(a: Complex, b: Complex): number {
  return Math.hypot(a.re - b.re, a.im - b.im)
}

/** Distance of Γ from the circle (cx, 0)-centred of constant r or g, or (1, 1/x) of constant x. */
function fromCircle(g: Complex, cx: number, cy: number, radius: number): number {
  return Math.abs(Math.hypot(g.re - cx, g.im - cy) - radius)
}

function inverse(z: Complex): Complex {
  const m = z.re * z.re + z.im * z.im
  return { re: z.re / m, im: -z.im / m }
}

/** A random passive impedance, spread over the whole chart. */
function randomZ(rng: () => number): Complex {
  const g = { r: Math.sqrt(rng()) * 0.97, a: rng() * 2 * Math.PI }
  const gamma = { re: g.r * Math.cos(g.a), im: g.r * Math.sin(g.a) }
  const d = { re: 1 - gamma.re, im: -gamma.im }
  const n = { re: 1 + gamma.re, im: gamma.im }
  const m = d.re * d.re + d.im * d.im
  return { re: Z0 * (n.re * d.re + n.im * d.im) / m, im: Z0 * (n.im * d.re - n.re * d.im) / m }
}

function randomPointer(rng: () => number): Complex {
  const r = Math.sqrt(rng()) * 1.05
  const a = rng() * 2 * Math.PI
  return { re: r * Math.cos(a), im: r * Math.sin(a) }
}

const KINDS: { name: string, make: (rng: () => number) => Element }[] = [
  { name: 'series L', make: () => ({ kind: 'L', placement: 'series', value: 8e-9 }) },
  { name: 'series C', make: () => ({ kind: 'C', placement: 'series', value: 2e-12 }) },
  { name: 'shunt L', make: () => ({ kind: 'L', placement: 'shunt', value: 12e-9 }) },
  { name: 'shunt C', make: () => ({ kind: 'C', placement: 'shunt', value: 3.9e-12 }) },
  { name: 'series R', make: () => ({ kind: 'R', placement: 'series', value: 10 }) },
  { name: 'shunt R', make: () => ({ kind: 'R', placement: 'shunt', value: 200 }) },
  { name: 'lossy series L', make: () => ({ kind: 'L', placement: 'series', value: 8e-9, q: 40 }) },
  { name: 'lossy shunt C', make: () => ({ kind: 'C', placement: 'shunt', value: 3e-12, q: 25 }) },
  { name: 'line', make: rng => ({ kind: 'line', z0: 20 + 100 * rng(), deg: 180 * rng() }) },
  { name: 'line with fRef', make: rng => ({ kind: 'line', z0: 20 + 100 * rng(), deg: 90 * rng(), fRef: 2.4e9 }) },
  { name: 'open shunt stub', make: rng => ({ kind: 'stub', end: 'open', placement: 'shunt', z0: 30 + 60 * rng(), deg: 40 }) },
  { name: 'short shunt stub', make: rng => ({ kind: 'stub', end: 'short', placement: 'shunt', z0: 30 + 60 * rng(), deg: 40 }) },
  { name: 'open series stub', make: rng => ({ kind: 'stub', end: 'open', placement: 'series', z0: 30 + 60 * rng(), deg: 100, fRef: 1.2e9 }) },
  { name: 'short series stub', make: rng => ({ kind: 'stub', end: 'short', placement: 'series', z0: 30 + 60 * rng(), deg: 100 }) },
]

function withValue(element: Element, field: 'value' | 'deg', value: number): Element {
  return { ...element, [field]: value } as Element
}

describe('dragElement: seeded random properties', () => {
  for (const kind of KINDS) {
    it(`${kind.name}: stays on its locus and applyElement reproduces the point`, () => {
      const rng = seedrandom(`drag-${kind.name}`)
      for (let i = 0; i < 300; i++) {
        const element = kind.make(rng)
        const zPrev = randomZ(rng)
        const pointer = randomPointer(rng)
        const result = dragElement({ element, zPrev, pointer, z0: Z0, frequencyHz: F })
        const locus = dragLocus(element, zPrev, Z0, F)
        expect(locus).not.toBeNull()
        expect(distanceFromLocus(locus!, result.gamma.re, result.gamma.im)).toBeLessThan(ON_CIRCLE)
        // Through the RF core, the value gives the same point.
        const applied = gammaOf(applyElement(zPrev, withValue(element, result.field, result.value), F), Z0)
        expect(gap(applied, result.gamma)).toBeLessThan(ON_CIRCLE)
        expect(gap(gammaOf(result.z, Z0), result.gamma)).toBeLessThan(ON_CIRCLE)
        expect(result.value).toBeGreaterThan(0)
        expect(Number.isFinite(result.value)).toBe(true)
      }
    })
  }

  it('lossless series L and C stay on the constant-resistance circle of z_prev', () => {
    const rng = seedrandom('drag-constant-r')
    for (let i = 0; i < 400; i++) {
      const zPrev = randomZ(rng)
      const r = zPrev.re / Z0
      const element: Element = { kind: i % 2 ? 'L' : 'C', placement: 'series', value: 1e-9 }
      const { gamma } = dragElement({ element, zPrev, pointer: randomPointer(rng), z0: Z0, frequencyHz: F })
      expect(fromCircle(gamma, r / (1 + r), 0, 1 / (1 + r))).toBeLessThan(ON_CIRCLE)
    }
  })

  it('lossless shunt L and C stay on the constant-conductance circle of y_prev', () => {
    const rng = seedrandom('drag-constant-g')
    for (let i = 0; i < 400; i++) {
      const zPrev = randomZ(rng)
      const g = inverse(zPrev).re * Z0
      const element: Element = { kind: i % 2 ? 'L' : 'C', placement: 'shunt', value: 1e-12 }
      const { gamma } = dragElement({ element, zPrev, pointer: randomPointer(rng), z0: Z0, frequencyHz: F })
      expect(fromCircle(gamma, -g / (1 + g), 0, 1 / (1 + g))).toBeLessThan(ON_CIRCLE)
    }
  })

  it('series R keeps the reactance and shunt R the susceptance', () => {
    const rng = seedrandom('drag-constant-x')
    for (let i = 0; i < 400; i++) {
      const zPrev = randomZ(rng)
      const pointer = randomPointer(rng)
      const x = zPrev.im / Z0
      const b = inverse(zPrev).im * Z0
      const series = dragElement({ element: { kind: 'R', placement: 'series', value: 1 }, zPrev, pointer, z0: Z0, frequencyHz: F })
      const shunt = dragElement({ element: { kind: 'R', placement: 'shunt', value: 1 }, zPrev, pointer, z0: Z0, frequencyHz: F })
      expect(fromCircle(series.gamma, 1, 1 / x, 1 / Math.abs(x))).toBeLessThan(ON_CIRCLE * Math.max(1, 1 / Math.abs(x)))
      expect(fromCircle(shunt.gamma, -1, -1 / b, 1 / Math.abs(b))).toBeLessThan(ON_CIRCLE * Math.max(1, 1 / Math.abs(b)))
    }
  })

  it('a line keeps |Γ| about its own Zc', () => {
    const rng = seedrandom('drag-line-rho')
    for (let i = 0; i < 400; i++) {
      const zPrev = randomZ(rng)
      const zc = 20 + 100 * rng()
      const { z } = dragElement({ element: { kind: 'line', z0: zc, deg: 30 }, zPrev, pointer: randomPointer(rng), z0: Z0, frequencyHz: F })
      const before = Math.hypot(gammaOf(zPrev, zc).re, gammaOf(zPrev, zc).im)
      const after = Math.hypot(gammaOf(z, zc).re, gammaOf(z, zc).im)
      expect(Math.abs(after - before)).toBeLessThan(ON_CIRCLE)
    }
  })

  it('gives the reachable point nearest the pointer (sampled values never come closer)', () => {
    const rng = seedrandom('drag-nearest')
    const elements: Element[] = [
      { kind: 'L', placement: 'series', value: 1e-9 },
      { kind: 'C', placement: 'shunt', value: 1e-12 },
      { kind: 'R', placement: 'series', value: 1 },
    ]
    for (let i = 0; i < 150; i++) {
      const element = elements[i % elements.length]!
      const zPrev = randomZ(rng)
      const pointer = randomPointer(rng)
      const result = dragElement({ element, zPrev, pointer, z0: Z0, frequencyHz: F })
      const best = gap(result.gamma, pointer)
      // A held drag stops at DRAG_T_MIN from the start, up to about 1e-6 in Γ short of it.
      const slack = result.blocked ? 2e-6 : 1e-9
      const unit = (element as { value: number }).value
      for (let k = -60; k <= 60; k++) {
        const sample = gammaOf(applyElement(zPrev, withValue(element, 'value', unit * 10 ** (k / 10)), F), Z0)
        expect(gap(sample, pointer)).toBeGreaterThanOrEqual(best - slack)
      }
    }
  })
})

describe('dragElement: values', () => {
  it('series L from a hand-worked case: 25 Ω to 25 + j25 Ω needs X = 25 Ω, L = X/ω', () => {
    const result = dragElement({
      element: { kind: 'L', placement: 'series', value: 1e-9 },
      zPrev: { re: 25, im: 0 },
      pointer: gammaOf({ re: 25, im: 25 }, Z0),
      z0: Z0,
      frequencyHz: F,
    })
    expect(result.blocked).toBeUndefined()
    expect(result.value).toBeCloseTo(25 / W, 20)
    expect(Math.abs(result.value - 25 / W) / (25 / W)).toBeLessThan(1e-12)
  })

  it('shunt C from 50 Ω to y = (1 + j1)/50 needs B = 1/50 S, C = B/ω', () => {
    const pointerZ = inverse({ re: 1 / 50, im: 1 / 50 })
    const result = dragElement({
      element: { kind: 'C', placement: 'shunt', value: 1e-12 },
      zPrev: { re: 50, im: 0 },
      pointer: gammaOf(pointerZ, Z0),
      z0: Z0,
      frequencyHz: F,
    })
    expect(Math.abs(result.value - (1 / 50) / W) / ((1 / 50) / W)).toBeLessThan(1e-12)
  })

  it('series C adds X − X_prev = −1/(ωC)', () => {
    const result = dragElement({
      element: { kind: 'C', placement: 'series', value: 1e-12 },
      zPrev: { re: 30, im: 40 },
      pointer: gammaOf({ re: 30, im: 10 }, Z0),
      z0: Z0,
      frequencyHz: F,
    })
    const expected = 1 / (W * 30)
    expect(Math.abs(result.value - expected) / expected).toBeLessThan(1e-12)
  })

  it('a line past half a wavelength keeps growing instead of jumping back to zero', () => {
    const zPrev = { re: 20, im: -10 }
    const element: Element = { kind: 'line', z0: 50, deg: 175 }
    const target = applyElement(zPrev, { ...element, deg: 190 }, F)
    const result = dragElement({ element, zPrev, pointer: gammaOf(target, Z0), z0: Z0, frequencyHz: F })
    expect(result.value).toBeCloseTo(190, 9)
  })

  it('a line with fRef is measured at fRef', () => {
    const zPrev = { re: 20, im: -10 }
    const element: Element = { kind: 'line', z0: 50, deg: 10, fRef: 2 * F }
    const target = applyElement(zPrev, { kind: 'line', z0: 50, deg: 30 }, F) // 30° at F
    const result = dragElement({ element, zPrev, pointer: gammaOf(target, Z0), z0: Z0, frequencyHz: F })
    expect(result.value).toBeCloseTo(60, 9)
  })

  it('a stub reaches either sign without a block', () => {
    const zPrev = { re: 30, im: 20 }
    for (const end of ['open', 'short'] as const) {
      for (const b of [-0.03, 0.03]) {
        const target = inverse({ re: inverse(zPrev).re, im: inverse(zPrev).im + b })
        const result = dragElement({
          element: { kind: 'stub', end, placement: 'shunt', z0: 50, deg: 45 },
          zPrev, pointer: gammaOf(target, Z0), z0: Z0, frequencyHz: F,
        })
        expect(result.blocked).toBeUndefined()
        expect(gap(gammaOf(result.z, Z0), gammaOf(target, Z0))).toBeLessThan(1e-9)
      }
    }
  })
})

describe('dragElement: the sign clamp', () => {
  const zPrev = { re: 30, im: 20 }
  const start = gammaOf(zPrev, Z0)

  it('a series L asked for capacitive reactance holds at z_prev and says so', () => {
    const result = dragElement({
      element: { kind: 'L', placement: 'series', value: 5e-9 },
      zPrev, pointer: gammaOf({ re: 30, im: 5 }, Z0), z0: Z0, frequencyHz: F,
    })
    expect(result.blocked).toBe('sign')
    expect(result.value).toBeLessThanOrEqual((DRAG_T_MIN * Z0 / W) * (1 + 1e-9))
    expect(gap(result.gamma, start)).toBeLessThan(1e-5)
  })

  it('a series L asked for the far side of the open holds at the open end', () => {
    // Just past Γ = 1 on the constant-r circle (x very negative).
    const result = dragElement({
      element: { kind: 'L', placement: 'series', value: 5e-9 },
      zPrev, pointer: gammaOf({ re: 30, im: -5000 }, Z0), z0: Z0, frequencyHz: F,
    })
    expect(result.blocked).toBe('sign')
    expect(result.value).toBeCloseTo(DRAG_T_MAX * Z0 / W, 12)
    expect(gap(result.gamma, { re: 1, im: 0 })).toBeLessThan(1e-5)
  })

  it('a series C asked for inductive reactance is blocked', () => {
    const result = dragElement({
      element: { kind: 'C', placement: 'series', value: 5e-12 },
      zPrev, pointer: gammaOf({ re: 30, im: 35 }, Z0), z0: Z0, frequencyHz: F,
    })
    expect(result.blocked).toBe('sign')
    expect(gap(result.gamma, start)).toBeLessThan(1e-5)
  })

  it('a shunt C asked for negative susceptance is blocked, a shunt L asked for positive too', () => {
    const y = inverse(zPrev)
    const lower = inverse({ re: y.re, im: y.im - 0.004 })
    const higher = inverse({ re: y.re, im: y.im + 0.004 })
    const c = dragElement({ element: { kind: 'C', placement: 'shunt', value: 1e-12 }, zPrev, pointer: gammaOf(lower, Z0), z0: Z0, frequencyHz: F })
    const l = dragElement({ element: { kind: 'L', placement: 'shunt', value: 1e-8 }, zPrev, pointer: gammaOf(higher, Z0), z0: Z0, frequencyHz: F })
    expect(c.blocked).toBe('sign')
    expect(l.blocked).toBe('sign')
    // The same pointers in the allowed direction are not blocked.
    expect(dragElement({ element: { kind: 'C', placement: 'shunt', value: 1e-12 }, zPrev, pointer: gammaOf(higher, Z0), z0: Z0, frequencyHz: F }).blocked).toBeUndefined()
    expect(dragElement({ element: { kind: 'L', placement: 'shunt', value: 1e-8 }, zPrev, pointer: gammaOf(lower, Z0), z0: Z0, frequencyHz: F }).blocked).toBeUndefined()
  })

  it('a series R cannot take resistance away', () => {
    const result = dragElement({
      element: { kind: 'R', placement: 'series', value: 5 },
      zPrev, pointer: gammaOf({ re: 10, im: 20 }, Z0), z0: Z0, frequencyHz: F,
    })
    expect(result.blocked).toBe('sign')
    expect(result.value).toBeGreaterThan(0)
    expect(gap(result.gamma, start)).toBeLessThan(1e-5)
  })
})

describe('degenerate points and the transformer', () => {
  it('a transformer has no drag', () => {
    const element: Element = { kind: 'xfmr', ratio: 2 }
    expect(isDraggable(element)).toBe(false)
    expect(dragLocus(element, { re: 10, im: 0 }, Z0, F)).toBeNull()
    expect(() => dragElement({ element, zPrev: { re: 10, im: 0 }, pointer: { re: 0, im: 0 }, z0: Z0, frequencyHz: F })).toThrow(/transformer/)
  })

  it('a measured block has no drag either', () => {
    const element = { kind: 'block', uploadId: 'u1', name: 'filter.s2p' } as unknown as Element
    expect(isDraggable(element)).toBe(false)
    expect(dragLocus(element, { re: 10, im: 0 }, Z0, F)).toBeNull()
    expect(() => dragElement({ element, zPrev: { re: 10, im: 0 }, pointer: { re: 0, im: 0 }, z0: Z0, frequencyHz: F })).toThrow(/block/)
  })

  it('a series part on an open keeps its value and the open', () => {
    const element: Element = { kind: 'L', placement: 'series', value: 3e-9 }
    const result = dragElement({ element, zPrev: { re: Infinity, im: 0 }, pointer: { re: 0.2, im: 0.4 }, z0: Z0, frequencyHz: F })
    expect(result.value).toBe(3e-9)
    expect(gap(result.gamma, { re: 1, im: 0 })).toBeLessThan(1e-12)
  })

  it('a line matched to its own Zc cannot move the point', () => {
    const element: Element = { kind: 'line', z0: 75, deg: 20 }
    expect(dragLocus(element, { re: 75, im: 0 }, Z0, F)).toBeNull()
    const result = dragElement({ element, zPrev: { re: 75, im: 0 }, pointer: { re: 0.5, im: 0.5 }, z0: Z0, frequencyHz: F })
    expect(result.value).toBe(20)
  })

  it('a series R on a purely resistive point moves along the real axis', () => {
    const locus = dragLocus({ kind: 'R', placement: 'series', value: 1 }, { re: 20, im: 0 }, Z0, F)
    expect(locus?.kind).toBe('line')
    const result = dragElement({ element: { kind: 'R', placement: 'series', value: 1 }, zPrev: { re: 20, im: 0 }, pointer: { re: 0.1, im: 0.3 }, z0: Z0, frequencyHz: F })
    expect(Math.abs(result.gamma.im)).toBeLessThan(1e-12)
    expect(Math.abs(result.z.re - (50 * 1.1) / 0.9)).toBeLessThan(1e-9)
  })
})
