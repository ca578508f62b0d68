import { describe, expect, it } from 'vitest'
import { partRows, partsCsv } from '../../../shared/board/parts'
import type { BoardElement } from '../../../shared/board/schema'

const ladder: BoardElement[] = [
  { id: 'a', kind: 'L', placement: 'series', value: 9.74e-9, q: 45 },
  { id: 'b', kind: 'C', placement: 'shunt', value: 4.64e-12, tolerance: 0.05 },
  { id: 'c', kind: 'line', z0: 50, deg: 14, fRef: 2.44e9 },
]

describe('partRows', () => {
  it('gives the nearest standard value for lumped parts and none for lines', () => {
    const rows = partRows(ladder, 'E12')
    // E12 decade (IEC 60063): … 8.2, 10 … and … 3.9, 4.7 …
    expect(rows[0]!.standardValue).toBeCloseTo(10e-9, 20)
    expect(rows[1]!.standardValue).toBeCloseTo(4.7e-12, 22)
    expect(rows[2]!.standardValue).toBeNull()
    expect(rows[0]!.snapError).toBeCloseTo((10 - 9.74) / 9.74, 9)
    expect(rows.map(r => r.position)).toEqual([1, 2, 3])
    expect(rows[0]!.q).toBe(45)
    expect(rows[1]!.tolerance).toBe(0.05)
    expect(rows[2]!.detail).toContain('50')
  })
})

describe('partsCsv', () => {
  it('writes a header and one row per part, quoting where needed', () => {
    const csv = partsCsv(partRows(ladder, 'E24'), 'E24')
    const lines = csv.trim().split('\n')
    expect(lines).toHaveLength(4)
    expect(lines[0]).toBe('position,element,exact,exact_si,nearest_E24,nearest_E24_si,q,tolerance,detail')
    expect(lines[1]!.startsWith('1,series L,9.74 nH,')).toBe(true)
    expect(lines[3]!.startsWith('3,line,14°,14,—,,')).toBe(true)
  })
})
