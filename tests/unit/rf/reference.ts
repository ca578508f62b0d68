// Reading the team's reference data (tests/fixtures/reference/cases.json, outside the repo) and the
// tolerance helpers the RF tests share.
import { readFileSync } from 'node:fs'
import { REFERENCE_ROOT } from '../../support/reference'
import path from 'node:path'
import { expect } from 'vitest'
import { OPEN, isInfinite, rlcImpedance, trace, type Complex, type Element } from '../../../shared/rf/index'

export const REFERENCE_SOURCE = 'reference cases.json, reproduced by ngspice 39 and scikit-rf 0.15.4'
export const WORKED_SOURCE = 'reference cases.json worked example, recalled from memory and verified by computation'
export const REL_TOL = 1e-6

/** A complex number as the reference data writes it: [re, im], or null for infinity. */
export type RefComplex = [number | string, number | string] | null

export type RefCase = {
  id: string
  group: string
  op: string
  checks: string
  input: Record<string, any>
  expected: Record<string, any>
  tolerance?: { rel: number; abs: number; absGamma: number }
  [key: string]: unknown
}

let cached: RefCase[] | undefined

/** Every case of cases.json (read at run time from the team's shared folder). */
export function referenceCases(): RefCase[] {
  if (!cached) {
    const file = path.resolve(REFERENCE_ROOT, 'cases.json')
    cached = (JSON.parse(readFileSync(file, 'utf8')) as { cases: RefCase[] }).cases
  }
  return cached
}

export function casesWhere(pred: (c: RefCase) => boolean): RefCase[] {
  return referenceCases().filter(pred)
}

/** A reference real: numbers stay, the strings "Infinity", "-Infinity", "NaN" become numbers. */
export function refReal(value: number | string): number {
  return typeof value === 'number' ? value : Number(value)
}

/** A reference complex value (or a plain number, or "open"/"short") as a plain complex. */
export function refComplex(value: RefComplex | number | string): Complex {
  if (value === null || value === 'open') return OPEN
  if (value === 'short') return { re: 0, im: 0 }
  if (typeof value === 'number') return { re: value, im: 0 }
  if (typeof value === 'string') throw new Error(`unexpected complex ${value}`)
  return { re: refReal(value[0]), im: refReal(value[1]) }
}

/** The start impedance of a reference trace case: `start` (number, "open", "short") or `startModel` (series R, L, C). */
export function refStart(input: Record<string, any>, frequencyHz: number): Complex {
  if (input.start !== undefined) return refComplex(input.start)
  const m = input.startModel ?? input.loadModel
  if (m.chain) {
    const points = trace({ z0: 50, frequency: frequencyHz, load: refComplex(m.chain.start), elements: m.chain.elements as Element[] })
    return points[points.length - 1]!
  }
  return rlcImpedance({ topology: 'series', r: m.R, l: m.L, c: m.C }, frequencyHz)
}

/** Relative distance |a − e| / max(|e|, absFloor/rel); infinities agree only with infinities. */
export function complexError(actual: Complex, expected: Complex, absFloor = 1e-9): number {
  if (isInfinite(expected) || isInfinite(actual)) return isInfinite(expected) && isInfinite(actual) ? 0 : Infinity
  const diff = Math.hypot(actual.re - expected.re, actual.im - expected.im)
  return diff / Math.max(Math.hypot(expected.re, expected.im), absFloor / REL_TOL)
}

/** Asserts complex closeness to 1e-6 relative (absolute `absFloor` near zero), with a label. */
export function expectComplexClose(actual: Complex, expected: Complex, label: string, absFloor = 1e-9): void {
  const err = complexError(actual, expected, absFloor)
  expect(err, `${label}: got ${fmt(actual)}, expected ${fmt(expected)}`).toBeLessThanOrEqual(REL_TOL)
}

/** Asserts a real to 1e-6 relative (or `absFloor` absolute); infinities must match exactly. */
export function expectRealClose(actual: number, expected: number, label: string, absFloor = 1e-9): void {
  if (!Number.isFinite(expected)) {
    expect(actual, label).toBe(expected)
    return
  }
  const tol = Math.max(REL_TOL * Math.abs(expected), absFloor)
  expect(Math.abs(actual - expected), `${label}: got ${actual}, expected ${expected}`).toBeLessThanOrEqual(tol)
}

function fmt(z: Complex): string {
  return `${z.re}${z.im < 0 ? '-' : '+'}j${Math.abs(z.im)}`
}
