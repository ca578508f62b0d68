import { describe, expect, it } from 'vitest'
import {
  RfInputError, dbmFromWatts, elementStress, wattsFromDbm, type Complex, type RatedElement,
} from '../../../shared/rf/index'
import { abs, runSpice } from './spice-ladder'
import { LADDER_CASES, circuitOf, esrOf, impedanceOfModel } from './real-parts-cases'
import { expectRealClose } from './reference'

const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im })
const re = (a: Complex, b: Complex) => a.re * b.re + a.im * b.im

/** What each element sees in the ngspice AC analysis, by the same rules as elementStress documents. */
function spiceStress(c: (typeof LADDER_CASES)[number], sourceVolts: number) {
  const r = runSpice(circuitOf(c, sourceVolts))
  let node = 0
  const parts = c.elements.map((e, i) => {
    const here = r.node[node]!
    const current = r.current[i]!
    if (e.kind === 'line') {
      const up = r.node[++node]!
      return { v: Math.max(abs(here), abs(up)), i: Math.max(abs(current), abs(r.far[i]!)), esr: 0 }
    }
    if (e.kind === 'stub') {
      const far = r.far[i]!
      return e.end === 'open'
        ? { v: Math.max(abs(here), abs(far)), i: abs(current), esr: 0 }
        : { v: abs(here), i: Math.max(abs(current), abs(far)), esr: 0 }
    }
    if (e.kind !== 'L' && e.kind !== 'C' && e.kind !== 'R') throw new Error('unexpected kind')
    const esr = esrOf(e, c.frequencyHz)
    expectRealClose(r.esr[i]!, esr, `netlist ESR of element ${i}`, 1e-12)
    if (e.placement === 'series') {
      const up = r.node[++node]!
      return { v: abs(sub(up, here)), i: abs(current), esr }
    }
    return { v: abs(here), i: abs(current), esr }
  })
  return {
    parts,
    inputPowerW: re(r.node[r.node.length - 1]!, r.inputCurrent),
    loadPowerW: re(r.node[0]!, r.loadCurrent),
  }
}

describe('stress against ngspice AC analysis (a 0 V source in series with each part as its ammeter)', () => {
  it.each(LADDER_CASES.map(c => [c.name, c] as const))('%s at 2 W available', (_name, c) => {
    const f = c.frequencyHz
    const powerW = 2
    const sourceVolts = Math.sqrt(4 * c.source.r * powerW) // RMS open-circuit voltage for 2 W available
    const ours = elementStress({ frequency: f, load: impedanceOfModel(c.load, f), source: impedanceOfModel(c.source, f), powerW, elements: c.elements })
    const spice = spiceStress(c, sourceVolts)
    expectRealClose(ours.sourceVoltageRms, sourceVolts, 'source voltage')
    ours.elements.forEach((s, i) => {
      const label = `${c.name}: element ${i} (${c.elements[i]!.kind})`
      // ngspice AC analysis: node voltages (shunt parts, line ends) and branch currents (ammeters).
      expectRealClose(s.voltageRms, spice.parts[i]!.v, `${label} voltage`)
      expectRealClose(s.currentRms, spice.parts[i]!.i, `${label} current`)
      // ngspice AC analysis: heat in the ESR is |I|²·ESR with I from the part's ammeter.
      expectRealClose(s.dissipatedW, spice.parts[i]!.i ** 2 * spice.parts[i]!.esr, `${label} dissipation`, 1e-9)
    })
    expectRealClose(ours.inputPowerW, spice.inputPowerW, 'input power')
    expectRealClose(ours.loadPowerW, spice.loadPowerW, 'load power')
    expect(ours.loadPowerW).toBeLessThan(ours.inputPowerW)
    expect(ours.inputPowerW).toBeLessThanOrEqual(powerW * (1 + 1e-12))
  })
})

describe('stress: ratings, units and edge cases', () => {
  const c = LADDER_CASES[0]!
  const f = c.frequencyHz
  const base = { frequency: f, load: impedanceOfModel(c.load, f), source: impedanceOfModel(c.source, f), powerW: 1 }

  it('flags a part only when its rating is exceeded', () => {
    const plain = elementStress({ ...base, elements: c.elements })
    const [l, cap] = plain.elements
    const rated: RatedElement[] = [
      { ...c.elements[0]!, iRatingA: l!.currentRms * 0.99, vRatingV: l!.voltagePeak * 1.01 },
      { ...c.elements[1]!, vRatingV: cap!.voltagePeak * 0.99, iRatingA: cap!.currentRms * 1.01 },
    ]
    const out = elementStress({ ...base, elements: rated })
    expect(out.elements.map(s => [s.isOverVoltage, s.isOverCurrent])).toEqual([[false, true], [true, false]])
    expect(out.elements[0]!.iRatingA).toBeCloseTo(l!.currentRms * 0.99, 12)
    expect(plain.elements.every(s => !s.isOverVoltage && !s.isOverCurrent && s.vRatingV === null)).toBe(true)
  })

  it('compares a voltage rating with the peak, √2 times the RMS voltage', () => {
    const plain = elementStress({ ...base, elements: c.elements })
    const cap = plain.elements[1]!
    expect(cap.voltagePeak).toBeCloseTo(cap.voltageRms * Math.SQRT2, 12)
    expect(cap.currentPeak).toBeCloseTo(cap.currentRms * Math.SQRT2, 12)
    // a rating above the RMS voltage but below the peak is exceeded (a 10 V part at 8.4 V rms, 11.9 V peak)
    const between = (cap.voltageRms + cap.voltagePeak) / 2
    const out = elementStress({ ...base, elements: [c.elements[0]!, { ...c.elements[1]!, vRatingV: between }] })
    expect(out.elements[1]!.isOverVoltage).toBe(true)
  })

  it('scales voltages and currents with the square root of the power', () => {
    const one = elementStress({ ...base, elements: c.elements })
    const four = elementStress({ ...base, powerW: 4, elements: c.elements })
    one.elements.forEach((s, i) => {
      expectRealClose(four.elements[i]!.voltageRms, 2 * s.voltageRms, 'V')
      expectRealClose(four.elements[i]!.currentRms, 2 * s.currentRms, 'I')
    })
  })

  it('into a conjugate match the network takes all the available power', () => {
    // A bare 50 Ω load on a 50 Ω source: 1 W available is 1 W delivered, 7.07 V RMS across it.
    const out = elementStress({ frequency: 1e9, load: { re: 50, im: 0 }, source: { re: 50, im: 0 }, powerW: 1, elements: [{ kind: 'R', placement: 'shunt', value: 1e9 }] })
    expectRealClose(out.inputPowerW, 1, 'input power', 1e-9)
    expectRealClose(out.elements[0]!.voltageRms, Math.sqrt(50), 'voltage across the load')
  })

  it('converts dBm and W (0 dBm = 1 mW, 30 dBm = 1 W, common practice)', () => {
    expectRealClose(wattsFromDbm(0), 1e-3, '0 dBm')
    expectRealClose(wattsFromDbm(30), 1, '30 dBm')
    expectRealClose(dbmFromWatts(0.5), 26.98970004336019, '0.5 W')
  })

  it('refuses bad power, a source without resistance, and a part that blocks the signal', () => {
    expect(() => elementStress({ ...base, powerW: -1, elements: [] })).toThrow(/powerW/)
    expect(() => elementStress({ ...base, source: { re: 0, im: 0 }, elements: [] })).toThrow(RfInputError)
    expect(() => elementStress({ ...base, elements: [{ kind: 'stub', end: 'short', placement: 'shunt', z0: 50, deg: 0 }] })).toThrow(/elements\[0\]/)
  })
})
