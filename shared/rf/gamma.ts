/**
 * Reflection and the readout figures derived from it: Γ, VSWR, return loss, mismatch loss, node Q.
 */
import ComplexJs from 'complex.js'
import type { Complex } from './types'
import { OPEN, asComplex, fromComplexJs, isInfinite, toComplexJs } from './complex'
import { RfInputError, requirePositive } from './errors'

/** A reference: a real Z0 (Ω) or a complex source impedance Zs for the power-wave definition. */
export type Reference = number | Complex

// |Γ| a hair above 1 is rounding on a lossless ladder, not an active load.
const UNIT_SLACK = 1e-9

function reference(z0: unknown): ComplexJs {
  if (typeof z0 === 'number') return new ComplexJs(requirePositive(z0, 'z0'), 0)
  const zs = asComplex(z0, 'z0')
  if (!(zs.re > 0)) throw new RfInputError('z0', `a complex reference needs a real part above zero, got ${zs.re}`)
  return new ComplexJs(zs.re, zs.im)
}

/**
 * The reflection coefficient of impedance `z` (Ω) against `z0`.
 * Real z0: Γ = (z − z0)/(z + z0). Complex zs: the power wave Γ = (z − zs*)/(z + zs), zero at the
 * conjugate match z = zs*, with 1 − |Γ|² the share of the available power delivered
 * (Kurokawa, "Power waves and the scattering matrix", IEEE Trans. MTT 1965, recalled from memory).
 * An open gives Γ = 1, a short Γ = −1 (real z0). z = −zs (only for an active z) gives `OPEN`.
 */
export function gammaOf(z: Complex, z0: Reference): Complex {
  const ref = reference(z0)
  const zz = asComplex(z, 'z', true)
  if (isInfinite(zz)) return { re: 1, im: 0 }
  const zc = toComplexJs(zz)
  return fromComplexJs(zc.sub(ref.conjugate()).div(zc.add(ref)), 'gamma')
}

/**
 * The impedance (Ω) with reflection coefficient `gamma` against `z0`; the inverse of `gammaOf`.
 * Real z0: z = z0 (1 + Γ)/(1 − Γ). Complex zs: z = (zs* + Γ zs)/(1 − Γ). Γ = 1 gives `OPEN`.
 */
export function impedanceOf(gamma: Complex, z0: Reference): Complex {
  const ref = reference(z0)
  const g = asComplex(gamma, 'gamma', true)
  if (isInfinite(g)) return fromComplexJs(ref.neg())
  const gc = toComplexJs(g)
  const one = new ComplexJs(1, 0)
  if (gc.equals(one)) return OPEN
  return fromComplexJs(ref.conjugate().add(gc.mul(ref)).div(one.sub(gc)), 'z')
}

/** |Γ| from a complex Γ or a magnitude; throws on NaN or a negative magnitude. */
export function gammaMagnitude(gamma: Complex | number): number {
  if (typeof gamma === 'number') {
    if (Number.isNaN(gamma) || gamma < 0) throw new RfInputError('gamma', `a magnitude must be 0 or more, got ${gamma}`)
    return gamma
  }
  const g = asComplex(gamma, 'gamma', true)
  return isInfinite(g) ? Infinity : Math.hypot(g.re, g.im)
}

function passiveMagnitude(gamma: Complex | number, what: string): number {
  const m = gammaMagnitude(gamma)
  if (m > 1 + UNIT_SLACK) throw new RfInputError('gamma', `|Γ| = ${m} exceeds 1 (an active load has no ${what})`)
  return Math.min(m, 1)
}

/** VSWR = (1 + |Γ|)/(1 − |Γ|): 1 at a match, Infinity at |Γ| = 1. Throws for |Γ| > 1. */
export function vswr(gamma: Complex | number): number {
  const m = passiveMagnitude(gamma, 'VSWR')
  return m === 1 ? Infinity : (1 + m) / (1 - m)
}

/** Return loss (dB) = −20·log10|Γ|: positive for a passive load, Infinity at a perfect match. */
export function returnLossDb(gamma: Complex | number): number {
  const m = gammaMagnitude(gamma)
  return m === 0 ? Infinity : -20 * Math.log10(m)
}

/** Mismatch loss (dB) = −10·log10(1 − |Γ|²): 0 at a match, Infinity at |Γ| = 1. Throws for |Γ| > 1. */
export function mismatchLossDb(gamma: Complex | number): number {
  const m = passiveMagnitude(gamma, 'mismatch loss')
  return m === 1 ? Infinity : 0 - 10 * Math.log10(1 - m * m)
}

/** The delivered share of the available power, 1 − |Γ|² (power-wave Γ; 0 for |Γ| ≥ 1 within rounding). */
export function deliveredPowerFraction(gamma: Complex | number): number {
  const m = passiveMagnitude(gamma, 'delivered power')
  return 1 - m * m
}

/**
 * Node Q of an impedance point: Q = |X|/|R| for z = R + jX (equal to |B|/|G| of its admittance).
 * Lossless points (R = 0, X ≠ 0) give Infinity; a short and an open give 0 by convention (no
 * stored-to-dissipated ratio is defined there). Common practice for Q contours on the chart.
 */
export function nodeQ(z: Complex): number {
  const zz = asComplex(z, 'z', true)
  if (isInfinite(zz) || (zz.re === 0 && zz.im === 0)) return 0
  return zz.re === 0 ? Infinity : Math.abs(zz.im) / Math.abs(zz.re)
}
