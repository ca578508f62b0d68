/**
 * Finite-Q losses of a ladder: efficiency, dissipative, mismatch and insertion loss, at one
 * frequency or across a band.
 *
 * Method: voltage and current tracked from the load back to the source through each element's
 * ABCD matrix (abcd.ts, which takes the matrices from the shared point kernel, so the element
 * impedances — ESR = |X|/Q included — are those of points.ts and nowhere else). With (V, I) at
 * the load set to (Z_L, 1 A) (an open load: (1 V, 0)), the power into the load is Re(V_L·I_L*) and
 * the power into the network Re(V_in·I_in*); their ratio does not depend on the drive level.
 */
import type { Complex, Element } from './types'
import { asComplex, divideParts, isInfinite } from './complex'
import { RfInputError, describe, requirePositive } from './errors'
import { requireFrequency, validateElements } from './elements'
import { deliveredPowerFraction, gammaOf } from './gamma'
import { applyAbcd, createVI, elementAbcdFlat, type FlatVI } from './abcd'
import type { BlockLookup } from './twoport'

/** Quality factors used for L and C parts that carry no `q` of their own. */
export type DefaultQ = { readonly L?: number; readonly C?: number }

/**
 * The ladder with each L and C that has no `q` given the default of its kind (an absent default
 * leaves the part lossless). Parts with their own `q`, and other kinds, are returned unchanged.
 */
export function withDefaultQ<E extends Element>(elements: readonly E[], defaults: DefaultQ | undefined): E[] {
  if (!defaults) return elements.slice()
  return elements.map((e) => {
    if ((e.kind !== 'L' && e.kind !== 'C') || e.q !== undefined) return e
    const q = defaults[e.kind]
    return q === undefined ? e : { ...e, q }
  })
}

/** Arguments of `lossesAcrossBand`. `load` and `source` are one impedance (Ω) or one per frequency. */
export type LossInput = {
  readonly frequencies: ArrayLike<number>
  readonly load: Complex | readonly Complex[]
  /** The source impedance Zs (Ω, real part above zero); its available power is the reference. */
  readonly source: Complex | readonly Complex[]
  /** From the load towards the source; finite Q through each part's `q` (see `withDefaultQ`). */
  readonly elements: readonly Element[]
  /** Measured two-port data for `block` elements, by upload id. */
  readonly blocks?: BlockLookup
}

/** Loss figures per frequency, `[k]` at `frequencies[k]`. */
export type LossResult = {
  /** Power into the load / power into the network, 0…1 (0 when no power enters at all). */
  readonly efficiency: Float64Array
  /** −10·log10(efficiency): the power burnt in the parts' ESRs, in dB. */
  readonly dissipativeLossDb: Float64Array
  /** −10·log10(1 − |Γ|²) at the source end (power-wave Γ against Zs). */
  readonly mismatchLossDb: Float64Array
  /**
   * Transducer loss: −10·log10(power into the load / available power of the source) =
   * dissipative + mismatch loss. At a conjugate match it equals the dissipative loss.
   */
  readonly insertionLossDb: Float64Array
}

function perFrequency(value: Complex | readonly Complex[], n: number, argument: string, allowInfinite: boolean): Complex[] {
  if (Array.isArray(value)) {
    if (value.length !== n) throw new RfInputError(argument, `has ${value.length} impedances for ${n} frequencies`)
    return value.map((z, k) => asComplex(z, `${argument}[${k}]`, allowInfinite))
  }
  const z = asComplex(value, argument, allowInfinite)
  return Array.from({ length: n }, () => z)
}

/** (V, I) at the load: (Z_L, 1 A), or (1 V, 0) for an open. */
export function loadVI(loads: readonly Complex[]): FlatVI {
  const vi = createVI(loads.length)
  loads.forEach((z, k) => {
    if (isInfinite(z)) { vi.vRe[k] = 1 } else { vi.vRe[k] = z.re; vi.vIm[k] = z.im; vi.iRe[k] = 1 }
  })
  return vi
}

function lossDb(ratio: number): number {
  return ratio > 0 ? -10 * Math.log10(ratio) : Infinity
}

/**
 * Efficiency and losses of the ladder at each frequency (see `LossResult`). Throws
 * `RfInputError` for bad input, including a source without resistance (no available power).
 * A frequency where a part blocks the signal (an open in series, a short across) gives
 * efficiency 0 and infinite losses.
 */
export function lossesAcrossBand(input: LossInput): LossResult {
  const f = input?.frequencies
  if (!(Array.isArray(f) || f instanceof Float64Array) || f.length === 0) {
    throw new RfInputError('frequencies', `must be a non-empty array of Hz, got ${describe(f)}`)
  }
  const n = f.length
  for (let k = 0; k < n; k++) requirePositive(f[k], `frequencies[${k}]`)
  const elements = validateElements(input.elements, 'elements', { requireFRef: n > 1 })
  const loads = perFrequency(input.load, n, 'load', true)
  const sources = perFrequency(input.source, n, 'source', false)
  sources.forEach((zs, k) => {
    if (!(zs.re > 0)) throw new RfInputError(n > 1 ? `source[${k}]` : 'source', `needs a real part above zero to deliver power, got ${zs.re}`)
  })
  const vi = loadVI(loads)
  const loadPower = new Float64Array(n)
  for (let k = 0; k < n; k++) loadPower[k] = vi.vRe[k]! * vi.iRe[k]! + vi.vIm[k]! * vi.iIm[k]!
  elements.forEach((e, i) => applyAbcd(vi, elementAbcdFlat(e, f, input.blocks, `elements[${i}]`)))
  const out = {
    efficiency: new Float64Array(n),
    dissipativeLossDb: new Float64Array(n),
    mismatchLossDb: new Float64Array(n),
    insertionLossDb: new Float64Array(n),
  }
  for (let k = 0; k < n; k++) {
    const vr = vi.vRe[k]!, vim = vi.vIm[k]!, ir = vi.iRe[k]!, ii = vi.iIm[k]!
    const inputPower = vr * ir + vim * ii
    const isBlocked = vr === 0 && vim === 0 && ir === 0 && ii === 0
    const efficiency = isBlocked || !(inputPower > 0) ? 0 : Math.min(1, Math.max(0, loadPower[k]! / inputPower))
    const delivered = isBlocked ? 0 : deliveredPowerFraction(clampUnit(gammaOf(divideParts(vr, vim, ir, ii), sources[k]!)))
    out.efficiency[k] = efficiency
    out.dissipativeLossDb[k] = lossDb(efficiency)
    out.mismatchLossDb[k] = lossDb(delivered)
    out.insertionLossDb[k] = lossDb(efficiency * delivered)
  }
  return out
}

// A passive input can sit a hair outside |Γ| = 1 through rounding only.
function clampUnit(g: Complex): Complex {
  const m = Math.hypot(g.re, g.im)
  return m > 1 ? { re: g.re / m, im: g.im / m } : g
}

/** Arguments of `lossesAt`: `lossesAcrossBand` at one frequency. */
export type LossAtInput = {
  readonly frequency: number
  readonly load: Complex
  readonly source: Complex
  readonly elements: readonly Element[]
  readonly blocks?: BlockLookup
}

/** Loss figures at one frequency (lines and stubs without fRef taken at their stated length). */
export function lossesAt(input: LossAtInput): {
  efficiency: number; dissipativeLossDb: number; mismatchLossDb: number; insertionLossDb: number
} {
  const frequency = requireFrequency(input?.frequency, 'frequency')
  const r = lossesAcrossBand({ frequencies: [frequency], load: input.load, source: input.source, elements: input.elements, blocks: input.blocks })
  return {
    efficiency: r.efficiency[0]!,
    dissipativeLossDb: r.dissipativeLossDb[0]!,
    mismatchLossDb: r.mismatchLossDb[0]!,
    insertionLossDb: r.insertionLossDb[0]!,
  }
}
