import { describe, expect, it } from 'vitest'
import { RfInputError } from '../../../shared/rf/index'
import { designedNetworkSpice } from '../../../shared/board/exports'

describe('designedNetworkSpice: the board export as a SPICE subcircuit', () => {
  const elements = [
    { kind: 'L' as const, placement: 'series' as const, value: 10e-9, q: 45 },
    { kind: 'C' as const, placement: 'shunt' as const, value: 3.9e-12 },
  ]

  it('heads the file with the board name, the design frequency the ESRs hold at, and the port order', () => {
    const text = designedNetworkSpice({ boardName: 'Sensor node 915', designFrequencyHz: 915e6, elements })
    const head = text.split('\n').filter(l => l.startsWith('*')).join('\n')
    expect(head).toContain('"Sensor node 915"')
    expect(head).toContain('915 MHz')
    expect(head).toMatch(/ESRs hold at this frequency only/)
    expect(head).toMatch(/src \(source side\), ld \(load side\)/)
    expect(text).toMatch(/^\.subckt Sensor_node_915 src ld$/m)
    // ESR of the Q 45 inductor at 915 MHz: ωL/Q = 2π·915e6·10e-9/45.
    const esr = Number(text.match(/^RQ1 \S+ ld (\S+)$/m)![1])
    expect(Math.abs(esr - (2 * Math.PI * 915e6 * 10e-9) / 45)).toBeLessThan(1e-12)
  })

  it('refuses a ladder with a measured block, naming the element', () => {
    expect(() => designedNetworkSpice({ boardName: 'b', designFrequencyHz: 1e9, elements: [{ kind: 'block', uploadId: 'x' }] }))
      .toThrow(RfInputError)
  })
})
