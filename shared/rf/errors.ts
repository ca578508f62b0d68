/**
 * The one error type of the RF core for bad arguments. `argument` names the offending input as a
 * path a caller can show or map to a form field (`frequency`, `load`, `elements[2].fRef`).
 * Functions of shared/rf throw this instead of returning NaN.
 */
export class RfInputError extends Error {
  readonly argument: string

  constructor(argument: string, problem: string) {
    super(`${argument}: ${problem}`)
    this.name = 'RfInputError'
    this.argument = argument
  }
}

/** Throws unless `value` is a finite number. */
export function requireFinite(value: unknown, argument: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RfInputError(argument, `must be a finite number, got ${describe(value)}`)
  }
  return value
}

/** Throws unless `value` is a finite number greater than zero (frequencies, Z0, ratios). */
export function requirePositive(value: unknown, argument: string): number {
  const x = requireFinite(value, argument)
  if (x <= 0) throw new RfInputError(argument, `must be greater than zero, got ${x}`)
  return x
}

/** Throws unless `value` is a finite number that is zero or more (part values, lengths). */
export function requireNonNegative(value: unknown, argument: string): number {
  const x = requireFinite(value, argument)
  if (x < 0) throw new RfInputError(argument, `must not be negative, got ${x}`)
  return x
}

/** A short, safe rendering of a bad value for an error message. */
export function describe(value: unknown): string {
  if (typeof value === 'number') return String(value)
  if (typeof value === 'string') return JSON.stringify(value.slice(0, 40))
  if (value === null) return 'null'
  if (Array.isArray(value)) return 'an array'
  return typeof value
}
