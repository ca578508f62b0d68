import { describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import { RfInputError, eSeries, nearestStandard, standardNeighbours, type ESeriesName } from '../../../shared/rf/index'
import { WORKED_SOURCE, casesWhere, expectRealClose } from './reference'

const [worked] = casesWhere((c) => c.id === 'worked-eseries')

describe(`E-series tables (source: ${WORKED_SOURCE}; IEC 60063)`, () => {
  it.each(['E12', 'E24', 'E48', 'E96'] as const)('%s equals the reference list', (name) => {
    expect(eSeries(name)).toEqual(worked!.expected[name])
  })

  it('E12 and E24 are not round(10^(i/N)): the published exceptions are kept', () => {
    const rounded = (n: number) => Array.from({ length: n }, (_, i) => Math.round(10 * 10 ** (i / n)) / 10)
    const diff = eSeries('E24').filter((v, i) => v !== rounded(24)[i])
    expect(diff).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2])
    expect(eSeries('E12')).not.toEqual(rounded(12))
  })

  it.each((worked!.nearestExamples as any[]).map((e) => [`${e.value} in ${e.series}`, e] as const))(
    'nearest of %s',
    (_label, e) => {
      expectRealClose(nearestStandard(e.value, e.series), e.nearest, 'nearest')
      const n = standardNeighbours(e.value, e.series)
      expectRealClose(n.below, e.below, 'below')
      expectRealClose(n.above, e.above, 'above')
    },
  )
})

describe('nearestStandard properties (seeded)', () => {
  it('is in the series, within half a step on the log scale, and exact on standard values', () => {
    const rng = seedrandom('eseries')
    for (const name of ['E12', 'E24', 'E48', 'E96'] as ESeriesName[]) {
      const list = eSeries(name)
      const halfStep = Math.log(10) / list.length // worst gap is below one nominal step
      for (let k = 0; k < 300; k++) {
        const v = 10 ** (-15 + rng() * 25)
        const s = nearestStandard(v, name)
        const mantissa = s / 10 ** Math.floor(Math.log10(s) + 1e-12)
        expect(list.some((m) => Math.abs(m - mantissa) < 1e-9)).toBe(true)
        expect(Math.abs(Math.log(s / v))).toBeLessThanOrEqual(halfStep)
      }
      // Standard values map to themselves in any decade, and print cleanly.
      for (const m of list) {
        expect(nearestStandard(m * 1e-12, name)).toBe(Number(`${m}e-12`))
        expect(nearestStandard(m * 1e3, name)).toBe(Number(`${m}e3`))
      }
    }
  })

  it('rejects bad values and unknown series by name', () => {
    expect(() => nearestStandard(0, 'E12')).toThrow(/^value/)
    expect(() => nearestStandard(NaN, 'E12')).toThrow(RfInputError)
    expect(() => nearestStandard(1, 'E7' as never)).toThrow(/^series/)
  })
})
