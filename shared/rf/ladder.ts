/**
 * Tracing a ladder at one frequency: the impedance point after each element, from the load out.
 */
import type { Complex, Element } from './types'
import { asComplex } from './complex'
import { requirePositive } from './errors'
import { requireFrequency, validateElements } from './elements'
import { createPoints, readImpedance, setPoint } from './points'
import { applyLadderElement, type BlockLookup, type BlockRange } from './twoport'

/** Arguments of `trace`. `load` may be `OPEN` ({ re: Infinity, im: 0 }) or a short ({ re: 0, im: 0 }). */
export type TraceInput = {
  /** Reference impedance of the chart (Ω); validated, not used by the impedances themselves. */
  readonly z0: number
  /** Analysis frequency (Hz). Lines and stubs without fRef are taken at their stated length here. */
  readonly frequency: number
  readonly load: Complex
  /** Ordered from the load towards the source. */
  readonly elements: readonly Element[]
  /** Measured data of the ladder's `block` elements, by upload id. */
  readonly blocks?: BlockLookup
  /** A block outside its measured range: throw ('strict', default) or use its nearest point. */
  readonly blockRange?: BlockRange
}

/**
 * The impedances (Ω) after 0…n elements: `[0]` is the load, `[i]` the point seen from the source
 * side of element i − 1. Series adds impedance, shunt adds admittance, a line transforms
 * z' = Zc (z + j Zc tan t)/(Zc + j z tan t) with t = deg·f/fRef, a transformer n:1 gives n²z
 * (formulas in points.ts). An infinite impedance comes back as `OPEN`; an empty ladder gives
 * `[load]`. Throws `RfInputError` naming the bad argument.
 */
export function trace(input: TraceInput): Complex[] {
  requirePositive(input?.z0, 'z0')
  const f = requireFrequency(input.frequency, 'frequency')
  const load = asComplex(input.load, 'load', true)
  const elements = validateElements(input.elements, 'elements')
  const p = createPoints(1)
  setPoint(p, 0, load)
  const freq = Float64Array.of(f)
  const out: Complex[] = [load]
  for (const [i, e] of elements.entries()) {
    applyLadderElement(p, e, freq, input.blocks, `elements[${i}]`, input.blockRange)
    out.push(readImpedance(p, 0))
  }
  return out
}

/** The source-end impedance of a ladder at one frequency: the last point of `trace`. */
export function inputImpedance(input: TraceInput): Complex {
  const points = trace(input)
  return points[points.length - 1]!
}
