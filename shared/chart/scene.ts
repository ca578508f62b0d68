/**
 * The chart's drawable content as plain data: first in the Γ plane (from the board's results),
 * then on screen for one view. The layers only draw what these functions return.
 */
import type { Complex, Element } from '../rf/types'
import { gammaOf } from '../rf/gamma'
import { dragLocus, isDraggable } from '../rf/drag'
import { hueFor } from '../board/palette'
import { constantQCircle, mismatchRing, type GammaCircle, type GammaLocus } from './circles'
import { arcInsideDisk, arcToScreen, type GammaArc, type ScreenArc } from './clip'
import { gammaPolyline, polylineToScreen, segmentPath, type GammaPolyline } from './tracePath'
import { gammaToScreen, type ScreenPoint, type ViewTransform } from './viewport'

export type SceneElement = Element & { readonly id: string; readonly locked?: boolean }

export interface TraceSceneInput {
  /** The ladder as drawn (a drag draft applied), load to source. */
  readonly elements: readonly SceneElement[]
  /** Impedances (Ω) after 0…n elements at the design frequency; [0] is the load. */
  readonly trace: readonly Complex[]
  /** Source-end impedance (Ω) at each band frequency, band start first. */
  readonly band: readonly Complex[]
  /** Where the trace should end (Ω). */
  readonly goal: Complex
  /** A solver preview to draw dashed: its ladder and its trace (Ω), or null. */
  readonly preview: { readonly elements: readonly Element[]; readonly trace: readonly Complex[] } | null
  /** Constant-Q arcs to draw, or null. */
  readonly qArc: number | null
  /** Frequency markers on the band ribbon: the index of their band point and their label. */
  readonly marks?: readonly { readonly index: number; readonly label: string }[]
  readonly z0: number
  readonly frequencyHz: number
}

export interface GammaSegment {
  readonly id: string
  readonly hue: string
  readonly points: GammaPolyline
}

export interface GammaHandle {
  readonly id: string
  readonly hue: string
  readonly gamma: Complex
}

export interface TraceScene {
  readonly segments: readonly GammaSegment[]
  readonly preview: readonly GammaPolyline[]
  readonly band: GammaPolyline
  readonly marks: readonly { readonly gamma: Complex; readonly label: string }[]
  readonly load: Complex
  readonly end: Complex
  readonly goal: Complex
  readonly ring: GammaCircle | null
  readonly qArcs: readonly GammaArc[]
  readonly handles: readonly GammaHandle[]
}

function segmentsOf(elements: readonly Element[], trace: readonly Complex[], z0: number, f: number): GammaPolyline[] {
  const out: GammaPolyline[] = []
  for (let i = 0; i < elements.length && i + 1 < trace.length; i++) {
    out.push(segmentPath(elements[i]!, trace[i]!, trace[i + 1]!, z0, f))
  }
  return out
}

/** Everything the trace and interaction layers draw, in the Γ plane against z0. */
export function buildTraceScene(input: TraceSceneInput): TraceScene {
  const { elements, trace, z0, frequencyHz } = input
  const paths = segmentsOf(elements, trace, z0, frequencyHz)
  const gammas = trace.map(z => gammaOf(z, z0))
  const end = gammas[gammas.length - 1] ?? { re: 0, im: 0 }
  const goal = gammaOf(input.goal, z0)
  const qArcs: GammaArc[] = []
  if (input.qArc !== null && input.qArc > 0) {
    for (const sign of [1, -1] as const) {
      const arc = arcInsideDisk(constantQCircle(input.qArc, sign))
      if (arc) qArcs.push(arc)
    }
  }
  const band = gammaPolyline(input.band, z0)
  const handles: GammaHandle[] = []
  elements.forEach((e, i) => {
    // No handle where a drag cannot move the point (e.g. a line matched to its own Zc).
    if (!isDraggable(e) || e.locked || !gammas[i + 1] || !dragLocus(e, trace[i]!, z0, frequencyHz)) return
    handles.push({ id: e.id, hue: hueFor(e), gamma: gammas[i + 1]! })
  })
  return {
    segments: paths.map((points, i) => ({ id: elements[i]!.id, hue: hueFor(elements[i]!), points })),
    preview: input.preview ? segmentsOf(input.preview.elements, input.preview.trace, z0, frequencyHz) : [],
    band,
    marks: (input.marks ?? []).flatMap(m => (m.index >= 0 && 2 * m.index + 1 < band.length
      ? [{ gamma: { re: band[2 * m.index]!, im: band[2 * m.index + 1]! }, label: m.label }]
      : [])),
    load: gammas[0] ?? { re: 0, im: 0 },
    end,
    goal,
    ring: mismatchRing(goal, end),
    qArcs,
    handles,
  }
}

export interface ScreenSegment {
  readonly id: string
  readonly hue: string
  readonly points: number[]
}

export interface ScreenHandle extends ScreenPoint {
  readonly id: string
  readonly hue: string
}

export interface ScreenTraceScene {
  readonly segments: readonly ScreenSegment[]
  readonly preview: readonly number[][]
  readonly band: number[]
  readonly marks: readonly (ScreenPoint & { readonly label: string })[]
  readonly load: ScreenPoint
  readonly end: ScreenPoint
  readonly goal: ScreenPoint
  readonly ring: ScreenArc | null
  readonly qArcs: readonly ScreenArc[]
  readonly handles: readonly ScreenHandle[]
}

/** The scene on screen for one view. */
export function sceneToScreen(scene: TraceScene, view: ViewTransform): ScreenTraceScene {
  return {
    segments: scene.segments.map(s => ({ id: s.id, hue: s.hue, points: polylineToScreen(s.points, view) })),
    preview: scene.preview.map(p => polylineToScreen(p, view)),
    band: polylineToScreen(scene.band, view),
    marks: scene.marks.map(m => ({ ...gammaToScreen(m.gamma, view), label: m.label })),
    load: gammaToScreen(scene.load, view),
    end: gammaToScreen(scene.end, view),
    goal: gammaToScreen(scene.goal, view),
    ring: scene.ring ? arcToScreen({ circle: scene.ring, start: 0, end: 2 * Math.PI }, view) : null,
    qArcs: scene.qArcs.map(a => arcToScreen(a, view)),
    handles: scene.handles.map(h => ({ id: h.id, hue: h.hue, ...gammaToScreen(h.gamma, view) })),
  }
}

/**
 * The part of a drag locus inside the chart's rim, on screen: a circle's inner arc, or a line's
 * chord (the line p + t·d meets |Γ| = 1 where t² + 2t(p·d) + |p|² − 1 = 0).
 */
export function locusToScreen(locus: GammaLocus, view: ViewTransform): { arc: ScreenArc | null; points: number[] | null } {
  if (locus.kind === 'circle') {
    const arc = arcInsideDisk(locus)
    return { arc: arc ? arcToScreen(arc, view) : null, points: null }
  }
  const pd = locus.px * locus.dx + locus.py * locus.dy
  const disc = pd * pd - (locus.px * locus.px + locus.py * locus.py - 1)
  if (disc <= 0) return { arc: null, points: null }
  const t0 = -pd - Math.sqrt(disc)
  const t1 = -pd + Math.sqrt(disc)
  const ends = [t0, t1].flatMap(t => [locus.px + t * locus.dx, locus.py + t * locus.dy])
  return { arc: null, points: polylineToScreen(ends, view) }
}
