// The amplifier across a band: the device file interpolated like a measured load, and the whole
// cascade (source, input network, device, output network, load) checked against the one-frequency
// figures and the mismatch relation at each device port.
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import {
  amplifierSweep, deviceBand, gammaIn, gammaOf, gammaOut, interpolateNoise, parseTouchstone, sweep,
  transducerGainDb, twoPortFigures, type Complex, type Element,
} from '../../../shared/rf/index'

const DIR = fileURLToPath(new URL('../../fixtures/amplifier/', import.meta.url))
const device = parseTouchstone(readFileSync(`${DIR}invented-phemt.s2p`, 'utf8'), 'invented-phemt.s2p')
const dist = (a: Complex, b: Complex) => Math.hypot(a.re - b.re, a.im - b.im)
const mag = (x: Complex) => Math.hypot(x.re, x.im)
/** |(Γ − Γref*)/(1 − Γ·Γref)|: the power-wave mismatch between a port's Γ and what drives it. */
function mismatch(g: Complex, ref: Complex): number {
  const num = { re: g.re - ref.re, im: g.im + ref.im }
  const den = { re: 1 - (g.re * ref.re - g.im * ref.im), im: -(g.re * ref.im + g.im * ref.re) }
  return mag(num) / mag(den)
}

const input: Element[] = [
  { kind: 'C', placement: 'shunt', value: 2.2e-12 },
  { kind: 'L', placement: 'series', value: 12e-9 },
  { kind: 'C', placement: 'shunt', value: 1e-12 },
]
const output: Element[] = [
  { kind: 'L', placement: 'shunt', value: 27e-9 },
  { kind: 'C', placement: 'series', value: 3.3e-12 },
]
const band = Array.from({ length: 21 }, (_, i) => 0.6e9 + i * 0.1e9)

describe('deviceBand', () => {
  it('at the file frequencies the figures are those of the file rows; outside the file, null', () => {
    const points = deviceBand(device, [...device.frequencies, 7e9, 0.2e9])
    device.frequencies.forEach((_, k) => expect(points[k]!.figures).toEqual(twoPortFigures(device.s[k]!)))
    expect(points.at(-1)!.s).toBeNull()
    expect(points.at(-2)!.figures).toBeNull()
  })

  it('between two rows, S and the noise row are linear in f (midpoint = mean of the rows)', () => {
    const [mid] = deviceBand(device, [1.25e9])
    const a = device.s[2]!, b = device.s[3]!
    expect(dist(mid!.s![1]![0]!, { re: (a[1]![0]!.re + b[1]![0]!.re) / 2, im: (a[1]![0]!.im + b[1]![0]!.im) / 2 })).toBeLessThan(1e-12)
    const [n] = interpolateNoise(device.noise, [1.5e9])
    expect(n!.nfminDb).toBeCloseTo((device.noise[1]!.nfminDb + device.noise[2]!.nfminDb) / 2, 12)
    expect(n!.rnNormalized).toBeCloseTo((device.noise[1]!.rnNormalized + device.noise[2]!.rnNormalized) / 2, 12)
    expect(interpolateNoise([], [1e9])).toEqual([null])
  })
})

describe('amplifierSweep', () => {
  const points = amplifierSweep({ z0: 50, frequencies: band, device, inputElements: input, outputElements: output })

  it('ΓS and ΓL are where each side\'s trace from its 50 Ω terminal ends', () => {
    const zs = sweep({ z0: 50, frequencies: band, load: { re: 50, im: 0 }, elements: input })
    const zl = sweep({ z0: 50, frequencies: band, load: { re: 50, im: 0 }, elements: output })
    points.forEach((p, k) => {
      expect(dist(p.gammaS, gammaOf(zs[k]!, 50))).toBeLessThan(1e-9)
      expect(dist(p.gammaL, gammaOf(zl[k]!, 50))).toBeLessThan(1e-9)
    })
  })

  it('with lossless networks the cascade gain is the device GT at (ΓS, ΓL), and the return losses are the port mismatches', () => {
    for (const p of points) {
      expect(p.transducerGainDb!).toBeCloseTo(transducerGainDb(p.s!, p.gammaS, p.gammaL), 8)
      expect(10 ** (-p.inputReturnLossDb! / 20)).toBeCloseTo(mismatch(gammaIn(p.s!, p.gammaL), p.gammaS), 8)
      expect(10 ** (-p.outputReturnLossDb! / 20)).toBeCloseTo(mismatch(gammaOut(p.s!, p.gammaS), p.gammaL), 8)
      expect(p.isTerminationStable).toBe(mag(gammaOut(p.s!, p.gammaS)) < 1 && mag(gammaIn(p.s!, p.gammaL)) < 1)
      expect(p.noiseFigureDb).not.toBeNull()
    }
  })

  it('empty networks present 50 Ω: ΓS = ΓL = 0, gain |S21|², return losses from S11 and S22', () => {
    const [p] = amplifierSweep({ z0: 50, frequencies: [2e9], device, inputElements: [], outputElements: [] })
    expect(mag(p!.gammaS)).toBeLessThan(1e-12)
    expect(p!.transducerGainDb!).toBeCloseTo(20 * Math.log10(mag(device.s[4]![1]![0]!)), 9)
    expect(p!.inputReturnLossDb!).toBeCloseTo(-20 * Math.log10(mag(device.s[4]![0]![0]!)), 9)
    expect(mag(p!.gammaL)).toBeLessThan(1e-12)
  })

  it('outside the device file the networks still answer but the figures are null', () => {
    const [p] = amplifierSweep({ z0: 50, frequencies: [8e9], device, inputElements: input, outputElements: output })
    expect(p!.cascade).toBeNull()
    expect(p!.transducerGainDb).toBeNull()
    expect(p!.isTerminationStable).toBeNull()
  })
})
