/**
 * Chain (ABCD) matrices of ladder elements, taken from the shared point kernel (points.ts) rather
 * than written out again, and the voltage and current they carry.
 *
 * Why this works: the kernel moves a homogeneous point (a, b) through an element as a 2×2 matrix,
 * (a', b') = s·M·(a, b), where M is the element's ABCD matrix and s a non-zero scale the kernel
 * is free to pick (it multiplies a stub's map by its cos or sin, and a transformer's by n). With
 * (a, b) read as (V, I) at the load side, M gives (V, I) at the source side. Pushing the two unit
 * columns (1, 0) and (0, 1) through the kernel gives s·M. For a series or shunt part (L, C, R,
 * stub) M has D = 1, so s is the D entry. For a line (the kernel does not scale it) and a
 * transformer (scaled by n > 0), det M = AD − BC = 1 and s = √det(s·M) on the principal branch.
 *
 * A part that blocks the signal outright (an open in series, a short across, e.g. a shunt open
 * stub at exactly 90°) has a rank-one map (det 0): no finite ABCD matrix exists there. Such a
 * frequency is flagged in `blocked`.
 */
import type { Element } from './types'
import { applyElementToPoints, createPoints } from './points'
import { hasMeasuredData, measuredAbcd, type BlockLookup } from './twoport'
import { hasModel, padPiAbcd, padSusceptance, type ModelledPart } from './models'

/** ABCD matrices of one element at n frequencies, as flat arrays (A, B in Ω, C in S, D plain). */
export type FlatAbcd = {
  readonly n: number
  readonly aRe: Float64Array; readonly aIm: Float64Array
  readonly bRe: Float64Array; readonly bIm: Float64Array
  readonly cRe: Float64Array; readonly cIm: Float64Array
  readonly dRe: Float64Array; readonly dIm: Float64Array
  /** 1 where the element blocks the signal (no finite ABCD matrix); the matrix there is zero. */
  readonly blocked: Uint8Array
}

// A determinant this small against the entries' size is a blocking part, not rounding.
const DET_FLOOR = 1e-24

function emptyAbcd(n: number): FlatAbcd {
  return {
    n,
    aRe: new Float64Array(n), aIm: new Float64Array(n),
    bRe: new Float64Array(n), bIm: new Float64Array(n),
    cRe: new Float64Array(n), cIm: new Float64Array(n),
    dRe: new Float64Array(n), dIm: new Float64Array(n),
    blocked: new Uint8Array(n),
  }
}

/** A measured block's chain matrices (twoport.ts `blockAbcd`, interpolated from its S) as flat arrays. */
function measuredAbcdFlat(element: Element, frequenciesHz: ArrayLike<number>, blocks: BlockLookup | undefined, path: string): FlatAbcd {
  const out = emptyAbcd(frequenciesHz.length)
  measuredAbcd(element, blocks, frequenciesHz, { path }).forEach((m, k) => {
    out.aRe[k] = m.a.re; out.aIm[k] = m.a.im; out.bRe[k] = m.b.re; out.bIm[k] = m.b.im
    out.cRe[k] = m.c.re; out.cIm[k] = m.c.im; out.dRe[k] = m.d.re; out.dIm[k] = m.d.im
  })
  return out
}

/**
 * The ABCD matrix of a validated element at each of `frequenciesHz` (lines and stubs without fRef
 * taken at their stated length). A measured block takes its matrices from `blocks` (twoport.ts);
 * `path` names the element in errors.
 */
export function elementAbcdFlat(element: Element, frequenciesHz: ArrayLike<number>, blocks?: BlockLookup, path = 'element'): FlatAbcd {
  if (hasMeasuredData(element)) return measuredAbcdFlat(element, frequenciesHz, blocks, path)
  // A modelled series part's pads make it a pi (D ≠ 1): the part alone from the kernel, then the pads.
  if (hasModel(element) && element.placement === 'series' && element.model.padC) {
    return withPads(elementAbcdFlat({ ...element, model: { ...element.model, padC: 0 } }, frequenciesHz), element, frequenciesHz)
  }
  const n = frequenciesHz.length
  const col1 = createPoints(n) // starts as shorts (0, 1): the second column
  const col0 = createPoints(n)
  col0.aRe.fill(1)
  col0.bRe.fill(0) // opens (1, 0): the first column
  applyElementToPoints(col0, element, frequenciesHz)
  applyElementToPoints(col1, element, frequenciesHz)
  const out = emptyAbcd(n)
  const isTwoTerminal = element.kind !== 'line' && element.kind !== 'xfmr'
  for (let i = 0; i < n; i++) {
    const ar = col0.aRe[i]!, ai = col0.aIm[i]!, cr = col0.bRe[i]!, ci = col0.bIm[i]!
    const br = col1.aRe[i]!, bi = col1.aIm[i]!, dr = col1.bRe[i]!, di = col1.bIm[i]!
    // det = A·D − B·C
    const detRe = ar * dr - ai * di - (br * cr - bi * ci)
    const detIm = ar * di + ai * dr - (br * ci + bi * cr)
    const size = Math.max(Math.hypot(ar, ai) * Math.hypot(dr, di), Math.hypot(br, bi) * Math.hypot(cr, ci))
    const detAbs = Math.hypot(detRe, detIm)
    if (!(detAbs > DET_FLOOR * size) || !Number.isFinite(detAbs)) {
      out.blocked[i] = 1
      continue
    }
    let kRe: number
    let kIm: number
    if (isTwoTerminal) {
      // Series [[1, Z], [0, 1]] and shunt [[1, 0], [Y, 1]] both have D = 1, so D is the scale:
      // dividing by it keeps the sign right, which matters when V or I are differenced across a part.
      const dd = dr * dr + di * di
      kRe = dr / dd
      kIm = -di / dd
    } else {
      // Lines (scale 1) and transformers (scale n > 0): 1/√det on the principal branch.
      const rootAbs = Math.sqrt(detAbs)
      const half = Math.atan2(detIm, detRe) / 2
      kRe = Math.cos(half) / rootAbs
      kIm = -Math.sin(half) / rootAbs
    }
    out.aRe[i] = ar * kRe - ai * kIm; out.aIm[i] = ar * kIm + ai * kRe
    out.bRe[i] = br * kRe - bi * kIm; out.bIm[i] = br * kIm + bi * kRe
    out.cRe[i] = cr * kRe - ci * kIm; out.cIm[i] = cr * kIm + ci * kRe
    out.dRe[i] = dr * kRe - di * kIm; out.dIm[i] = dr * kIm + di * kRe
  }
  return out
}

/** A series part's matrices S (D = 1) turned into pad·S·pad (models.ts `padPiAbcd`). */
function withPads(m: FlatAbcd, part: ModelledPart, frequenciesHz: ArrayLike<number>): FlatAbcd {
  const out = new Float64Array(8)
  for (let i = 0; i < m.n; i++) {
    if (m.blocked[i]) continue
    padPiAbcd(m.bRe[i]!, m.bIm[i]!, padSusceptance(part, frequenciesHz[i]!), out)
    m.aRe[i] = out[0]!; m.aIm[i] = out[1]!; m.bRe[i] = out[2]!; m.bIm[i] = out[3]!
    m.cRe[i] = out[4]!; m.cIm[i] = out[5]!; m.dRe[i] = out[6]!; m.dIm[i] = out[7]!
  }
  return m
}

/** Voltages (V) and currents (A) as phasors at n frequencies, on flat arrays. */
export type FlatVI = {
  readonly vRe: Float64Array; readonly vIm: Float64Array
  readonly iRe: Float64Array; readonly iIm: Float64Array
}

/** A zeroed V, I buffer of n entries. */
export function createVI(n: number): FlatVI {
  return { vRe: new Float64Array(n), vIm: new Float64Array(n), iRe: new Float64Array(n), iIm: new Float64Array(n) }
}

/**
 * Moves (V, I) at the load side of an element to its source side, in place: V' = A·V + B·I,
 * I' = C·V + D·I. Blocked frequencies get V = I = 0.
 */
export function applyAbcd(vi: FlatVI, m: FlatAbcd): void {
  const { vRe, vIm, iRe, iIm } = vi
  for (let k = 0; k < m.n; k++) {
    const vr = vRe[k]!, vi_ = vIm[k]!, ir = iRe[k]!, ii = iIm[k]!
    const ar = m.aRe[k]!, ai = m.aIm[k]!, br = m.bRe[k]!, bi = m.bIm[k]!
    const cr = m.cRe[k]!, ci = m.cIm[k]!, dr = m.dRe[k]!, di = m.dIm[k]!
    vRe[k] = ar * vr - ai * vi_ + br * ir - bi * ii
    vIm[k] = ar * vi_ + ai * vr + br * ii + bi * ir
    iRe[k] = cr * vr - ci * vi_ + dr * ir - di * ii
    iIm[k] = cr * vi_ + ci * vr + dr * ii + di * ir
  }
}
