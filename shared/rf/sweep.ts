/**
 * A ladder across a band: the source-end impedance at each frequency, computed on flat
 * Float64Arrays (one pass per element over all frequencies, constants hoisted, no object per
 * complex number until the optional conversion to `{ re, im }` at the end).
 */
import type { Complex, Element } from './types'
import { RfInputError, describe, requirePositive } from './errors'
import { OPEN, asComplex, divideInto, isInfinite } from './complex'
import { validateElements } from './elements'
import { applyElementToPoints, asFloat64, createPoints, setPoint, type PointBuffer } from './points'
import { isUniformGrid } from './angles'
import { applyLadderElement, hasMeasuredData, type BlockLookup } from './twoport'

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
  for (let i = 0; i < f.length; i++) {
    const x = f[i]
    // The argument name is built only on failure: this loop runs on every sweep.
    if (!(typeof x === 'number' && x > 0 && x < Infinity)) requirePositive(x, `frequencies[${i}]`)
  }
  return f
}

// One scratch buffer reused across sweeps (sweeps are synchronous, so never shared by two at once):
// allocating four typed arrays per call costs more than a short ladder's arithmetic.
let scratch: PointBuffer | undefined

function scratchPoints(n: number): PointBuffer {
  if (!scratch || scratch.n !== n) scratch = createPoints(n)
  else {
    scratch.aRe.fill(0)
    scratch.aIm.fill(0)
    scratch.bRe.fill(1)
    scratch.bIm.fill(0)
  }
  return scratch
}

function loadPoints(load: unknown, n: number): PointBuffer {
  const p = scratchPoints(n)
  if (Array.isArray(load)) {
    if (load.length !== n) {
      throw new RfInputError('load', `has ${load.length} impedances for ${n} frequencies (give one, or one per frequency)`)
    }
    for (let i = 0; i < n; i++) {
      const z = load[i] as Complex
      // Plain finite values go straight in; anything else is checked (and named) properly.
      if (z !== null && typeof z === 'object' && Number.isFinite(z.re) && Number.isFinite(z.im)) {
        p.aRe[i] = z.re
        p.aIm[i] = z.im
      } else {
        setPoint(p, i, asComplex(z, `load[${i}]`, true))
      }
    }
  } else {
    const z = asComplex(load, 'load', true)
    if (isInfinite(z)) {
      p.aRe.fill(1)
      p.bRe.fill(0)
    } else {
      p.aRe.fill(z.re)
      p.aIm.fill(z.im)
    }
  }
  return p
}

/** Runs the ladder over the band on the scratch buffer; the result is read by the callers below. */
function sweepPoints(input: SweepInput): { p: PointBuffer; frequencies: Float64Array } {
  requirePositive(input?.z0, 'z0')
  const frequencies = asFloat64(checkFrequencies(input.frequencies))
  const elements = validateElements(input.elements, 'elements', { requireFRef: true })
  const p = loadPoints(input.load, frequencies.length)
  const uniformGrid = isUniformGrid(frequencies)
  elements.forEach((e, i) => {
    if (hasMeasuredData(e)) applyLadderElement(p, e, frequencies, input.blocks, `elements[${i}]`)
    // Rescaling every fourth element is enough: four parts cannot take a pair from 1e100 to overflow.
    else applyElementToPoints(p, e, frequencies, { uniformGrid, rescale: i % 4 === 3 })
  })
  return { p, frequencies }
}

/** z = a/b at point i into q (Smith's division, infinity as (Infinity, 0)); NaN throws. */
function quotientAt(p: PointBuffer, i: number, q: Float64Array, frequencies: Float64Array): void {
  divideInto(p.aRe[i]!, p.aIm[i]!, p.bRe[i]!, p.bIm[i]!, q)
  if (Number.isNaN(q[0]) || Number.isNaN(q[1])) {
    throw new RfInputError('elements', `values too large to compute at ${frequencies[i]} Hz`)
  }
}

/**
 * The same as `sweep` but returning flat arrays (Ω): the fast path for plots and Monte Carlo,
 * with no object per frequency.
 */
export function sweepFlat(input: SweepInput): FlatImpedances {
  const { p, frequencies } = sweepPoints(input)
  const n = p.n
  const out = new Float64Array(2 * n)
  const re = out.subarray(0, n)
  const im = out.subarray(n)
  const q = new Float64Array(2)
  for (let i = 0; i < n; i++) {
    quotientAt(p, i, q, frequencies)
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
  const { p, frequencies } = sweepPoints(input)
  const out: Complex[] = new Array(p.n)
  const q = new Float64Array(2)
  for (let i = 0; i < p.n; i++) {
    quotientAt(p, i, q, frequencies)
    out[i] = q[0] === Infinity ? OPEN : { re: q[0]!, im: q[1]! }
  }
  return out
}
