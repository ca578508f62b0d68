// Clipping to the rim, label anchors on their circles, and canvas arcs for a flipped y axis.
import { describe, expect, it } from 'vitest'
import { arcInsideDisk, arcToScreen, pointOnArc } from '../../../shared/chart/clip'
import { conductanceCircle, constantQCircle, reactanceCircle, resistanceCircle, susceptanceCircle } from '../../../shared/chart/circles'
import { admittanceGrid, impedanceGrid } from '../../../shared/chart/grid'
import { gridLabels, placeLabel } from '../../../shared/chart/labels'
import { fitView } from '../../../shared/chart/viewport'

describe('arcInsideDisk', () => {
  it('keeps a constant-r circle whole (it touches the rim at Γ = 1 only)', () => {
    const arc = arcInsideDisk(resistanceCircle(0.5))!
    expect(arc.end - arc.start).toBeCloseTo(2 * Math.PI, 12)
  })

  it('cuts a constant-x arc at the rim, from Γ = 1 to P(x), bulging inward', () => {
    for (const x of [0.2, 1, -2, 5]) {
      const arc = arcInsideDisk(reactanceCircle(x))!
      const a = pointOnArc(arc, arc.start)
      const b = pointOnArc(arc, arc.end)
      const mid = pointOnArc(arc, (arc.start + arc.end) / 2)
      expect(Math.hypot(a.re, a.im)).toBeCloseTo(1, 12)
      expect(Math.hypot(b.re, b.im)).toBeCloseTo(1, 12)
      expect(Math.hypot(mid.re, mid.im)).toBeLessThan(1)
      const ends = [a, b].map(p => p.re).sort((u, v) => u - v)
      expect(ends[1]).toBeCloseTo(1, 9)
      expect(ends[0]).toBeCloseTo((x * x - 1) / (x * x + 1), 9)
    }
  })

  it('gives the inductive constant-Q arc in the upper half from −1 to 1', () => {
    const arc = arcInsideDisk(constantQCircle(2, 1))!
    const ends = [pointOnArc(arc, arc.start), pointOnArc(arc, arc.end)].map(p => p.re).sort((u, v) => u - v)
    expect(ends[0]).toBeCloseTo(-1, 12)
    expect(ends[1]).toBeCloseTo(1, 12)
    expect(pointOnArc(arc, (arc.start + arc.end) / 2).im).toBeGreaterThan(0)
  })

  it('drops a circle entirely outside the rim', () => {
    expect(arcInsideDisk({ cx: 3, cy: 0, radius: 1 })).toBeNull()
    expect(arcInsideDisk({ cx: 0, cy: 0, radius: 2 })).toBeNull()
  })

  it('turns a Γ arc into a canvas arc with the angles mirrored (y down)', () => {
    const view = fitView(400, 400)
    const arc = { circle: { cx: 0, cy: 0, radius: 1 }, start: 0, end: Math.PI / 2 }
    const s = arcToScreen(arc, view)
    // The canvas arc from startAngle to endAngle (clockwise on screen) covers Γ angles 0..90°,
    // the upper right quarter: its middle is up and to the right of the centre.
    const mid = (s.startAngle + s.endAngle) / 2
    expect(s.x + s.radiusPx * Math.cos(mid)).toBeGreaterThan(s.x)
    expect(s.y + s.radiusPx * Math.sin(mid)).toBeLessThan(s.y)
  })
})

describe('grids and labels', () => {
  it('keeps every grid arc inside the rim', () => {
    for (const grid of [impedanceGrid(), admittanceGrid()]) {
      for (const arc of grid.arcs) {
        for (let k = 0; k <= 8; k++) {
          const p = pointOnArc(arc, arc.start + ((arc.end - arc.start) * k) / 8)
          expect(Math.hypot(p.re, p.im)).toBeLessThanOrEqual(1 + 1e-9)
        }
      }
    }
  })

  it('anchors each label on its own circle', () => {
    const circleFor = (text: string, family: 'impedance' | 'admittance', onAxis: boolean) => {
      const v = Number(text.replace('+j', '').replace('−j', ''))
      const sign = text.startsWith('−') ? -1 : 1
      if (family === 'impedance') return onAxis ? resistanceCircle(v) : reactanceCircle(sign * v)
      return onAxis ? conductanceCircle(v) : susceptanceCircle(sign * v)
    }
    for (const family of ['impedance', 'admittance'] as const) {
      const labels = gridLabels(family)
      expect(labels.length).toBe(15)
      for (const l of labels) {
        const c = circleFor(l.text, family, !l.text.includes('j'))
        expect(Math.abs(Math.hypot(l.at.re - c.cx, l.at.im - c.cy) - c.radius)).toBeLessThan(1e-12)
      }
    }
  })

  it('pushes rim labels outward (impedance) and inward (admittance)', () => {
    const view = fitView(500, 500)
    const outward = gridLabels('impedance').filter(l => l.text.includes('j')).map(l => placeLabel(l, view))
    const inward = gridLabels('admittance').filter(l => l.text.includes('j')).map(l => placeLabel(l, view))
    for (const l of outward) expect(Math.hypot(l.x - 250, l.y - 250)).toBeGreaterThan(view.scalePx)
    for (const l of inward) expect(Math.hypot(l.x - 250, l.y - 250)).toBeLessThan(view.scalePx)
  })
})
