// Calling the RF core from a route: its bad-argument errors become 400s that name the argument,
// and the result is made JSON-safe.
import { RfInputError } from '../../shared/rf/index'

/**
 * JSON has no infinity: JSON.stringify would turn an open ({ re: Infinity, im: 0 }) into
 * { re: null } without a word. Non-finite numbers are sent as the strings "Infinity",
 * "-Infinity" and "NaN" instead (the spelling of the team's reference data). Returns the same
 * object when nothing needed changing, so large finite sweeps are not copied.
 */
export function withNonFiniteAsStrings(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? value : String(value)
  if (Array.isArray(value)) {
    let copy: unknown[] | undefined
    for (let i = 0; i < value.length; i++) {
      const item = withNonFiniteAsStrings(value[i])
      if (item !== value[i]) (copy ??= value.slice())[i] = item
    }
    return copy ?? value
  }
  if (value !== null && typeof value === 'object') {
    let copy: Record<string, unknown> | undefined
    for (const [key, item] of Object.entries(value)) {
      const safe = withNonFiniteAsStrings(item)
      if (safe !== item) (copy ??= { ...value })[key] = safe
    }
    return copy ?? value
  }
  return value
}

/** True when a NaN is anywhere in the value (arrays and plain objects walked). */
export function containsNaN(value: unknown): boolean {
  if (typeof value === 'number') return Number.isNaN(value)
  if (Array.isArray(value)) return value.some(containsNaN)
  if (value !== null && typeof value === 'object') return Object.values(value).some(containsNaN)
  return false
}

/**
 * Runs one RF core call for a route and answers its result, or a 400 naming the bad argument.
 * A NaN in the result (finite inputs whose arithmetic overflowed, e.g. z0 = 1e308) is a 422:
 * an answer must never carry an undefined number.
 */
export function answerRf(compute: () => unknown): unknown {
  try {
    const result = compute()
    if (containsNaN(result)) {
      throw createError({ statusCode: 422, message: 'These inputs are outside the range the computation can represent (a result would be undefined): use smaller magnitudes.' })
    }
    return withNonFiniteAsStrings(result)
  }
  catch (error) {
    if (error instanceof RfInputError) {
      throw createError({ statusCode: 400, message: error.message, data: { argument: error.argument } })
    }
    throw error
  }
}
