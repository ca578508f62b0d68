// What a board's match search looks at (huntPlan): the spec band, the load the searched ladder
// sees (through a measured block that stays), and Fano's limit, exact or estimated.
import { describe, expect, it } from 'vitest'
import { huntPlan } from '../../../shared/board/hunt'
import { bandFrequencies } from '../../../shared/board/band'
import { DEFAULT_SETTINGS, type BoardElement, type BoardSettings } from '../../../shared/board/schema'
import { terminalImpedances } from '../../../shared/board/terminals'
import {
  bodeFanoLimitDb, ladderSParameters, parseTouchstone, sweep, writeTouchstone, type Element,
} from '../../../shared/rf/index'

function planFor(settings: BoardSettings, elements: BoardElement[] = [], blocks = {}) {
  const f = bandFrequencies(settings)
  return huntPlan({ settings, elements, bandFrequencies: f, bandLoadZ: terminalImpedances(settings.load, f, settings.z0, {}), blocks })
}

describe('huntPlan', () => {
  const base: BoardSettings = { ...DEFAULT_SETTINGS, bandStartHz: 0.9e9, bandStopHz: 1.1e9, bandPoints: 21, spec: { minReturnLossDb: 10, f1Hz: 0.95e9, f2Hz: 1.05e9 } }

  it('takes the band points inside the spec and gives an R-C model load its exact limit', () => {
    const settings = { ...base, load: { kind: 'rlc', topology: 'parallel', r: 120, c: 3e-12 } } as BoardSettings
    const plan = planFor(settings)
    expect(plan.frequencies[0]).toBeCloseTo(0.95e9, 0)
    expect(plan.frequencies[plan.frequencies.length - 1]).toBeCloseTo(1.05e9, 0)
    expect(plan.frequencies.every(f => f >= 0.95e9 && f <= 1.05e9)).toBe(true)
    expect(plan.fano).toEqual({
      model: 'parallel-RC', isEstimate: false,
      limitDb: bodeFanoLimitDb({ model: 'parallel-RC', r: 120, c: 3e-12, fStart: plan.frequencies[0]!, fStop: plan.frequencies[plan.frequencies.length - 1]! }),
    })
  })

  it('labels the limit of a fixed impedance an estimate', () => {
    const plan = planFor({ ...base, load: { kind: 'impedance', z: { re: 20, im: 30 } } })
    expect(plan.fano?.isEstimate).toBe(true)
    expect(plan.fano?.model.endsWith('RL')).toBe(true)
  })

  it('keeps a measured block and what precedes it, and searches from what the block presents', () => {
    const f = bandFrequencies(base)
    const filter: Element[] = [{ kind: 'L', placement: 'series', value: 6e-9 }, { kind: 'C', placement: 'shunt', value: 2e-12 }]
    const text = writeTouchstone({ ports: 2, z0: 50, frequencies: f, s: ladderSParameters({ z0: 50, frequencies: f, elements: filter }), format: 'RI', unit: 'HZ' })
    const blocks = { up1: parseTouchstone(text, 'filter.s2p') }
    const before: BoardElement = { id: 'c0', kind: 'C', placement: 'series', value: 5e-12 }
    const block: BoardElement = { id: 'b1', kind: 'block', uploadId: 'up1' }
    const after: BoardElement = { id: 'l9', kind: 'L', placement: 'shunt', value: 20e-9 }
    const settings = { ...base, load: { kind: 'impedance', z: { re: 20, im: -15 } } } as BoardSettings
    const plan = planFor(settings, [before, block, after], blocks)
    expect(plan.fixed.map(e => e.id)).toEqual(['c0', 'b1'])
    const want = sweep({ z0: 50, frequencies: plan.frequencies, load: { re: 20, im: -15 }, elements: [before, ...filter] })
    plan.load.forEach((z, i) => {
      expect(z.re).toBeCloseTo(want[i]!.re, 6)
      expect(z.im).toBeCloseTo(want[i]!.im, 6)
    })
  })
})
