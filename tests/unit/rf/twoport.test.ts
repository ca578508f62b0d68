// Two-port conversions, measured blocks in a ladder and the ladder exported as a .s2p.
import { readFileSync } from 'node:fs'
import { REFERENCE_ROOT } from '../../support/reference'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import {
  abcdToS, gammaOf, ladderSParameters, parseTouchstone, sToAbcd, sweep, trace, writeTouchstone,
  type Complex, type Element, type TwoPortData,
} from '../../../shared/rf/index'
import { complexError } from './reference'

const TOUCHSTONE_DIR = path.resolve(REFERENCE_ROOT, 'touchstone')
const readReference = (file: string) => parseTouchstone(readFileSync(path.join(TOUCHSTONE_DIR, file), 'utf8'), file)

function expectWithin(actual: Complex, expected: Complex, rel: number, label: string) {
  expect(complexError(actual, expected, 1e-12), `${label}: ${actual.re}+j${actual.im} vs ${expected.re}+j${expected.im}`).toBeLessThanOrEqual(rel)
}

/** Γ at port 1 of a two-port with Γ_L on port 2 (the standard terminated-two-port relation). */
function inputGamma(s: readonly (readonly Complex[])[], gammaLoad: Complex): Complex {
  const [s11, s12] = s[0]!, [s21, s22] = s[1]!
  const mul = (x: Complex, y: Complex) => ({ re: x.re * y.re - x.im * y.im, im: x.re * y.im + x.im * y.re })
  const num = mul(mul(s12!, s21!), gammaLoad)
  const den = { re: 1 - mul(s22!, gammaLoad).re, im: -mul(s22!, gammaLoad).im }
  const d = den.re * den.re + den.im * den.im
  return { re: s11!.re + (num.re * den.re + num.im * den.im) / d, im: s11!.im + (num.im * den.re - num.re * den.im) / d }
}

const asymmetric: Element[] = [
  { kind: 'C', placement: 'shunt', value: 1.8e-12, q: 80 },
  { kind: 'L', placement: 'series', value: 8.2e-9, q: 40 },
  { kind: 'line', z0: 65, deg: 30, fRef: 915e6 },
  { kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 20, fRef: 915e6 },
  { kind: 'xfmr', ratio: 1.3 },
]
const band = Array.from({ length: 41 }, (_, i) => 800e6 + i * 5e6)

describe('S ↔ ABCD at a real reference', () => {
  it('round-trips the non-reciprocal reference amplifier (amp_ri_ghz.s2p, invented data read by scikit-rf 0.15.4)', () => {
    const amp = readReference('amp_ri_ghz.s2p')
    for (const [k, s] of amp.s.entries()) {
      const back = abcdToS(sToAbcd(s, amp.z0), amp.z0)
      for (const i of [0, 1]) for (const j of [0, 1]) expectWithin(back[i]![j]!, s[i]![j]!, 1e-12, `f${k} S${i + 1}${j + 1}`)
    }
  })

  it('round-trips random matrices at 75 Ω (seeded)', () => {
    const rng = seedrandom('twoport-roundtrip')
    const r = () => ({ re: rng() - 0.5, im: rng() - 0.5 })
    for (let n = 0; n < 200; n++) {
      const s = [[r(), r()], [{ re: 0.2 + rng(), im: rng() - 0.5 }, r()]]
      const back = abcdToS(sToAbcd(s, 75), 75)
      for (const i of [0, 1]) for (const j of [0, 1]) expectWithin(back[i]![j]!, s[i]![j]!, 1e-12, `case ${n} S${i + 1}${j + 1}`)
    }
  })

  it('gives the chain matrix of a series impedance: a 50 Ω series resistor has S11 = 1/3, S21 = 2/3 (common practice)', () => {
    const [s] = ladderSParameters({ z0: 50, frequencies: [1e9], elements: [{ kind: 'R', placement: 'series', value: 50 }] })
    expectWithin(s![0]![0]!, { re: 1 / 3, im: 0 }, 1e-14, 'S11')
    expectWithin(s![1]![0]!, { re: 2 / 3, im: 0 }, 1e-14, 'S21')
    const m = sToAbcd(s!, 50)
    expectWithin(m.b, { re: 50, im: 0 }, 1e-13, 'B')
    expectWithin(m.a, { re: 1, im: 0 }, 1e-13, 'A')
  })

  it('refuses a block that passes nothing', () => {
    const zero = { re: 0, im: 0 }
    expect(() => sToAbcd([[{ re: 1, im: 0 }, zero], [zero, { re: 1, im: 0 }]], 50)).toThrow(/S21 is zero/)
  })
})

describe('the designed ladder as a two-port', () => {
  it('matches the reference low-pass from its lumped parts (lowpass_db_ghz.s2p: 2.2 pF / 6.8 nH + 0.5 Ω / 2.2 pF, invented data read by scikit-rf 0.15.4)', () => {
    const file = readReference('lowpass_db_ghz.s2p')
    const lumped: Element[] = [
      { kind: 'C', placement: 'shunt', value: 2.2e-12 },
      { kind: 'L', placement: 'series', value: 6.8e-9 },
      { kind: 'R', placement: 'series', value: 0.5 },
      { kind: 'C', placement: 'shunt', value: 2.2e-12 },
    ]
    const s = ladderSParameters({ z0: file.z0, frequencies: file.frequencies, elements: lumped })
    // The file holds 10 significant digits in dB and degrees.
    for (const [k, m] of s.entries()) {
      for (const i of [0, 1]) for (const j of [0, 1]) expectWithin(m[i]![j]!, file.s[k]![i]![j]!, 1e-8, `${file.frequencies[k]} Hz S${i + 1}${j + 1}`)
    }
  })

  it('exports a .s2p that parseTouchstone reads back and that agrees with sweep to 1e-9', () => {
    const load = { re: 31, im: -18 }
    const s = ladderSParameters({ z0: 50, frequencies: band, elements: asymmetric })
    for (const format of ['RI', 'MA', 'DB'] as const) {
      const text = writeTouchstone({ ports: 2, z0: 50, frequencies: band, s, format, unit: 'MHZ' })
      const back = parseTouchstone(text, 'designed.s2p')
      expect(back.frequencies.length).toBe(band.length)
      const swept = sweep({ z0: 50, frequencies: band, load, elements: asymmetric })
      back.s.forEach((m, k) => {
        expectWithin(inputGamma(m, gammaOf(load, 50)), gammaOf(swept[k]!, 50), 1e-9, `${format} ${band[k]} Hz`)
      })
    }
  })
})

describe('a measured two-port block in the ladder', () => {
  function blockOf(elements: Element[], frequencies: number[]): TwoPortData {
    const text = writeTouchstone({ ports: 2, z0: 50, frequencies, s: ladderSParameters({ z0: 50, frequencies, elements }), format: 'RI', unit: 'HZ' })
    return parseTouchstone(text, 'measured-part.s2p')
  }

  it('cascades like the same network built from lumped elements (port 1 towards the source)', () => {
    const blocks = { up1: blockOf(asymmetric, band) }
    const load = { re: 22, im: 35 }
    const before: Element = { kind: 'L', placement: 'series', value: 3.3e-9 }
    const after: Element = { kind: 'C', placement: 'shunt', value: 2.7e-12 }
    const viaBlock = sweep({ z0: 50, frequencies: band, load, elements: [before, { kind: 'block', uploadId: 'up1', name: 'filter' }, after], blocks })
    const viaParts = sweep({ z0: 50, frequencies: band, load, elements: [before, ...asymmetric, after] })
    viaBlock.forEach((z, k) => expectWithin(z, viaParts[k]!, 1e-9, `${band[k]} Hz`))
    const t = trace({ z0: 50, frequency: 915e6, load, elements: [{ kind: 'block', uploadId: 'up1' }], blocks })
    const tp = trace({ z0: 50, frequency: 915e6, load, elements: asymmetric })
    expectWithin(t[1]!, tp[tp.length - 1]!, 1e-9, 'trace at 915 MHz')
  })

  it('interpolates between measured points and agrees with the lumped network closely on a fine grid', () => {
    const coarse = Array.from({ length: 201 }, (_, i) => 800e6 + i * 1e6)
    const blocks = { up1: blockOf(asymmetric, coarse) }
    const mid = [800.5e6, 915.25e6, 999.5e6]
    const viaBlock = sweep({ z0: 50, frequencies: mid, load: { re: 50, im: 0 }, elements: [{ kind: 'block', uploadId: 'up1' }], blocks })
    const viaParts = sweep({ z0: 50, frequencies: mid, load: { re: 50, im: 0 }, elements: asymmetric })
    viaBlock.forEach((z, k) => expectWithin(z, viaParts[k]!, 1e-3, `${mid[k]} Hz`))
  })

  it('refuses frequencies outside the measured range and a block without data', () => {
    const blocks = { up1: blockOf(asymmetric, band) }
    const elements: Element[] = [{ kind: 'block', uploadId: 'up1', name: 'filter' }]
    expect(() => sweep({ z0: 50, frequencies: [700e6, 900e6], load: { re: 50, im: 0 }, elements, blocks }))
      .toThrow(/elements\[0\].*covers 800000000–1000000000 Hz; 1 frequencies are outside/)
    expect(() => sweep({ z0: 50, frequencies: [900e6], load: { re: 50, im: 0 }, elements })).toThrow(/has no data/)
    const edge = trace({ z0: 50, frequency: 1.2e9, load: { re: 50, im: 0 }, elements, blocks, blockRange: 'nearest' })
    const atEdge = trace({ z0: 50, frequency: 1e9, load: { re: 50, im: 0 }, elements, blocks })
    expectWithin(edge[1]!, atEdge[1]!, 1e-15, 'nearest measured point')
  })

  it('refuses a one-port file as a block', () => {
    const antenna = readReference('antenna_ri_mhz.s1p')
    expect(() => sweep({ z0: 50, frequencies: [900e6], load: { re: 50, im: 0 }, elements: [{ kind: 'block', uploadId: 'a' }], blocks: { a: antenna } }))
      .toThrow(/must be a two-port/)
  })
})
