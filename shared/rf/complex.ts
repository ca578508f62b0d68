/**
 * Plain `{ re, im }` values at the boundary, complex.js inside, and the two special points.
 *
 * Infinity: the RF core has ONE point at infinity (as complex.js does), written `OPEN =
 * { re: Infinity, im: 0 }`. Any input with an infinite part (`{ re: Infinity, im: 5 }`,
 * `{ re: 0, im: -Infinity }`) means an open circuit and is read as `OPEN`; any result that is
 * infinite is returned as exactly `OPEN`. NaN is never accepted and never returned. In the
 * reference data an infinite impedance is written `null`; callers that read such data map it to
 * `OPEN`.
 */
import ComplexJs from 'complex.js'
import type { Complex } from './types'
import { RfInputError, describe } from './errors'

/** An open circuit: the infinite impedance (or the infinite admittance of a short). */
export const OPEN: Complex = Object.freeze({ re: Infinity, im: 0 })

/** A short circuit: zero impedance. */
export const SHORT: Complex = Object.freeze({ re: 0, im: 0 })

/** A complex argument as callers may give it: `{ re, im }` or a real number. */
export type ComplexInput = Complex | number

/** True for the point at infinity (either part infinite). */
export function isInfinite(z: Complex): boolean {
  return z.re === Infinity || z.re === -Infinity || z.im === Infinity || z.im === -Infinity
}

/** Builds a plain complex value; an infinite part gives `OPEN`, a NaN part throws. */
export function complex(re: number, im: number): Complex {
  if (Number.isNaN(re) || Number.isNaN(im)) throw new RfInputError('value', 'is not a number (NaN)')
  if (!Number.isFinite(re) || !Number.isFinite(im)) return OPEN
  return { re, im }
}

/**
 * Validates a complex argument and returns it as a plain value. A number is a real value.
 * With `allowInfinite` an infinite part means `OPEN`; otherwise it throws naming `argument`.
 */
export function asComplex(value: unknown, argument: string, allowInfinite = false): Complex {
  let re: unknown
  let im: unknown
  if (typeof value === 'number') {
    re = value
    im = 0
  } else if (value !== null && typeof value === 'object' && 're' in value && 'im' in value) {
    re = (value as Complex).re
    im = (value as Complex).im
  } else {
    throw new RfInputError(argument, `must be { re, im } or a number, got ${describe(value)}`)
  }
  if (typeof re !== 'number' || typeof im !== 'number') {
    throw new RfInputError(argument, 're and im must be numbers')
  }
  if (Number.isNaN(re) || Number.isNaN(im)) throw new RfInputError(argument, 'is not a number (NaN)')
  if (!Number.isFinite(re) || !Number.isFinite(im)) {
    if (!allowInfinite) throw new RfInputError(argument, 'must be finite')
    return OPEN
  }
  return { re, im }
}

/** Plain value → complex.js. `OPEN` becomes `Complex.INFINITY`. */
export function toComplexJs(z: Complex): ComplexJs {
  return isInfinite(z) ? ComplexJs.INFINITY : new ComplexJs(z.re, z.im)
}

/** complex.js → plain value. complex.js's infinity becomes `OPEN`; NaN throws (naming `argument`). */
export function fromComplexJs(c: ComplexJs, argument = 'result'): Complex {
  if (c.isNaN()) throw new RfInputError(argument, 'is undefined (NaN) for these inputs')
  if (c.isInfinite()) return OPEN
  return { re: c.re, im: c.im }
}

/**
 * Writes the quotient a/b of two complex numbers given as parts into out[0] (re) and out[1] (im),
 * with Smith's scaling so that neither |b|² nor the products overflow. b = 0 writes
 * (Infinity, 0): the homogeneous point (a, 0) is the point at infinity. A result too large for a
 * double is also (Infinity, 0). May write NaN only for a = b = 0, which the kernel never produces.
 */
export function divideInto(aRe: number, aIm: number, bRe: number, bIm: number, out: Float64Array): void {
  let re: number
  let im: number
  if (bRe === 0 && bIm === 0) {
    re = Infinity
    im = 0
  } else if (Math.abs(bRe) >= Math.abs(bIm)) {
    const r = bIm / bRe
    const d = bRe + bIm * r
    re = (aRe + aIm * r) / d
    im = (aIm - aRe * r) / d
  } else {
    const r = bRe / bIm
    const d = bRe * r + bIm
    re = (aRe * r + aIm) / d
    im = (aIm * r - aRe) / d
  }
  if ((re === Infinity || re === -Infinity || im === Infinity || im === -Infinity)) {
    re = Infinity
    im = 0
  }
  out[0] = re
  out[1] = im
}

const quotient = new Float64Array(2)

/** The quotient a/b as a plain value (see `divideInto`); b = 0 gives `OPEN`, NaN throws. */
export function divideParts(aRe: number, aIm: number, bRe: number, bIm: number): Complex {
  divideInto(aRe, aIm, bRe, bIm, quotient)
  return complex(quotient[0]!, quotient[1]!)
}

/** |a − b| / max(|b|, floor): the relative difference used by tests and self-checks. */
export function relativeDifference(a: Complex, b: Complex, floor = 1e-300): number {
  if (isInfinite(a) || isInfinite(b)) return isInfinite(a) && isInfinite(b) ? 0 : Infinity
  return Math.hypot(a.re - b.re, a.im - b.im) / Math.max(Math.hypot(b.re, b.im), floor)
}

/**
 * 1/z with the special points exact: 1/OPEN = 0 (an open has zero admittance) and 1/0 = OPEN (a
 * short has infinite admittance). Used to turn impedances into admittances (S) and back.
 */
export function reciprocal(z: Complex): Complex {
  if (isInfinite(z)) return SHORT
  return divideParts(1, 0, z.re, z.im)
}
