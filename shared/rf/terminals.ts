/**
 * Terminal models: the impedance of a source or load described as an R-L-C network.
 */
import type { Complex, Element } from './types'
import { OPEN, SHORT } from './complex'
import { requireNonNegative } from './errors'
import { requireFrequency } from './elements'
import { applyElementToPoints, createPoints, readImpedance, setPoint } from './points'

/** An R-L-C terminal: parts absent from the model are left out of the network. */
export type RlcModel = {
  readonly topology: 'series' | 'parallel'
  readonly r?: number
  readonly l?: number
  readonly c?: number
}

/**
 * The impedance (Ω) of an R-L-C terminal at `frequencyHz`.
 * series: Z = R + jωL + 1/(jωC); parallel: Y = 1/R + 1/(jωL) + jωC. An absent part is left out
 * (a series model with no parts is a short, a parallel one an open); C = 0 in series gives `OPEN`,
 * R = 0 or L = 0 in parallel gives a short. Built from the same element maps as a ladder.
 */
export function rlcImpedance(model: RlcModel, frequencyHz: number): Complex {
  const f = requireFrequency(frequencyHz, 'frequencyHz')
  const placement = model.topology === 'parallel' ? 'shunt' : 'series'
  const p = createPoints(1)
  setPoint(p, 0, placement === 'series' ? SHORT : OPEN)
  const parts: [Element['kind'], number | undefined][] = [['R', model.r], ['L', model.l], ['C', model.c]]
  for (const [kind, value] of parts) {
    if (value === undefined) continue
    requireNonNegative(value, `model.${kind.toLowerCase()}`)
    applyElementToPoints(p, { kind, placement, value } as Element, Float64Array.of(f))
  }
  return readImpedance(p, 0)
}
