import { describe, expect, it } from 'vitest'
import { RfInputError, lossesAcrossBand, lossesAt, withDefaultQ, type Complex, type Element } from '../../../shared/rf/index'
import { runSpice } from './spice-ladder'
import { LADDER_CASES, circuitOf, impedanceOfModel, withFRef } from './real-parts-cases'
import { expectRealClose } from './reference'

const SOURCE_VOLTS = 1
const re = (a: Complex, b: Complex) => a.re * b.re + a.im * b.im // Re(a·b*)

/** Efficiency and insertion loss from an ngspice AC analysis of the case at f. */
function spiceLosses(c: (typeof LADDER_CASES)[number], f: number) {
  const r = runSpice(circuitOf(c, SOURCE_VOLTS, f))
  const inputPower = re(r.node[r.node.length - 1]!, r.inputCurrent)
  const loadPower = re(r.node[0]!, r.loadCurrent)
  const available = (SOURCE_VOLTS * SOURCE_VOLTS) / (4 * c.source.r)
  return {
    efficiency: loadPower / inputPower,
    insertionLossDb: -10 * Math.log10(loadPower / available),
    mismatchLossDb: -10 * Math.log10(inputPower / available),
  }
}

describe('losses at one frequency against ngspice AC analysis (ESRs as resistors)', () => {
  it.each(LADDER_CASES.map(c => [c.name, c] as const))('%s', (_name, c) => {
    const f = c.frequencyHz
    const ours = lossesAt({ frequency: f, load: impedanceOfModel(c.load, f), source: impedanceOfModel(c.source, f), elements: c.elements })
    const spice = spiceLosses(c, f)
    // ngspice AC analysis, 16 digits printed; 1e-6 relative covers its TD rounding of lines.
    expectRealClose(ours.efficiency, spice.efficiency, 'efficiency')
    expectRealClose(ours.insertionLossDb, spice.insertionLossDb, 'insertion loss', 1e-6)
    expectRealClose(ours.mismatchLossDb, spice.mismatchLossDb, 'mismatch loss', 1e-6)
    expectRealClose(ours.dissipativeLossDb, -10 * Math.log10(spice.efficiency), 'dissipative loss', 1e-6)
    expect(ours.efficiency).toBeLessThan(1)
    expect(ours.efficiency).toBeGreaterThan(0.5)
  })
})

describe('losses across a band against ngspice AC analysis, one run per frequency', () => {
  it.each(LADDER_CASES.map(c => [c.name, c] as const))('%s', (_name, c) => {
    const f0 = c.frequencyHz
    const frequencies = [0.9, 0.95, 1, 1.04, 1.1].map(x => x * f0)
    const band = lossesAcrossBand({
      frequencies,
      load: frequencies.map(f => impedanceOfModel(c.load, f)),
      source: frequencies.map(f => impedanceOfModel(c.source, f)),
      elements: withFRef(c.elements, f0),
    })
    frequencies.forEach((f, k) => {
      // The lines keep their physical length: ngspice's TD is fixed at deg/(360·f0).
      const spice = spiceLosses({ ...c, elements: c.elements.map(e => (e.kind === 'line' || e.kind === 'stub') ? { ...e, deg: (e.deg * f) / f0 } : e) }, f)
      expectRealClose(band.efficiency[k]!, spice.efficiency, `efficiency at ${f} Hz`)
      expectRealClose(band.insertionLossDb[k]!, spice.insertionLossDb, `insertion loss at ${f} Hz`, 1e-6)
    })
  })
})

describe('losses: definitions and edge cases', () => {
  const load = { re: 50, im: 0 }
  const source = { re: 50, im: 0 }

  it('a lossless ladder has efficiency 1 and insertion loss equal to the mismatch loss', () => {
    const elements: Element[] = [{ kind: 'L', placement: 'series', value: 8e-9 }, { kind: 'C', placement: 'shunt', value: 2e-12 }]
    const r = lossesAt({ frequency: 1e9, load: { re: 20, im: -10 }, source, elements })
    expect(Math.abs(r.efficiency - 1)).toBeLessThan(1e-12)
    expect(Math.abs(r.insertionLossDb - r.mismatchLossDb)).toBeLessThan(1e-9)
  })

  it('a series resistor R between matched 50 Ω ends gives efficiency 50/(50 + R)', () => {
    // Common practice: the resistor and the load share the same current.
    const r = lossesAt({ frequency: 1e9, load, source, elements: [{ kind: 'R', placement: 'series', value: 10 }] })
    expectRealClose(r.efficiency, 50 / 60, 'efficiency')
  })

  it('a measured block (the S of a series 10 Ω at 50 Ω: S11 = 10/110, S21 = 100/110) loses like the resistor', () => {
    const s11 = { re: 10 / 110, im: 0 }
    const s21 = { re: 100 / 110, im: 0 }
    const s = [[s11, s21], [s21, s11]]
    const blocks = { up1: { z0: 50, frequencies: [0.5e9, 2e9], s: [s, s] } }
    const r = lossesAt({ frequency: 1e9, load, source, elements: [{ kind: 'block', uploadId: 'up1' }], blocks })
    expectRealClose(r.efficiency, 50 / 60, 'efficiency')
    expect(() => lossesAt({ frequency: 1e9, load, source, elements: [{ kind: 'block', uploadId: 'missing' }], blocks })).toThrow(/elements\[0\]/)
  })

  it('default Q applies only to L and C parts without their own q', () => {
    const ladder: Element[] = [
      { kind: 'L', placement: 'series', value: 1e-9 },
      { kind: 'L', placement: 'series', value: 1e-9, q: 80 },
      { kind: 'C', placement: 'shunt', value: 1e-12 },
      { kind: 'R', placement: 'shunt', value: 100 },
    ]
    const out = withDefaultQ(ladder, { L: 40, C: 200 })
    expect(out.map(e => (e as { q?: number }).q)).toEqual([40, 80, 200, undefined])
    expect(withDefaultQ(ladder, undefined)).toEqual(ladder)
    const lossy = lossesAt({ frequency: 1e9, load, source, elements: out })
    const lossless = lossesAt({ frequency: 1e9, load, source, elements: ladder.filter(e => e.kind === 'R') })
    expect(lossy.efficiency).toBeLessThan(lossless.efficiency)
  })

  it('a shunt open stub at exactly 90° blocks the signal: efficiency 0, infinite loss', () => {
    const r = lossesAt({ frequency: 1e9, load, source, elements: [{ kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 90 }] })
    expect(r.efficiency).toBe(0)
    expect(r.insertionLossDb).toBe(Infinity)
  })

  it('refuses a source without resistance and names it', () => {
    expect(() => lossesAt({ frequency: 1e9, load, source: { re: 0, im: 5 }, elements: [] })).toThrow(RfInputError)
    expect(() => lossesAt({ frequency: 1e9, load, source: { re: 0, im: 5 }, elements: [] })).toThrow(/source/)
  })

  it('needs fRef on lines for a band', () => {
    expect(() => lossesAcrossBand({ frequencies: [1e9, 2e9], load, source, elements: [{ kind: 'line', z0: 50, deg: 10 }] })).toThrow(/fRef/)
  })

  it('an open load receives nothing', () => {
    const r = lossesAt({ frequency: 1e9, load: { re: Infinity, im: 0 }, source, elements: [{ kind: 'R', placement: 'shunt', value: 50 }] })
    expect(r.efficiency).toBe(0)
    expect(Math.abs(r.mismatchLossDb)).toBeLessThan(1e-12)
  })
})
