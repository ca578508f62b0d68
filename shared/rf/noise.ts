/**
 * Two-port noise: the noise figure at a source reflection, constant-noise-figure circles, and the
 * noise block of a device file carried onto other frequencies.
 *
 * F = Fmin + 4·rn·|ΓS − Γopt|² / ((1 − |ΓS|²)·|1 + Γopt|²), rn = Rn/Z0 (Gonzalez, Microwave
 * Transistor Amplifiers, 2nd ed., §4.3, recalled from memory and checked against scikit-rf 0.15.4's
 * Network.nfdb_gs). Noise-figure circles: N = (F − Fmin)·|1 + Γopt|² / (4·rn), centre Γopt/(N + 1),
 * radius √(N·(N + 1 − |Γopt|²)) / (N + 1) (same section).
 */
import type { Complex } from './types'
import { asComplex } from './complex'
import { RfInputError, requireFinite } from './errors'
import type { GammaCircle } from './amplifier-circles'
import type { NoiseParameters } from './touchstone-records'
import { blend, locate } from './interpolate'

/** One noise row as the figures need it (parseTouchstone's rows carry `frequencyHz` too). */
export type NoiseRow = Pick<NoiseParameters, 'nfminDb' | 'gammaOpt' | 'rnNormalized'>

// |ΓS| within this of 1 is a lossless termination on the rim: no available power, F infinite.
const RIM_SLACK = 1e-12

function readNoise(noise: NoiseRow) {
  if (noise === null || typeof noise !== 'object') throw new RfInputError('noise', 'must be { nfminDb, gammaOpt, rnNormalized }')
  const nfminDb = requireFinite(noise.nfminDb, 'noise.nfminDb')
  const rn = requireFinite(noise.rnNormalized, 'noise.rnNormalized')
  if (rn < 0) throw new RfInputError('noise.rnNormalized', `must not be negative, got ${rn}`)
  const opt = asComplex(noise.gammaOpt, 'noise.gammaOpt')
  if (Math.hypot(opt.re, opt.im) >= 1) throw new RfInputError('noise.gammaOpt', 'must lie inside the unit circle')
  return { fmin: Math.pow(10, nfminDb / 10), rn, opt }
}

/**
 * The noise factor (a ratio, ≥ Fmin) with the source side presenting ΓS. Infinity on the rim
 * (|ΓS| = 1); a ΓS outside the unit circle (an active source) throws.
 */
export function noiseFactor(noise: NoiseRow, gammaS: Complex): number {
  const { fmin, rn, opt } = readNoise(noise)
  const gs = asComplex(gammaS, 'gammaS')
  const m2 = gs.re * gs.re + gs.im * gs.im
  if (m2 > 1 + 1e-9) throw new RfInputError('gammaS', `|ΓS| = ${Math.sqrt(m2)} is outside the unit circle: no noise figure for an active source`)
  if (m2 >= 1 - RIM_SLACK) return Infinity
  const dr = gs.re - opt.re, di = gs.im - opt.im
  const onePlus = (1 + opt.re) * (1 + opt.re) + opt.im * opt.im
  return fmin + (4 * rn * (dr * dr + di * di)) / ((1 - m2) * onePlus)
}

/** The noise figure (dB) with the source side presenting ΓS (see `noiseFactor`). */
export function noiseFigureDb(noise: NoiseRow, gammaS: Complex): number {
  return 10 * Math.log10(noiseFactor(noise, gammaS))
}

/**
 * The source-plane circle of constant noise figure `nfDb`. A point (radius 0) at Γopt for NFmin;
 * null below NFmin, or when rn = 0 (the figure is NFmin everywhere: no circle).
 */
export function noiseCircle(noise: NoiseRow, nfDb: number): GammaCircle | null {
  const { fmin, rn, opt } = readNoise(noise)
  const f = Math.pow(10, requireFinite(nfDb, 'nfDb') / 10)
  if (f < fmin * (1 - 1e-12) || rn === 0) return null
  const onePlus = (1 + opt.re) * (1 + opt.re) + opt.im * opt.im
  const n = (Math.max(0, f - fmin) * onePlus) / (4 * rn)
  const opt2 = opt.re * opt.re + opt.im * opt.im
  return {
    center: { re: opt.re / (n + 1), im: opt.im / (n + 1) },
    radius: Math.sqrt(n * (n + 1 - opt2)) / (n + 1),
  }
}

/**
 * A device file's noise block at each target frequency: NFmin (dB) and rn linear in f, Γopt linear
 * in re/im between the two nearest rows (as measured loads are), never beyond the block's range
 * (null there). Rows must be in increasing frequency, as parseTouchstone gives them.
 */
export function interpolateNoise(rows: readonly NoiseParameters[], targetsHz: ArrayLike<number>): (NoiseRow | null)[] {
  const freqs = rows.map(r => r.frequencyHz)
  const out: (NoiseRow | null)[] = new Array(targetsHz.length)
  for (let i = 0; i < targetsHz.length; i++) {
    const at = rows.length ? locate(freqs, targetsHz[i]!) : null
    if (!at) { out[i] = null; continue }
    const a = rows[at.k]!
    const b = at.t === 0 ? a : rows[at.k + 1]!
    out[i] = {
      nfminDb: a.nfminDb + at.t * (b.nfminDb - a.nfminDb),
      gammaOpt: blend(a.gammaOpt, b.gammaOpt, at.t),
      rnNormalized: a.rnNormalized + at.t * (b.rnNormalized - a.rnNormalized),
    }
  }
  return out
}
