import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import { inputImpedance, solveStub, stubToElements, type Element } from '../../../shared/rf/index'
import { REFERENCE_SOURCE, WORKED_SOURCE, casesWhere, complexError, expectComplexClose, expectRealClose, refComplex } from './reference'

const stubCases = casesWhere((c) => c.op === 'stub')

describe('solveStub against the reference cases', () => {
  it('has four stub cases and the worked example', () => expect(stubCases).toHaveLength(5))

  it.each(stubCases.map((c) => [c.id, c] as const))('%s', (_id, c) => {
    const source = c.group === 'worked-example' ? WORKED_SOURCE : REFERENCE_SOURCE
    const common = {
      z0: c.input.z0 as number,
      frequency: c.input.f as number,
      load: refComplex(c.input.zl),
      placement: c.expected.placement as 'series' | 'shunt',
      stubZ0: c.expected.stubZ0 as number,
    }
    for (const end of ['open', 'short'] as const) {
      const ours = solveStub({ ...common, end })
      const wanted = c.expected.solutions as any[]
      expect(ours, `${c.id} ${end}: count (source: ${source})`).toHaveLength(wanted.length)
      wanted.forEach((w, i) => {
        expectRealClose(ours[i]!.d, w.dWl, `${c.id} ${end} #${i} d (source: ${source})`, 1e-9)
        expectRealClose(ours[i]!.l, end === 'open' ? w.openWl : w.shortWl, `${c.id} ${end} #${i} l (source: ${source})`, 1e-9)
        const elements = stubToElements(ours[i]!, { ...common, end })
        const expectedElements = (end === 'open' ? w.openElements : w.shortElements) as Element[]
        expect(elements.map((e) => e.kind)).toEqual(expectedElements.map((e) => e.kind))
        const zin = inputImpedance({ z0: common.z0, frequency: common.frequency, load: common.load, elements })
        expectComplexClose(zin, refComplex((end === 'open' ? w.openVerify : w.shortVerify).zin), `${c.id} ${end} #${i} matched`)
      })
    }
  })
})

describe('solveStub properties (seeded)', () => {
  it('every solution, as elements, matches the load to z0 within 1e-9, for both ends and placements', () => {
    const rng = seedrandom('stub-property')
    let count = 0
    for (let k = 0; k < 400; k++) {
      const z0 = 25 + rng() * 75
      const load = { re: 1 + rng() * 300, im: (rng() - 0.5) * 600 }
      const options = {
        z0, frequency: 1e8 + rng() * 5e9, end: rng() < 0.5 ? 'open' as const : 'short' as const,
        placement: rng() < 0.5 ? 'shunt' as const : 'series' as const, stubZ0: rng() < 0.5 ? z0 : 20 + rng() * 100,
      }
      const solutions = solveStub({ ...options, load })
      expect(solutions.length).toBeGreaterThanOrEqual(1)
      for (const s of solutions) {
        expect(s.d).toBeGreaterThanOrEqual(0)
        expect(s.d).toBeLessThan(0.5)
        expect(s.l).toBeGreaterThanOrEqual(0)
        expect(s.l).toBeLessThan(0.5)
        const zin = inputImpedance({ z0, frequency: options.frequency, load, elements: stubToElements(s, options) })
        expect(complexError(zin, { re: z0, im: 0 }, 1e-300)).toBeLessThanOrEqual(1e-9)
        count++
      }
    }
    expect(count).toBeGreaterThan(700)
  })

  it('special loads: matched needs nothing, lossless and open loads have no solution', () => {
    expect(solveStub({ z0: 50, frequency: 1e9, load: 50, end: 'open' })).toEqual([{ d: 0, l: 0 }])
    expect(solveStub({ z0: 50, frequency: 1e9, load: 50, end: 'short' })).toEqual([{ d: 0, l: 0.25 }])
    expect(stubToElements({ d: 0, l: 0 }, { z0: 50, frequency: 1e9, end: 'open' })).toEqual([])
    expect(solveStub({ z0: 50, frequency: 1e9, load: { re: 0, im: 30 }, end: 'open' })).toEqual([])
    expect(solveStub({ z0: 50, frequency: 1e9, load: { re: Infinity, im: 0 }, end: 'open' })).toEqual([])
  })

  it('rejects bad arguments by name', () => {
    expect(() => solveStub({ z0: 0, frequency: 1e9, load: 10, end: 'open' })).toThrow(/^z0/)
    expect(() => solveStub({ z0: 50, frequency: NaN, load: 10, end: 'open' })).toThrow(/^frequency/)
    expect(() => solveStub({ z0: 50, frequency: 1e9, load: 10, end: 'closed' as never })).toThrow(/^end/)
    expect(() => solveStub({ z0: 50, frequency: 1e9, load: 10, end: 'open', stubZ0: -1 })).toThrow(/^stubZ0/)
  })
})
