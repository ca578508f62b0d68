/**
 * Small-signal amplifier figures of a two-port at one frequency: the reflections it presents,
 * its gains, its stability factors and the simultaneous conjugate match.
 *
 * `s` is `[[S11, S12], [S21, S22]]` of `{ re, im }` against a real reference (the device file's);
 * ΓS is the reflection the source side presents to port 1, ΓL the one the load side presents to
 * port 2, both against that same reference. Formulas: Gonzalez, Microwave Transistor Amplifiers,
 * 2nd ed., §2.6 (Γin, Γout, GT, GA, GP), §2.7 (MAG, MSG), §3.3 (K, Δ, μ: Edwards and Sinsky),
 * §3.6 (simultaneous conjugate match) — equation forms recalled from memory and checked against
 * scikit-rf 0.15.4 and from each gain's definition in tests/unit/rf/amplifier.test.ts.
 */
import ComplexJs from 'complex.js'
import type { Complex } from './types'
import { asComplex, fromComplexJs, OPEN } from './complex'
import { RfInputError } from './errors'

/** A two-port's S-matrix as `s[i][j]`: `[[S11, S12], [S21, S22]]`. */
export type SMatrix2 = readonly (readonly Complex[])[]

/** The four S-parameters as complex.js values (validated), with Δ = S11·S22 − S12·S21. */
export type SParts = {
  readonly s11: ComplexJs; readonly s12: ComplexJs; readonly s21: ComplexJs; readonly s22: ComplexJs
  readonly delta: ComplexJs
}

/** Validates a 2×2 S-matrix (throwing an RfInputError naming `s[i][j]`) and splits it into parts. */
export function sParts(s: SMatrix2, argument = 's'): SParts {
  if (!Array.isArray(s) || s.length !== 2 || !s.every(row => Array.isArray(row) && row.length === 2)) {
    throw new RfInputError(argument, 'must be a 2×2 matrix [[S11, S12], [S21, S22]]')
  }
  const at = (i: number, j: number) => {
    const v = asComplex(s[i]![j], `${argument}[${i}][${j}]`)
    return new ComplexJs(v.re, v.im)
  }
  const s11 = at(0, 0), s12 = at(0, 1), s21 = at(1, 0), s22 = at(1, 1)
  return { s11, s12, s21, s22, delta: s11.mul(s22).sub(s12.mul(s21)) }
}

const ONE = new ComplexJs(1, 0)
const abs2 = (x: ComplexJs) => x.re * x.re + x.im * x.im
const gammaArg = (g: Complex, argument: string) => {
  const v = asComplex(g, argument)
  return new ComplexJs(v.re, v.im)
}

/** 10·log10 of a power ratio; 0 gives −Infinity, Infinity stays Infinity, a negative ratio throws. */
export function powerDb(ratio: number, argument = 'gain'): number {
  if (Number.isNaN(ratio) || ratio < 0) throw new RfInputError(argument, `is not a passive power ratio (${ratio}): a termination with |Γ| > 1?`)
  return 10 * Math.log10(ratio)
}

/** Γin = S11 + S12·S21·ΓL / (1 − S22·ΓL): the reflection at port 1 with ΓL on port 2. A pole gives `OPEN`. */
export function gammaIn(s: SMatrix2, gammaL: Complex): Complex {
  const p = sParts(s)
  const gl = gammaArg(gammaL, 'gammaL')
  const den = ONE.sub(p.s22.mul(gl))
  if (den.isZero()) return OPEN
  return fromComplexJs(p.s11.add(p.s12.mul(p.s21).mul(gl).div(den)), 'gammaIn')
}

/** Γout = S22 + S12·S21·ΓS / (1 − S11·ΓS): the reflection at port 2 with ΓS on port 1. A pole gives `OPEN`. */
export function gammaOut(s: SMatrix2, gammaS: Complex): Complex {
  const p = sParts(s)
  const gs = gammaArg(gammaS, 'gammaS')
  const den = ONE.sub(p.s11.mul(gs))
  if (den.isZero()) return OPEN
  return fromComplexJs(p.s22.add(p.s12.mul(p.s21).mul(gs).div(den)), 'gammaOut')
}

/** GT as a ratio: |S21|²(1 − |ΓS|²)(1 − |ΓL|²) / |(1 − S11ΓS)(1 − S22ΓL) − S12S21ΓSΓL|². */
export function transducerGain(p: SParts, gs: ComplexJs, gl: ComplexJs): number {
  const den = ONE.sub(p.s11.mul(gs)).mul(ONE.sub(p.s22.mul(gl))).sub(p.s12.mul(p.s21).mul(gs).mul(gl))
  const num = abs2(p.s21) * (1 - abs2(gs)) * (1 - abs2(gl))
  const d = abs2(den)
  return d === 0 ? (num === 0 ? 0 : Infinity) : num / d
}

/**
 * Transducer gain GT (dB): the power delivered to the load over the power available from the
 * source, with the source side presenting ΓS and the load side ΓL. Infinity at a pole (the
 * terminated device oscillates); −Infinity when ΓS or ΓL is on the rim (|Γ| = 1) or S21 = 0.
 */
export function transducerGainDb(s: SMatrix2, gammaS: Complex, gammaL: Complex): number {
  return powerDb(transducerGain(sParts(s), gammaArg(gammaS, 'gammaS'), gammaArg(gammaL, 'gammaL')), 'transducerGain')
}

/**
 * Available gain GA (dB) with ΓS: |S21|²(1 − |ΓS|²) / (|1 − S11ΓS|²(1 − |Γout|²)), the gain with
 * the output conjugately matched. Infinity where |Γout| ≥ 1 (no available power: unstable there).
 */
export function availableGainDb(s: SMatrix2, gammaS: Complex): number {
  const p = sParts(s)
  const gs = gammaArg(gammaS, 'gammaS')
  const out = abs2(p.s22.add(p.s12.mul(p.s21).mul(gs).div(ONE.sub(p.s11.mul(gs)))))
  if (out >= 1) return Infinity
  return powerDb(abs2(p.s21) * (1 - abs2(gs)) / (abs2(ONE.sub(p.s11.mul(gs))) * (1 - out)), 'availableGain')
}

/**
 * Operating (power) gain GP (dB) with ΓL: |S21|²(1 − |ΓL|²) / (|1 − S22ΓL|²(1 − |Γin|²)), the gain
 * with the input conjugately matched. Infinity where |Γin| ≥ 1.
 */
export function operatingGainDb(s: SMatrix2, gammaL: Complex): number {
  const p = sParts(s)
  const gl = gammaArg(gammaL, 'gammaL')
  const inn = abs2(p.s11.add(p.s12.mul(p.s21).mul(gl).div(ONE.sub(p.s22.mul(gl)))))
  if (inn >= 1) return Infinity
  return powerDb(abs2(p.s21) * (1 - abs2(gl)) / (abs2(ONE.sub(p.s22.mul(gl))) * (1 - inn)), 'operatingGain')
}

/** What `twoPortFigures` returns. */
export type TwoPortFigures = {
  /** Rollett's stability factor K = (1 − |S11|² − |S22|² + |Δ|²) / (2|S12·S21|); Infinity when S12·S21 = 0. */
  readonly k: number
  /** Edwards–Sinsky μ = (1 − |S11|²) / (|S22 − Δ·S11*| + |S12·S21|); μ > 1 ⇔ unconditionally stable. */
  readonly mu: number
  /** Δ = S11·S22 − S12·S21. */
  readonly delta: Complex
  /** μ > 1: every passive source and load keeps |Γin| < 1 and |Γout| < 1. */
  readonly unconditionallyStable: boolean
  /** MAG where unconditionally stable, else MSG = |S21/S12| (dB). */
  readonly maxGainDb: number
  /** Which of the two `maxGainDb` is. */
  readonly maxGainKind: 'MAG' | 'MSG'
  /** The simultaneous conjugate match (Γin(ΓML) = ΓMS*, Γout(ΓMS) = ΓML*); null unless unconditionally stable. */
  readonly gammaMS: Complex | null
  readonly gammaML: Complex | null
}

/**
 * One root of the conjugate-match quadratic C·Γ² − B·Γ + C* = 0, the one inside the unit circle:
 * Γ = (B − sign(B)·√(B² − 4|C|²)) / (2C), written as 2·conj(C)/(B + sign(B)·√(…)) so that C → 0 gives
 * Γ → 0 without cancellation (Gonzalez §3.6: ΓMS with B1, C1; ΓML with B2, C2).
 */
function conjugateMatchRoot(b: number, cc: ComplexJs): Complex {
  const disc = Math.sqrt(Math.max(0, b * b - 4 * abs2(cc)))
  const den = b + (b >= 0 ? disc : -disc)
  if (den === 0) throw new RfInputError('s', 'the conjugate-match quadratic has no root for this device')
  return fromComplexJs(cc.conjugate().mul(2 / den), 'gammaMatch')
}

/**
 * K, μ, Δ, the maximum gain and the simultaneous conjugate match of a two-port.
 * MAG = |S21/S12|·(K − √(K² − 1)); a unilateral device (S12 = 0) has MAG = |S21|²/((1 − |S11|²)(1 − |S22|²)).
 * B1 = 1 + |S11|² − |S22|² − |Δ|², C1 = S11 − Δ·S22*; B2 = 1 + |S22|² − |S11|² − |Δ|², C2 = S22 − Δ·S11*.
 */
export function twoPortFigures(s: SMatrix2): TwoPortFigures {
  const p = sParts(s)
  const { s11, s12, s21, s22, delta } = p
  const loop = s12.mul(s21).abs()
  const m11 = abs2(s11), m22 = abs2(s22), md = abs2(delta)
  const k = loop === 0 ? Infinity : (1 - m11 - m22 + md) / (2 * loop)
  const muDen = s22.sub(delta.mul(s11.conjugate())).abs() + loop
  const mu = muDen === 0 ? Infinity : (1 - m11) / muDen
  const unconditionallyStable = mu > 1
  const g21 = abs2(s21)
  let maxGain: number
  if (!unconditionallyStable) maxGain = loop === 0 ? Infinity : s21.abs() / s12.abs()
  else if (loop === 0) maxGain = g21 / ((1 - m11) * (1 - m22))
  else maxGain = (s21.abs() / s12.abs()) * (k - Math.sqrt(k * k - 1))
  const match = unconditionallyStable
    ? {
        gammaMS: conjugateMatchRoot(1 + m11 - m22 - md, s11.sub(delta.mul(s22.conjugate()))),
        gammaML: conjugateMatchRoot(1 + m22 - m11 - md, s22.sub(delta.mul(s11.conjugate()))),
      }
    : { gammaMS: null, gammaML: null }
  return {
    k, mu, delta: fromComplexJs(delta, 'delta'), unconditionallyStable,
    maxGainDb: powerDb(maxGain, 'maxGain'), maxGainKind: unconditionallyStable ? 'MAG' : 'MSG',
    ...match,
  }
}
