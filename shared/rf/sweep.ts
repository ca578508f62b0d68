/**
 * A ladder across a band: the source-end impedance at each frequency, computed on flat
 * Float64Arrays (one pass per element over all frequencies, constants hoisted, no object per
 * complex number until the optional conversion to `{ re, im }` at the end).
 */
import type { Complex, Element } from './types'
import { RfInputError, describe, requirePositive } from './errors'
import { OPEN, asComplex, divideInto } from './complex'
import { validateElements } from './elements'
import { createPoints, setPoint, type PointBuffer } from './points'
import { applyLadderElement, type BlockLookup } from './twoport'

/** Arguments of `sweep`. `load` is one impedance for every frequency or one per frequency. */
export type SweepInput = {
  /** Reference impedance (Ω); validated, not used by the impedances themselves. */
  readonly z0: number
  /** Analysis frequencies (Hz), each finite and above zero. */
  readonly frequencies: ArrayLike<number>
  readonly load: Complex | readonly Complex[]
  /** Ordered from the load towards the source; lines and stubs must carry fRef. */
  readonly elements: readonly Element[]
  /** Measured data of the ladder's `block` elements, by upload id; never extrapolated. */
  readonly blocks?: BlockLookup
}

/** Source-end impedances as two flat arrays (Ω); an open is re = Infinity, im = 0. */
export type FlatImpedances = { readonly re: Float64Array; readonly im: Float64Array }

function checkFrequencies(value: unknown): ArrayLike<number> {
  if (!(Array.isArray(value) || value instanceof Float64Array) || value.length === 0) {
    throw new RfInputError('frequencies', `must be a non-empty array of Hz, got ${describe(value)}`)
  }
  const f = value as ArrayLike<number>
  for (let i = 0; i < f.length; i++) requirePositive(f[i], `frequencies[${i}]`)
  return f
}

function loadPoints(load: unknown, n: number): PointBuffer {
  const p = createPoints(n)
  if (Array.isArray(load)) {
    if (load.length !== n) {
      throw new RfInputError('load', `has ${load.length} impedances for ${n} frequencies (give one, or one per frequency)`)
    }
    for (let i = 0; i < n; i++) setPoint(p, i, asComplex(load[i], `load[${i}]`, true))
  } else {
    const z = asComplex(load, 'load', true)
    for (let i = 0; i < n; i++) setPoint(p, i, z)
  }
  return p
}

/**
 * The same as `sweep` but returning flat arrays: the fast path for plots and Monte Carlo.
 * Each output is z = a/b of the homogeneous point (points.ts), divided with Smith's scaling.
 */
export function sweepFlat(input: SweepInput): FlatImpedances {
  requirePositive(input?.z0, 'z0')
  const frequencies = checkFrequencies(input.frequencies)
  const elements = validateElements(input.elements, 'elements', { requireFRef: true })
  const n = frequencies.length
  const p = loadPoints(input.load, n)
  elements.forEach((e, i) => applyLadderElement(p, e, frequencies, input.blocks, `elements[${i}]`))
  const re = new Float64Array(n)
  const im = new Float64Array(n)
  const { aRe, aIm, bRe, bIm } = p
  const q = new Float64Array(2)
  for (let i = 0; i < n; i++) {
    divideInto(aRe[i]!, aIm[i]!, bRe[i]!, bIm[i]!, q)
    if (Number.isNaN(q[0]) || Number.isNaN(q[1])) {
      throw new RfInputError('elements', `values too large to compute at ${frequencies[i]} Hz`)
    }
    re[i] = q[0]!
    im[i] = q[1]!
  }
  return { re, im }
}

/**
 * The impedance (Ω) at the source end of the ladder for each frequency, `[k]` at
 * `frequencies[k]`: the last point of `trace` at that frequency, with lines and stubs scaled as
 * t = deg·f/fRef. Infinite results are `OPEN`. Throws `RfInputError` naming the bad argument
 * (e.g. `elements[1].fRef` when a line has none).
 */
export function sweep(input: SweepInput): Complex[] {
  const { re, im } = sweepFlat(input)
  const out: Complex[] = new Array(re.length)
  for (let i = 0; i < re.length; i++) out[i] = re[i] === Infinity ? OPEN : { re: re[i]!, im: im[i]! }
  return out
}
