// Trace paths follow their element's circle; the scene has handles only where a drag is allowed;
// the pointer helpers pick the nearest handle and read the chart out.
import { describe, expect, it } from 'vitest'
import type { Complex, Element } from '../../../shared/rf/types'
import { gammaOf } from '../../../shared/rf/gamma'
import { trace } from '../../../shared/rf/ladder'
import { dragLocus, distanceFromLocus } from '../../../shared/rf/drag'
import { segmentPath } from '../../../shared/chart/tracePath'
import { buildTraceScene, locusToScreen, sceneToScreen, type SceneElement } from '../../../shared/chart/scene'
import { OUTSIDE_CHART_TEXT, cursorReadout, handleAt, pointIndexAt } from '../../../shared/chart/pointer'
import { fitView } from '../../../shared/chart/viewport'

const Z0 = 50
const F = 915e6

function pairs(points: number[]): Complex[] {
  const out: Complex[] = []
  for (let i = 0; i < points.length; i += 2) out.push({ re: points[i]!, im: points[i + 1]! })
  return out
}

const LADDER: SceneElement[] = [
  { id: 'a', kind: 'L', placement: 'series', value: 10e-9 },
  { id: 'b', kind: 'C', placement: 'shunt', value: 3.9e-12 },
  { id: 'c', kind: 'line', z0: 70, deg: 40 },
  { id: 'd', kind: 'stub', end: 'short', placement: 'shunt', z0: 50, deg: 120 },
  { id: 'e', kind: 'xfmr', ratio: 1.3 },
  { id: 'f', kind: 'R', placement: 'series', value: 4, locked: true },
  { id: 'g', kind: 'L', placement: 'series', value: 5e-9, q: 30 },
]
const LOAD = { re: 18, im: -32 }

describe('segmentPath', () => {
  const zs = trace({ z0: Z0, frequency: F, load: LOAD, elements: LADDER })

  it('runs from the point before to the point after, along the element circle, in small steps', () => {
    LADDER.forEach((element, i) => {
      const points = pairs(segmentPath(element, zs[i]!, zs[i + 1]!, Z0, F))
      const first = points[0]!
      const last = points[points.length - 1]!
      const a = gammaOf(zs[i]!, Z0)
      const b = gammaOf(zs[i + 1]!, Z0)
      expect(Math.hypot(first.re - a.re, first.im - a.im)).toBeLessThan(1e-12)
      expect(Math.hypot(last.re - b.re, last.im - b.im)).toBeLessThan(1e-12)
      for (let k = 1; k < points.length; k++) {
        expect(Math.hypot(points[k]!.re - points[k - 1]!.re, points[k]!.im - points[k - 1]!.im)).toBeLessThan(0.0125)
      }
      const locus = element.kind === 'xfmr' ? null : dragLocus(element as Element, zs[i]!, Z0, F)
      if (locus) for (const p of points) expect(distanceFromLocus(locus, p.re, p.im)).toBeLessThan(1e-9)
    })
  })

  it('is an arc, not a chord: a series L from 25 Ω bulges off the straight line', () => {
    const zPrev = { re: 25, im: 0 }
    const zNext = { re: 25, im: 200 }
    const points = pairs(segmentPath({ kind: 'L', placement: 'series', value: 1 }, zPrev, zNext, Z0, F))
    const mid = points[Math.floor(points.length / 2)]!
    const a = points[0]!
    const b = points[points.length - 1]!
    const chordDistance = Math.abs((b.re - a.re) * (a.im - mid.im) - (a.re - mid.re) * (b.im - a.im)) / Math.hypot(b.re - a.re, b.im - a.im)
    expect(chordDistance).toBeGreaterThan(0.05)
  })
})

describe('buildTraceScene', () => {
  const zs = trace({ z0: Z0, frequency: F, load: LOAD, elements: LADDER })
  const scene = buildTraceScene({
    elements: LADDER, trace: zs, band: [zs[zs.length - 1]!, { re: 40, im: 5 }], goal: { re: 50, im: 0 },
    preview: null, qArc: 2, z0: Z0, frequencyHz: F,
  })

  it('has one segment per element and handles for all but the transformer and the locked part', () => {
    expect(scene.segments.map(s => s.id)).toEqual(['a', 'b', 'c', 'd', 'e', 'f', 'g'])
    expect(scene.handles.map(h => h.id)).toEqual(['a', 'b', 'c', 'd', 'g'])
    const b = scene.handles.find(h => h.id === 'b')!
    const expected = gammaOf(zs[2]!, Z0)
    expect(Math.hypot(b.gamma.re - expected.re, b.gamma.im - expected.im)).toBeLessThan(1e-12)
  })

  it('has no handle where a drag cannot move the point (a line matched to its own Zc)', () => {
    const ladder: SceneElement[] = [{ id: 'm', kind: 'line', z0: 50, deg: 30 }, { id: 'n', kind: 'C', placement: 'shunt', value: 1e-12 }]
    const matched = trace({ z0: Z0, frequency: F, load: { re: 50, im: 0 }, elements: ladder })
    const s = buildTraceScene({ elements: ladder, trace: matched, band: [], goal: { re: 50, im: 0 }, preview: null, qArc: null, z0: Z0, frequencyHz: F })
    expect(s.handles.map(h => h.id)).toEqual(['n'])
  })

  it('puts the goal, the ring through the end point and two Q arcs in the scene', () => {
    expect(Math.hypot(scene.goal.re, scene.goal.im)).toBeLessThan(1e-12)
    expect(scene.ring!.radius).toBeCloseTo(Math.hypot(scene.end.re, scene.end.im), 12)
    expect(scene.qArcs.length).toBe(2)
  })

  it('puts markers on their band points', () => {
    const band = [{ re: 50, im: 0 }, { re: 25, im: 0 }, { re: 100, im: 0 }]
    const marked = buildTraceScene({
      elements: [], trace: [LOAD], band, goal: { re: 50, im: 0 }, preview: null, qArc: null, z0: Z0, frequencyHz: F,
      marks: [{ index: 2, label: 'f3' }, { index: 7, label: 'gone' }],
    })
    expect(marked.marks.map(m => m.label)).toEqual(['f3'])
    expect(marked.marks[0]!.gamma.re).toBeCloseTo(1 / 3, 12)
  })

  it('projects onto the screen with the view', () => {
    const view = fitView(600, 400)
    const screen = sceneToScreen(scene, view)
    expect(screen.goal).toEqual({ x: 300, y: 200 })
    expect(screen.segments[0]!.points.length).toBe(scene.segments[0]!.points.length)
    const line = locusToScreen({ kind: 'line', px: 0, py: 0, dx: 1, dy: 0 }, view)
    expect(line.points).toEqual([300 - view.scalePx, 200, 300 + view.scalePx, 200])
  })
})

describe('pointer helpers', () => {
  it('picks the nearest handle within reach', () => {
    const handles = [{ id: 'a', x: 100, y: 100 }, { id: 'b', x: 108, y: 100 }]
    expect(handleAt(handles, 105, 100)).toBe('b')
    expect(handleAt(handles, 101, 101)).toBe('a')
    expect(handleAt(handles, 150, 150)).toBeNull()
  })

  it('finds the nearest point of a polyline within reach', () => {
    const points = [0, 0, 10, 0, 20, 0]
    expect(pointIndexAt(points, 12, 3)).toBe(1)
    expect(pointIndexAt(points, 19, -2)).toBe(2)
    expect(pointIndexAt(points, 50, 50)).toBe(-1)
  })

  it('reads the centre as Z0, a match', () => {
    const rows = Object.fromEntries(cursorReadout({ re: 0, im: 0 }, 50).map(r => [r.label, r.text]))
    expect(rows.Z).toBe('50 Ω + j0 Ω')
    expect(rows.VSWR).toBe('1.00')
    expect(rows['Return loss']).toBe('∞ dB')
  })

  it('reads Γ = 0.5∠90° with VSWR 3 and 6.0 dB return loss (common practice figures)', () => {
    const rows = Object.fromEntries(cursorReadout({ re: 0, im: 0.5 }, 50).map(r => [r.label, r.text]))
    expect(rows['Γ']).toBe('0.500 ∠ 90.0°')
    expect(rows.VSWR).toBe('3.00')
    expect(rows['Return loss']).toBe('6.0 dB')
  })

  it('gives a note and no figures outside the rim (|Γ| > 1 would mean negative R)', () => {
    for (const gamma of [{ re: 1.2, im: 0.3 }, { re: -0.8, im: -0.7 }, { re: 0, im: 1.0001 }]) {
      const rows = cursorReadout(gamma, 50)
      expect(rows).toEqual([{ label: 'Pointer', text: OUTSIDE_CHART_TEXT }])
      expect(rows.map(r => r.text).join(' ')).not.toMatch(/\d/)
    }
  })

  it('still reads the rim itself (|Γ| = 1, a pure reactance)', () => {
    const rows = Object.fromEntries(cursorReadout({ re: 0, im: 1 }, 50).map(r => [r.label, r.text]))
    expect(rows['Γ']).toBe('1.000 ∠ 90.0°')
    expect(rows.VSWR).toBe('∞')
  })
})
