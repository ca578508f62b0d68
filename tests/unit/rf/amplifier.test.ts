// Amplifier figures and circles: against scikit-rf 0.15.4 (fixtures/amplifier/reference.json, made
// by make_reference.py from an invented device file), a handbook example, and every circle checked
// point by point from the definition of what it holds constant.
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import {
  availableGainCircle, availableGainDb, gammaIn, gammaOut, isOnStableSide, noiseCircle, noiseFigureDb,
  operatingGainCircle, operatingGainDb, parseTouchstone, stabilityCircle, transducerGainDb, twoPortFigures,
  type Complex, type GammaCircle,
} from '../../../shared/rf/index'

const DIR = fileURLToPath(new URL('../../fixtures/amplifier/', import.meta.url))
const device = parseTouchstone(readFileSync(`${DIR}invented-phemt.s2p`, 'utf8'), 'invented-phemt.s2p')
const reference = JSON.parse(readFileSync(`${DIR}reference.json`, 'utf8'))
const SKRF = 'scikit-rf 0.15.4 (reference.json)'

const polar = (m: number, deg: number): Complex => ({ re: m * Math.cos(deg * Math.PI / 180), im: m * Math.sin(deg * Math.PI / 180) })
const conj = (x: Complex): Complex => ({ re: x.re, im: -x.im })
const mag = (x: Complex) => Math.hypot(x.re, x.im)
const dist = (a: Complex, b: Complex) => Math.hypot(a.re - b.re, a.im - b.im)
const db = (ratio: number) => 10 * Math.log10(ratio)

/** Points on a circle (or along its line) that lie inside the passive chart. */
function pointsOn(c: GammaCircle, n = 24): Complex[] {
  const out: Complex[] = []
  for (let i = 0; i < n; i++) {
    let p: Complex
    if (c.line) {
      const { normal, offset } = c.line
      const t = -1.5 + (3 * i) / (n - 1)
      p = { re: normal.re * offset - normal.im * t, im: normal.im * offset + normal.re * t }
    }
    else {
      const a = (2 * Math.PI * i) / n
      p = { re: c.center.re + c.radius * Math.cos(a), im: c.center.im + c.radius * Math.sin(a) }
    }
    if (mag(p) < 0.995) out.push(p)
  }
  return out
}

// Definitions, not the closed forms under test: GA is GT with the output conjugately matched,
// GP is GT with the input conjugately matched (Gonzalez, Microwave Transistor Amplifiers, 2nd ed., §2.6).
const gaByDefinition = (s: Complex[][], gs: Complex) => transducerGainDb(s, gs, conj(gammaOut(s, gs)))
const gpByDefinition = (s: Complex[][], gl: Complex) => transducerGainDb(s, conj(gammaIn(s, gl)), gl)

// Pozar, Microwave Engineering, 4th ed., Example 12.3 (a GaAs FET at 4 GHz), values recalled from memory.
const POZAR: Complex[][] = [[polar(0.72, -116), polar(0.03, 57)], [polar(2.60, 76), polar(0.73, -54)]]

describe('twoPortFigures against scikit-rf and a handbook example', () => {
  it(`K at every frequency of the device file matches ${SKRF} Network.stability`, () => {
    device.s.forEach((s, k) => expect(twoPortFigures(s).k).toBeCloseTo(reference.k[k], 9))
  })

  it('the handbook FET: K ≈ 1.195, |Δ| ≈ 0.488, ΓMS ≈ 0.872∠123°, ΓML ≈ 0.876∠61°, GT,max ≈ 16.7 dB (Pozar, recalled from memory)', () => {
    const f = twoPortFigures(POZAR)
    expect(f.k).toBeCloseTo(1.195, 2)
    expect(mag(f.delta)).toBeCloseTo(0.488, 2)
    expect(f.unconditionallyStable).toBe(true)
    expect(f.maxGainKind).toBe('MAG')
    expect(dist(f.gammaMS!, polar(0.872, 123))).toBeLessThan(0.01)
    expect(dist(f.gammaML!, polar(0.876, 61))).toBeLessThan(0.01)
    expect(f.maxGainDb).toBeCloseTo(16.7, 1)
  })

  it('the simultaneous conjugate match: Γin(ΓML) = ΓMS*, Γout(ΓMS) = ΓML*, and GT there is the MAG', () => {
    const stable = device.s.filter(s => twoPortFigures(s).unconditionallyStable)
    expect(stable.length).toBeGreaterThan(0)
    for (const s of [...stable, POZAR]) {
      const f = twoPortFigures(s)
      expect(dist(gammaIn(s, f.gammaML!), conj(f.gammaMS!))).toBeLessThan(1e-9)
      expect(dist(gammaOut(s, f.gammaMS!), conj(f.gammaML!))).toBeLessThan(1e-9)
      expect(transducerGainDb(s, f.gammaMS!, f.gammaML!)).toBeCloseTo(f.maxGainDb, 9)
    }
  })

  it('a conditionally stable frequency has μ ≤ 1, the MSG |S21/S12| and no conjugate match', () => {
    const s = device.s[2]!
    const f = twoPortFigures(s)
    expect(f.mu).toBeLessThan(1)
    expect(f.unconditionallyStable).toBe(false)
    expect(f.maxGainKind).toBe('MSG')
    expect(f.maxGainDb).toBeCloseTo(db(mag(s[1]![0]!) / mag(s[0]![1]!)), 12)
    expect(f.gammaMS).toBeNull()
    expect(f.gammaML).toBeNull()
  })

  it('a unilateral device (S12 = 0): K infinite, MAG = |S21|²/((1 − |S11|²)(1 − |S22|²)), ΓMS = S11*', () => {
    const s = [[polar(0.6, -80), { re: 0, im: 0 }], [polar(4, 100), polar(0.5, -40)]]
    const f = twoPortFigures(s)
    expect(f.k).toBe(Infinity)
    expect(f.unconditionallyStable).toBe(true)
    expect(f.maxGainDb).toBeCloseTo(db(16 / ((1 - 0.36) * (1 - 0.25))), 12)
    expect(dist(f.gammaMS!, conj(s[0]![0]!))).toBeLessThan(1e-12)
    expect(dist(f.gammaML!, conj(s[1]![1]!))).toBeLessThan(1e-12)
  })

  it('refuses a matrix that is not 2×2 or holds NaN, naming it', () => {
    expect(() => twoPortFigures([[{ re: 0, im: 0 }]] as never)).toThrow(/s: must be a 2×2/)
    expect(() => twoPortFigures([[{ re: NaN, im: 0 }, { re: 0, im: 0 }], [{ re: 1, im: 0 }, { re: 0, im: 0 }]])).toThrow(/s\[0\]\[0\]/)
  })
})

describe('Γin and transducer gain against scikit-rf', () => {
  for (const [n, t] of (reference.terminations as any[]).entries()) {
    it(`termination set ${n}: Γin (skrf.connect) and GT (power-wave renormalisation) at every frequency`, () => {
      device.s.forEach((s, k) => {
        expect(dist(gammaIn(s, t.gammaL), t.gammaIn[k])).toBeLessThan(1e-9)
        expect(transducerGainDb(s, t.gammaS, t.gammaL)).toBeCloseTo(t.transducerGainDb[k], 8)
      })
    })
  }
})

describe('stability circles, from |Γout| = 1 and |Γin| = 1', () => {
  const devices = [...device.s, POZAR]
  it('every point of the source circle has |Γout| = 1 and of the load circle |Γin| = 1', () => {
    for (const s of devices) {
      for (const p of pointsOn(stabilityCircle(s, 'source'))) expect(mag(gammaOut(s, p))).toBeCloseTo(1, 9)
      for (const p of pointsOn(stabilityCircle(s, 'load'))) expect(mag(gammaIn(s, p))).toBeCloseTo(1, 9)
    }
  })

  it('stableInside tells the side where |Γout| (|Γin|) < 1, checked on a grid of the chart', () => {
    for (const s of devices) {
      const src = stabilityCircle(s, 'source'), load = stabilityCircle(s, 'load')
      for (let x = -0.95; x <= 0.95; x += 0.1) {
        for (let y = -0.95; y <= 0.95; y += 0.1) {
          const g = { re: x, im: y }
          if (mag(g) >= 1) continue
          if (Math.abs(dist(g, src.center) - src.radius) > 1e-3) expect(isOnStableSide(src, g)).toBe(mag(gammaOut(s, g)) < 1)
          if (Math.abs(dist(g, load.center) - load.radius) > 1e-3) expect(isOnStableSide(load, g)).toBe(mag(gammaIn(s, g)) < 1)
        }
      }
    }
  })

  it('|S11| = |Δ| turns the source circle into a line whose points have |Γout| = 1 and whose origin side is stable when |S22| < 1', () => {
    // S11 = 0.5, S22 = 0.4, S12·S21 = 0.7: Δ = 0.2 − 0.7 = −0.5, so |Δ| = |S11|.
    const s = [[polar(0.5, 0), polar(0.35, 0)], [polar(2, 0), polar(0.4, 0)]]
    const c = stabilityCircle(s, 'source')
    expect(c.line).toBeDefined()
    expect(c.radius).toBe(Infinity)
    expect(c.stableInside).toBe(false)
    const points = pointsOn(c)
    expect(points.length).toBeGreaterThan(3)
    for (const p of points) expect(mag(gammaOut(s, p))).toBeCloseTo(1, 9)
    expect(isOnStableSide(c, { re: 0, im: 0 })).toBe(true)
    const far = { re: 0.99 * c.line!.normal.re, im: 0.99 * c.line!.normal.im }
    expect(isOnStableSide(c, far)).toBe(mag(gammaOut(s, far)) < 1)
  })
})

describe('gain circles, from the gain each holds', () => {
  it('points on available-gain circles have that GA (GT with the output conjugately matched); on operating-gain circles that GP', () => {
    for (const s of [...device.s, POZAR]) {
      const top = twoPortFigures(s).maxGainDb
      for (const step of [0.5, 1, 3, 6]) {
        const g = top - step
        const ga = availableGainCircle(s, g)!, gp = operatingGainCircle(s, g)!
        for (const p of pointsOn(ga)) {
          expect(gaByDefinition(s, p)).toBeCloseTo(g, 7)
          expect(availableGainDb(s, p)).toBeCloseTo(g, 7)
        }
        for (const p of pointsOn(gp)) {
          expect(gpByDefinition(s, p)).toBeCloseTo(g, 7)
          expect(operatingGainDb(s, p)).toBeCloseTo(g, 7)
        }
      }
    }
  })

  it('above the MAG there is no circle (null); at the MAG the circle shrinks onto the conjugate match', () => {
    const f = twoPortFigures(POZAR)
    expect(availableGainCircle(POZAR, f.maxGainDb + 0.1)).toBeNull()
    expect(operatingGainCircle(POZAR, f.maxGainDb + 0.1)).toBeNull()
    const a = availableGainCircle(POZAR, f.maxGainDb - 1e-9)!
    expect(a.radius).toBeLessThan(1e-3)
    expect(dist(a.center, f.gammaMS!)).toBeLessThan(1e-3)
  })

  it('1 + g·(|S11|² − |Δ|²) = 0 turns an available-gain circle into a line whose points hold that gain', () => {
    // S11 = 0.3, S22 = 0.5, S12·S21 = 0.75: Δ = −0.6, |Δ| > |S11|, g = 1/(|Δ|² − |S11|²).
    const s = [[polar(0.3, 0), polar(0.25, 0)], [polar(3, 0), polar(0.5, 0)]]
    const g = 1 / (0.36 - 0.09)
    const c = availableGainCircle(s, db(g * 9))!
    expect(c.line).toBeDefined()
    const points = pointsOn(c)
    expect(points.length).toBeGreaterThan(3)
    for (const p of points) expect(gaByDefinition(s, p)).toBeCloseTo(db(g * 9), 7)
  })

  it('refuses a device with S21 = 0 and a gain that is not a number', () => {
    const s = [[polar(0.5, 0), polar(0.1, 0)], [{ re: 0, im: 0 }, polar(0.5, 0)]]
    expect(() => availableGainCircle(s, 3)).toThrow(/S21 is zero/)
    expect(() => operatingGainCircle(POZAR, Number.NaN)).toThrow(/gainDb/)
  })
})

describe('noise figure and noise circles', () => {
  it(`the noise block is read: ${device.noise.length} rows with NFmin, Γopt and rn`, () => {
    expect(device.noise.map(r => r.frequencyHz)).toEqual(reference.noiseFrequenciesHz)
    expect(device.noise[0]!.nfminDb).toBe(0.25)
    expect(mag(device.noise[0]!.gammaOpt)).toBeCloseTo(0.75, 12)
  })

  it(`noiseFigureDb matches ${SKRF} Network.nfdb_gs at the noise rows' frequencies`, () => {
    for (const row of reference.noise as { gammaS: Complex, nfDb: number[] }[]) {
      device.noise.forEach((noise, k) => expect(noiseFigureDb(noise, row.gammaS)).toBeCloseTo(row.nfDb[k]!, 8))
    }
  })

  it('NF at Γopt is NFmin; points on a noise circle have that NF; NFmin gives a point at Γopt; below NFmin null', () => {
    for (const noise of device.noise) {
      expect(noiseFigureDb(noise, noise.gammaOpt)).toBeCloseTo(noise.nfminDb, 12)
      for (const step of [0.1, 0.25, 0.5, 1, 2]) {
        const c = noiseCircle(noise, noise.nfminDb + step)!
        const points = pointsOn(c)
        expect(points.length).toBeGreaterThan(0)
        for (const p of points) expect(noiseFigureDb(noise, p)).toBeCloseTo(noise.nfminDb + step, 9)
      }
      const dot = noiseCircle(noise, noise.nfminDb)!
      expect(dot.radius).toBeLessThan(1e-6)
      expect(dist(dot.center, noise.gammaOpt)).toBeLessThan(1e-6)
      expect(noiseCircle(noise, noise.nfminDb - 0.01)).toBeNull()
    }
  })

  it('a source on the rim gives an infinite NF; an active source or a Γopt outside the chart throws', () => {
    const noise = device.noise[1]!
    expect(noiseFigureDb(noise, { re: -1, im: 0 })).toBe(Infinity)
    expect(() => noiseFigureDb(noise, { re: 1.2, im: 0 })).toThrow(/gammaS/)
    expect(() => noiseFigureDb({ ...noise, gammaOpt: { re: 1.1, im: 0 } }, { re: 0, im: 0 })).toThrow(/gammaOpt/)
  })
})
