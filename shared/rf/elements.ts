/**
 * Elements one at a time: validation of element JSON, the impedance or admittance of a part at a
 * frequency, and `applyElement`, which moves one impedance point through one element.
 * All formulas live in points.ts (`applyElementToPoints`); this file is the scalar front door.
 */
import type { Complex, Element, Placement } from './types'
import { ELEMENT_KINDS } from './types'
import { RfInputError, describe, requireNonNegative, requirePositive } from './errors'
import { OPEN, SHORT, asComplex } from './complex'
import { applyElementToPoints, createPoints, readAdmittance, readImpedance, setPoint } from './points'
import { validatePartModel } from './models'
import { validateMeasuredPart } from './fixture'

/** Options for `validateElement`. */
export type ElementCheck = {
  /** A sweep needs `fRef` on lines and stubs; a single-frequency trace does not. */
  readonly requireFRef?: boolean
}

function requirePlacement(value: unknown, argument: string): Placement {
  if (value !== 'series' && value !== 'shunt') {
    throw new RfInputError(argument, `must be "series" or "shunt", got ${describe(value)}`)
  }
  return value
}

function checkFRef(fRef: unknown, argument: string, kind: string, required: boolean): void {
  if (fRef === undefined) {
    if (required) throw new RfInputError(argument, `a sweep needs fRef on a ${kind}: its length is physical`)
    return
  }
  requirePositive(fRef, argument)
}

/**
 * Checks element JSON and returns it typed. Throws `RfInputError` naming the field
 * (`elements[2].value`) for an unknown kind, a wrong placement, NaN or non-finite numbers,
 * negative L, C, R or length, non-positive Z0, Q, ratio or fRef, or (with `requireFRef`) a line or
 * stub without fRef.
 */
export function validateElement(value: unknown, path: string, check: ElementCheck = {}): Element {
  if (value === null || typeof value !== 'object') {
    throw new RfInputError(path, `must be an element object, got ${describe(value)}`)
  }
  const e = value as Record<string, unknown>
  const kind = e.kind
  if (typeof kind !== 'string' || !(ELEMENT_KINDS as readonly string[]).includes(kind)) {
    throw new RfInputError(`${path}.kind`, `unknown element kind ${describe(kind)} (expected ${ELEMENT_KINDS.join(', ')})`)
  }
  switch (kind) {
    case 'L':
    case 'C':
    case 'R':
      requirePlacement(e.placement, `${path}.placement`)
      requireNonNegative(e.value, `${path}.value`)
      if (e.q !== undefined) requirePositive(e.q, `${path}.q`)
      if (e.model !== undefined) validatePartModel(e.model, kind, `${path}.model`)
      if (e.measured !== undefined) validateMeasuredPart(e.measured, kind, `${path}.measured`)
      if (e.tolerance !== undefined) {
        const t = requireNonNegative(e.tolerance, `${path}.tolerance`)
        if (t >= 1) throw new RfInputError(`${path}.tolerance`, `is a fraction and must be below 1, got ${t}`)
      }
      break
    case 'line':
      requirePositive(e.z0, `${path}.z0`)
      requireNonNegative(e.deg, `${path}.deg`)
      checkFRef(e.fRef, `${path}.fRef`, 'line', check.requireFRef === true)
      break
    case 'stub':
      if (e.end !== 'open' && e.end !== 'short') {
        throw new RfInputError(`${path}.end`, `must be "open" or "short", got ${describe(e.end)}`)
      }
      requirePlacement(e.placement, `${path}.placement`)
      requirePositive(e.z0, `${path}.z0`)
      requireNonNegative(e.deg, `${path}.deg`)
      checkFRef(e.fRef, `${path}.fRef`, 'stub', check.requireFRef === true)
      break
    case 'xfmr':
      requirePositive(e.ratio, `${path}.ratio`)
      break
    case 'block':
      if (typeof e.uploadId !== 'string' || e.uploadId === '') {
        throw new RfInputError(`${path}.uploadId`, `must name the measured upload, got ${describe(e.uploadId)}`)
      }
      break
  }
  return value as Element
}

/** Checks an array of element JSON (`elements[i]` in messages). */
export function validateElements(value: unknown, argument = 'elements', check: ElementCheck = {}): Element[] {
  if (!Array.isArray(value)) throw new RfInputError(argument, `must be an array of elements, got ${describe(value)}`)
  return value.map((e, i) => validateElement(e, `${argument}[${i}]`, check))
}

/** Checks an analysis frequency: finite and above zero (Hz). */
export function requireFrequency(value: unknown, argument = 'frequency'): number {
  return requirePositive(value, argument)
}

/**
 * Electrical length in degrees of a line or stub at `frequencyHz`: deg·f/fRef, with fRef
 * defaulting to f (then the stated `deg`).
 */
export function electricalDegrees(element: { deg: number; fRef?: number }, frequencyHz: number): number {
  return element.fRef === undefined ? element.deg : (element.deg * frequencyHz) / element.fRef
}

type TwoTerminal = Exclude<Element, { kind: 'line' } | { kind: 'xfmr' } | { kind: 'block' }>

function asTwoTerminal(element: Element): TwoTerminal {
  if (element.kind === 'line' || element.kind === 'xfmr' || element.kind === 'block') {
    throw new RfInputError('element', `a ${element.kind} is a two-port and has no single impedance`)
  }
  return element
}

/**
 * The impedance Z (Ω) of a two-terminal part (L, C, R, stub) at `frequencyHz`, whatever its
 * placement. L: ωL(1/Q + j); C: (1/Q − j)/(ωC) (ESR = |X|/Q, constant-Q model); R: R;
 * open stub −j Zc cot t; short stub j Zc tan t (t = deg·f/fRef). Infinite Z (C = 0, open stub of
 * 0°) is `OPEN`. Sign convention: inductive reactance positive. Throws for a line or transformer.
 */
export function elementImpedance(element: Element, frequencyHz: number): Complex {
  // In series on a short, the point becomes the part's own impedance.
  return readImpedance(partOn(SHORT, 'series', element, frequencyHz), 0)
}

/**
 * The admittance Y = 1/Z (S) of a two-terminal part at `frequencyHz` (see `elementImpedance`);
 * computed directly as a shunt part on an open, so a part of zero impedance gives `OPEN`
 * (infinite admittance) rather than a division by zero.
 */
export function elementAdmittance(element: Element, frequencyHz: number): Complex {
  return readAdmittance(partOn(OPEN, 'shunt', element, frequencyHz), 0)
}

/**
 * One point at `start` moved through the part placed as given. A modelled part's pads go to
 * ground, not across the part, so they are left out here: this is the part's own Z or Y.
 */
function partOn(start: Complex, placement: Placement, element: Element, frequencyHz: number) {
  let part = asTwoTerminal(validateElement(element, 'element'))
  if (part.kind !== 'stub' && part.model?.padC) part = { ...part, model: { ...part.model, padC: 0 } }
  const f = requireFrequency(frequencyHz, 'frequencyHz')
  const p = createPoints(1)
  setPoint(p, 0, start)
  applyElementToPoints(p, { ...part, placement } as Element, Float64Array.of(f))
  return p
}

/**
 * Moves the impedance `z` (Ω, `OPEN` allowed) through one element at `frequencyHz`, the element
 * being on the source side of z: series z' = z + Z; shunt y' = y + Y; line z' = Zc (z + j Zc tan t)
 * / (Zc + j z tan t); transformer n:1 z' = n² z. A line or stub without fRef is taken at its
 * stated length. Special points are exact: a series part on an open stays open, a shunt part on
 * an open gives the part's own impedance, a shunt part on a short stays short, a 90° line turns a
 * short into an open.
 */
export function applyElement(z: Complex, element: Element, frequencyHz: number): Complex {
  const start = asComplex(z, 'z', true)
  const e = validateElement(element, 'element')
  const f = requireFrequency(frequencyHz, 'frequencyHz')
  const p = createPoints(1)
  setPoint(p, 0, start)
  applyElementToPoints(p, e, Float64Array.of(f))
  return readImpedance(p, 0)
}
