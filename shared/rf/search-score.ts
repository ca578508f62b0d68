/**
 * Scoring for the match search: a ladder's worst |Γ| over the band, computed by the point kernel
 * (the same element maps as `sweep`, so a candidate's figure is what the band plot shows), and
 * the short list of the best ladders found so far.
 */
import type { LumpedElement } from './types'
import { applyElementToPoints, createPoints, type PointBuffer } from './points'
import type { PartRef } from './search-set'

/**
 * Worst |Γ| against a real z0 of ladders started from one load buffer. Γ = (z − z0)/(z + z0)
 * (as `gammaOf`) read on the kernel's homogeneous pair z = a/b as (a − z0·b)/(a + z0·b), which
 * needs no division per point and gives 1 for an open (b = 0).
 */
export class LadderScorer {
  private readonly scratch: PointBuffer
  scored = 0

  constructor(
    private readonly z0: number,
    private readonly frequencies: Float64Array,
    private readonly load: PointBuffer,
  ) {
    this.scratch = createPoints(load.n)
  }

  /** The worst (largest) |Γ| of `elements` (from the load out) over the band. */
  worstGamma(elements: readonly LumpedElement[]): number {
    this.scored++
    const p = this.scratch
    p.aRe.set(this.load.aRe); p.aIm.set(this.load.aIm); p.bRe.set(this.load.bRe); p.bIm.set(this.load.bIm)
    elements.forEach((e, i) => applyElementToPoints(p, e, this.frequencies, { rescale: i === elements.length - 1 }))
    return worstGammaOfPoints(p, this.z0)
  }
}

/** max over points of |a − z0·b| / |a + z0·b| (see `LadderScorer`). */
export function worstGammaOfPoints(p: PointBuffer, z0: number): number {
  let worst = 0
  for (let i = 0; i < p.n; i++) {
    const ar = p.aRe[i]!, ai = p.aIm[i]!, br = p.bRe[i]! * z0, bi = p.bIm[i]! * z0
    const nr = ar - br, ni = ai - bi, dr = ar + br, di = ai + bi
    const den = dr * dr + di * di
    const g2 = den === 0 ? Infinity : (nr * nr + ni * ni) / den
    if (!(g2 <= worst)) worst = g2
  }
  return Math.sqrt(worst)
}

/** One ladder of the short list: its parts and worst |Γ|. */
export type Ranked = { readonly gamma: number; readonly parts: readonly PartRef[] }

// Figures this close are a tie (then fewer parts win): far below any meaningful 0.001 dB.
const TIE = 1e-12

/** Best first: lower worst |Γ|, ties to fewer parts. */
export function compareRanked(a: Ranked, b: Ranked): number {
  return Math.abs(a.gamma - b.gamma) > TIE ? a.gamma - b.gamma : a.parts.length - b.parts.length
}

/** The `limit` best distinct ladders offered so far, best first. */
export class ShortList {
  readonly entries: Ranked[] = []
  private readonly keys = new Set<string>()

  constructor(private readonly limit: number) {}

  /** The worst |Γ| a ladder may have and still enter (1 until the list is full). */
  threshold(): number {
    return this.entries.length < this.limit ? 1 : this.entries[this.entries.length - 1]!.gamma
  }

  offer(gamma: number, parts: readonly PartRef[]): void {
    if (!(gamma <= 1)) return
    const entry = { gamma, parts }
    const isFull = this.entries.length >= this.limit
    if (isFull && compareRanked(entry, this.entries[this.entries.length - 1]!) >= 0) return
    const key = parts.map((p) => `${p.k}:${p.i}`).join(',')
    if (this.keys.has(key)) return
    let at = this.entries.length
    while (at > 0 && compareRanked(entry, this.entries[at - 1]!) < 0) at--
    this.entries.splice(at, 0, entry)
    this.keys.add(key)
    if (this.entries.length > this.limit) {
      const dropped = this.entries.pop()!
      this.keys.delete(dropped.parts.map((p) => `${p.k}:${p.i}`).join(','))
    }
  }
}
