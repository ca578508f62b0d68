// A measured .s1p as a board's load: impedance from S11, coverage of the band, the design
// frequency outside the file. Reference: tests/fixtures/reference/touchstone (invented antenna model
// R = 42 Ω, L = 28 nH, C = 1.1 pF in series, 0.2 pF across; read back by scikit-rf 0.15.4).
import { readFileSync } from 'node:fs'
import { REFERENCE_ROOT } from '../../support/reference'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { parseTouchstone, rlcImpedance, trace, type Complex } from '../../../shared/rf/index'
import { measuredCoverage, measuredImpedanceAt, measuredImpedances, measuredUploadIds, splitByCoverage } from '../../../shared/board/measured'
import { designedNetworkS2p } from '../../../shared/board/exports'
import { DEFAULT_SETTINGS } from '../../../shared/board/schema'

const DIR = path.resolve(REFERENCE_ROOT, 'touchstone')
const read = (file: string) => parseTouchstone(readFileSync(path.join(DIR, file), 'utf8'), file)

/** The invented antenna model of the reference files, as a ladder: series R-L-C then 0.2 pF across. */
function antennaModel(f: number): Complex {
  const series = rlcImpedance({ topology: 'series', r: 42, l: 28e-9, c: 1.1e-12 }, f)
  return trace({ z0: 50, frequency: f, load: series, elements: [{ kind: 'C', placement: 'shunt', value: 0.2e-12 }] })[1]!
}
const relErr = (a: Complex, e: Complex) => Math.hypot(a.re - e.re, a.im - e.im) / Math.hypot(e.re, e.im)

describe('a measured load', () => {
  it.each(['antenna_ri_mhz.s1p', 'antenna_ri_hz_r75.s1p', 'antenna_db_khz.s1p'])('%s gives the antenna model impedance at its points', (file) => {
    const data = read(file)
    const { impedances, outsideHz } = measuredImpedances(data, data.frequencies)
    expect(outsideHz).toEqual([])
    impedances.forEach((z, k) => expect(relErr(z!, antennaModel(data.frequencies[k]!)), `${file} @ ${data.frequencies[k]}`).toBeLessThan(1e-8))
  })

  it('reports band points beyond the file and never gives them a value', () => {
    const data = read('antenna_ri_mhz.s1p')
    const range = measuredCoverage(['a'], { a: data })!
    expect(range).toEqual({ fMinHz: 800e6, fMaxHz: 1000e6 })
    const { insideHz, outsideHz } = splitByCoverage([780e6, 800e6, 900e6, 1000e6, 1050e6], range)
    expect(insideHz).toEqual([800e6, 900e6, 1000e6])
    expect(outsideHz).toEqual([780e6, 1050e6])
    expect(measuredImpedances(data, [1050e6]).impedances).toEqual([null])
  })

  it('takes the nearest measured point for a design frequency outside the file', () => {
    const data = read('antenna_ri_mhz.s1p')
    expect(measuredImpedanceAt(data, 1.2e9, 50)).toEqual(measuredImpedanceAt(data, 1e9, 50))
    expect(measuredImpedanceAt(undefined, 1e9, 50)).toEqual({ re: 50, im: 0 })
  })

  it('lists the uploads a board names', () => {
    expect(measuredUploadIds({ load: { kind: 'measured', uploadId: 'u1' }, source: { kind: 'z0' } },
      [{ kind: 'L' }, { kind: 'block', uploadId: 'u2' } as never])).toEqual(['u1', 'u2'])
    expect(measuredUploadIds(DEFAULT_SETTINGS, [])).toEqual([])
  })
})

describe('the designed network as .s2p', () => {
  it('reads back with a line taken at the design frequency when it has no fRef', () => {
    const frequenciesHz = [900e6, 915e6, 930e6]
    const text = designedNetworkS2p({
      boardName: 'Soil node', z0: 50, designFrequencyHz: 915e6, frequenciesHz,
      elements: [{ kind: 'line', z0: 50, deg: 90 }],
    })
    const back = parseTouchstone(text, 'net.s2p')
    // A matched 90° line at its reference frequency: S21 = −j (common practice).
    expect(back.s[1]![1]![0]!.re).toBeCloseTo(0, 12)
    expect(back.s[1]![1]![0]!.im).toBeCloseTo(-1, 12)
    expect(Math.hypot(back.s[1]![0]![0]!.re, back.s[1]![0]![0]!.im)).toBeLessThan(1e-12)
    expect(text).toMatch(/port 1: source end, port 2: load end/)
  })
})
