/**
 * The Bode–Fano limit: the best return loss that any lossless matching network can hold constant
 * across a band for a load that is a resistance with one reactive part (R-C or R-L, series or
 * parallel), and the R-C / R-L model fitted to any load at one frequency (for an estimate).
 *
 * Fano's integrals (R. M. Fano, "Theoretical limitations on the broadband matching of arbitrary
 * impedances", J. Franklin Inst. 249, 1950; tabulated in Pozar, Microwave Engineering, 4th ed.,
 * §5.9), ω in rad/s and Γ the reflection seen through the matching network:
 *   parallel R-C: ∫₀^∞ ln(1/|Γ|) dω ≤ π/(RC)      series R-L: ∫₀^∞ ln(1/|Γ|) dω ≤ πR/L
 *   series R-C:   ∫₀^∞ ω⁻² ln(1/|Γ|) dω ≤ πRC     parallel R-L: ∫₀^∞ ω⁻² ln(1/|Γ|) dω ≤ πL/R
 * With |Γ| = Γm constant from ω1 to ω2 and 1 outside (the rectangular reflection, the best use of
 * the integral), ln(1/Γm) = bound/(ω2 − ω1) for the first pair and bound/(1/ω1 − 1/ω2) for the
 * second; the return loss is 20·log10(e)·ln(1/Γm) dB.
 */
import type { Complex } from './types'
import { RfInputError, describe, requirePositive } from './errors'

/** The four load models with a closed-form Fano limit. */
export type FanoModel = 'series-RC' | 'parallel-RC' | 'series-RL' | 'parallel-RL'

export const FANO_MODELS: readonly FanoModel[] = ['series-RC', 'parallel-RC', 'series-RL', 'parallel-RL']

/** Arguments of `bodeFanoLimitDb`: R in Ω, C in F (R-C models), L in H (R-L models), band in Hz. */
export type FanoInput = {
  readonly model: FanoModel
  readonly r: number
  readonly c?: number
  readonly l?: number
  readonly fStart: number
  readonly fStop: number
}

const DB_PER_NEPER = 20 / Math.LN10

/**
 * The right-hand side of Fano's integral for the model (see the file comment): π/(RC), πR/L,
 * πRC or πL/R, and whether the integral is weighted by ω⁻² (series R-C, parallel R-L).
 */
export function fanoIntegralBound(model: FanoModel, r: number, reactive: number): { bound: number; isInverseWeighted: boolean } {
  switch (model) {
    case 'parallel-RC': return { bound: Math.PI / (r * reactive), isInverseWeighted: false }
    case 'series-RL': return { bound: (Math.PI * r) / reactive, isInverseWeighted: false }
    case 'series-RC': return { bound: Math.PI * r * reactive, isInverseWeighted: true }
    case 'parallel-RL': return { bound: (Math.PI * reactive) / r, isInverseWeighted: true }
  }
}

/**
 * The best return loss (dB) that any lossless network can hold constant from `fStart` to `fStop`
 * for the load model: no ladder can do better at every frequency of that band. Throws
 * `RfInputError` naming `model`, `r`, `c`, `l`, `fStart` or `fStop`.
 */
export function bodeFanoLimitDb(input: FanoInput): number {
  if (input === null || typeof input !== 'object') throw new RfInputError('input', `must be an object, got ${describe(input)}`)
  if (!(FANO_MODELS as readonly unknown[]).includes(input.model)) {
    throw new RfInputError('model', `must be one of ${FANO_MODELS.join(', ')}, got ${describe(input.model)}`)
  }
  const r = requirePositive(input.r, 'r')
  const isRc = input.model.endsWith('RC')
  const reactive = isRc ? requirePositive(input.c, 'c') : requirePositive(input.l, 'l')
  const f1 = requirePositive(input.fStart, 'fStart')
  const f2 = requirePositive(input.fStop, 'fStop')
  if (!(f2 > f1)) throw new RfInputError('fStop', `must be above fStart (${f1} Hz), got ${f2}`)
  const w1 = 2 * Math.PI * f1
  const w2 = 2 * Math.PI * f2
  const { bound, isInverseWeighted } = fanoIntegralBound(input.model, r, reactive)
  const width = isInverseWeighted ? 1 / w1 - 1 / w2 : w2 - w1
  return DB_PER_NEPER * (bound / width)
}

/** A load model fitted at one frequency, with the limit it gives. */
export type FittedFanoModel = FanoInput & { readonly limitDb: number }

/**
 * The R-C or R-L models that equal impedance `z` (Ω) at `frequencyHz`: the series one
 * (R = Re z, X = Im z) and the parallel one (from y = 1/z). A reactance of zero has no model
 * (the limit is infinite): `[]`. A zero or negative resistance has none either.
 */
export function fanoModelsAt(z: Complex, frequencyHz: number, band: { fStart: number; fStop: number }): FittedFanoModel[] {
  const w = 2 * Math.PI * requirePositive(frequencyHz, 'frequencyHz')
  if (!(z.re > 0) || !Number.isFinite(z.re) || !Number.isFinite(z.im) || z.im === 0) return []
  const m2 = z.re * z.re + z.im * z.im
  const g = z.re / m2
  const b = -z.im / m2
  const fits: FanoInput[] = z.im < 0
    ? [
        { model: 'series-RC', r: z.re, c: -1 / (w * z.im), ...band },
        { model: 'parallel-RC', r: 1 / g, c: b / w, ...band },
      ]
    : [
        { model: 'series-RL', r: z.re, l: z.im / w, ...band },
        { model: 'parallel-RL', r: 1 / g, l: -1 / (w * b), ...band },
      ]
  return fits.map((m) => ({ ...m, limitDb: bodeFanoLimitDb(m) }))
}

/** The impedance (Ω) of a load model at `frequencyHz`. */
export function fanoModelImpedance(m: FanoInput, frequencyHz: number): Complex {
  const w = 2 * Math.PI * frequencyHz
  const x = m.model.endsWith('RC') ? -1 / (w * m.c!) : w * m.l!
  if (m.model.startsWith('series')) return { re: m.r, im: x }
  // Parallel: z = 1/(1/R + 1/(jX)) = R·jX/(R + jX).
  const d = m.r * m.r + x * x
  return { re: (m.r * x * x) / d, im: (m.r * m.r * x) / d }
}

/**
 * An estimate of the Fano limit for any load known at `frequencies` (Ω, one per frequency): the
 * R-C or R-L model fitted at the band point nearest the arithmetic centre (`fanoModelsAt`), series
 * or parallel, whichever follows the load more closely across the frequencies (least squared
 * relative error); equally close (a fixed impedance fits neither), the one with the higher limit,
 * so the estimate does not claim more than the fit can show. null when the centre point has no
 * model (no reactance or no resistance there).
 */
export function fittedFanoModel(frequencies: readonly number[], loads: readonly Complex[], band: { fStart: number; fStop: number }): FittedFanoModel | null {
  if (frequencies.length === 0 || frequencies.length !== loads.length) throw new RfInputError('loads', 'needs one impedance per frequency')
  const mid = (frequencies[0]! + frequencies[frequencies.length - 1]!) / 2
  let c = 0
  frequencies.forEach((f, i) => { if (Math.abs(f - mid) < Math.abs(frequencies[c]! - mid)) c = i })
  const fits = fanoModelsAt(loads[c]!, frequencies[c]!, band)
  const errorOf = (m: FittedFanoModel) => frequencies.reduce((sum, f, i) => {
    const zm = fanoModelImpedance(m, f)
    const z = loads[i]!
    return sum + ((zm.re - z.re) ** 2 + (zm.im - z.im) ** 2) / Math.max(z.re * z.re + z.im * z.im, 1e-300)
  }, 0)
  const scored = fits.map((m) => ({ m, e: errorOf(m) }))
  scored.sort((a, b) => (Math.abs(a.e - b.e) > 1e-9 * Math.max(a.e, b.e, 1e-12) ? a.e - b.e : b.m.limitDb - a.m.limitDb))
  return scored[0]?.m ?? null
}
