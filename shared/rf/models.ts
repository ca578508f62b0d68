/**
 * Component models of real L and C parts: loss that follows frequency, self-resonance, series
 * inductance and pad capacitance (the `model` field of an L or C element, types.ts `PartModel`).
 * This file holds the model's data side (validation, Q by frequency, resonance); the maps
 * themselves are in the point kernel (points.ts `applyModelled`), like every other element's.
 *
 * The part's own impedance at ω = 2πf, written as a ratio Z = num/den so that a resonance (den = 0,
 * an open) or a part of zero value stays ordinary arithmetic on the kernel's homogeneous points:
 * - inductor L with Q(f) and self-resonance srf (Cp = 1/((2π·srf)²·L) across L and its ESR):
 *   Zs = ωL(1/Q + j), Z = Zs/(1 + jωCp·Zs) = ωL(1/Q + j)/(1 − r² + j·r²/Q), r = f/srf
 *   (ωCp·ωL = r², so Cp never has to be formed and Z stays linear in L);
 * - capacitor C with Q(f) and series inductance ESL: Z = 1/(ωC·Q) + j(ωESL − 1/(ωC)), i.e.
 *   num = 1/Q + j(ω²·C·ESL − 1), den = ωC;
 * - pads: a shunt susceptance ωCpad to ground at both ends of a series part (a pi of pad, part,
 *   pad), or in parallel with a shunt part (its live end; the other end is ground).
 * Loss is a series ESR: ωL/Q(f) for an inductor, 1/(ωC·Q(f)) for a capacitor. Q(f) comes from the
 * model's table, interpolated linearly in log f and log Q and held at the end values outside it;
 * without a table the element's own `q` applies (none: lossless).
 * Source: the series-RLC and parallel-resonance relations of any circuit text (common practice).
 */
import type { LumpedElement, PartModel } from './types'
import { RfInputError, describe, requireNonNegative, requirePositive } from './errors'

/** An L or C element that carries a model. */
export type ModelledPart = LumpedElement & { readonly kind: 'L' | 'C'; readonly model: PartModel }

/** True when the element is an L or C with a model (anything else goes through the ideal kernel). */
export function hasModel(element: { kind: string; model?: unknown }): element is ModelledPart {
  return element.model !== undefined && (element.kind === 'L' || element.kind === 'C')
}

/**
 * Checks a `model` field (see `PartModel`) for a part of `kind`; throws `RfInputError` naming the
 * field (`elements[2].model.q[1][0]`): a Q table of [Hz, Q] pairs with frequencies rising, srf on
 * an inductor only, esl on a capacitor only, each number finite and in range.
 */
export function validatePartModel(model: unknown, kind: string, path: string): PartModel {
  if (kind !== 'L' && kind !== 'C') throw new RfInputError(path, `only an L or C part can carry a model, not ${describe(kind)}`)
  if (model === null || typeof model !== 'object' || Array.isArray(model)) {
    throw new RfInputError(path, `must be a model object, got ${describe(model)}`)
  }
  const m = model as Record<string, unknown>
  for (const key of Object.keys(m)) {
    if (!['q', 'srf', 'esl', 'padC'].includes(key)) throw new RfInputError(`${path}.${key}`, 'is not a model field (q, srf, esl, padC)')
  }
  if (m.q !== undefined) {
    if (!Array.isArray(m.q) || m.q.length === 0) throw new RfInputError(`${path}.q`, `must be a non-empty array of [Hz, Q] pairs, got ${describe(m.q)}`)
    let previous = 0
    m.q.forEach((row: unknown, i: number) => {
      if (!Array.isArray(row) || row.length !== 2) throw new RfInputError(`${path}.q[${i}]`, `must be a [Hz, Q] pair, got ${describe(row)}`)
      const hz = requirePositive(row[0], `${path}.q[${i}][0]`)
      requirePositive(row[1], `${path}.q[${i}][1]`)
      if (!(hz > previous)) throw new RfInputError(`${path}.q[${i}][0]`, `frequencies must rise through the table, got ${hz} after ${previous}`)
      previous = hz
    })
  }
  if (m.srf !== undefined) {
    if (kind !== 'L') throw new RfInputError(`${path}.srf`, 'is an inductor\'s self-resonance; a capacitor takes esl')
    requirePositive(m.srf, `${path}.srf`)
  }
  if (m.esl !== undefined) {
    if (kind !== 'C') throw new RfInputError(`${path}.esl`, 'is a capacitor\'s series inductance; an inductor takes srf')
    requireNonNegative(m.esl, `${path}.esl`)
  }
  if (m.padC !== undefined) requireNonNegative(m.padC, `${path}.padC`)
  return model as PartModel
}

/**
 * Q of the part at `frequencyHz`: the model's table (log-log interpolation, held at the ends), else
 * the element's own `q`; `undefined` for a lossless part.
 */
export function partQAt(element: Pick<LumpedElement, 'q' | 'model'>, frequencyHz: number): number | undefined {
  const table = element.model?.q
  if (!table || table.length === 0) return element.q
  const out = new Float64Array(1)
  fillInverseQ(element, Float64Array.of(frequencyHz), out)
  return 1 / out[0]!
}

/**
 * The part's self-resonance (Hz), or null: an inductor's `srf`; a capacitor's series resonance
 * with its ESL, 1/(2π·√(ESL·C)). Above it an inductor looks capacitive and a capacitor inductive.
 */
export function selfResonanceHz(element: { kind: string; value?: number; model?: PartModel }): number | null {
  const m = element.model
  if (!m) return null
  if (element.kind === 'L' && m.srf !== undefined) return m.srf
  if (element.kind === 'C' && m.esl !== undefined && m.esl > 0 && element.value !== undefined && element.value > 0) {
    return 1 / (2 * Math.PI * Math.sqrt(m.esl * element.value))
  }
  return null
}

/** True when the part is used at or above its self-resonance at `frequencyHz`. */
export function isAboveSelfResonance(element: { kind: string; value?: number; model?: PartModel }, frequencyHz: number): boolean {
  const srf = selfResonanceHz(element)
  return srf !== null && frequencyHz >= srf
}

// Log-log segments of Q tables, by table (tables are immutable element JSON).
type QSegments = { lf: Float64Array; lq: Float64Array; slope: Float64Array; first: number; last: number }
const segmentCache = new WeakMap<object, QSegments>()

function segmentsOf(table: readonly (readonly [number, number])[]): QSegments {
  let s = segmentCache.get(table)
  if (s) return s
  const n = table.length
  const lf = new Float64Array(n)
  const lq = new Float64Array(n)
  const slope = new Float64Array(n)
  for (let k = 0; k < n; k++) { lf[k] = Math.log(table[k]![0]); lq[k] = Math.log(table[k]![1]) }
  for (let k = 0; k + 1 < n; k++) slope[k] = (lq[k + 1]! - lq[k]!) / (lf[k + 1]! - lf[k]!)
  s = { lf, lq, slope, first: 1 / table[0]![1], last: 1 / table[n - 1]![1] }
  segmentCache.set(table, s)
  return s
}

/** 1/Q(f) at each frequency into `out` (0 for a lossless part). */
function fillInverseQ(element: Pick<LumpedElement, 'q' | 'model'>, frequenciesHz: Float64Array, out: Float64Array): void {
  const table = element.model?.q
  const n = frequenciesHz.length
  if (!table || table.length === 0) {
    out.fill(element.q === undefined ? 0 : 1 / element.q, 0, n)
    return
  }
  const s = segmentsOf(table)
  const fLow = table[0]![0]
  const fHigh = table[table.length - 1]![0]
  const lf = s.lf
  const logLow = lf[0]!
  const logHigh = lf[lf.length - 1]!
  let k = 0
  for (let i = 0; i < n; i++) {
    const f = frequenciesHz[i]!
    if (f <= fLow) { out[i] = s.first; continue }
    if (f >= fHigh) { out[i] = s.last; continue }
    const x = Math.log(f)
    // A band rises, so the segment found last time is the place to start looking.
    if (x < lf[k]!) k = 0
    while (k + 1 < lf.length - 1 && x >= lf[k + 1]!) k++
    // log Q = lq_k + slope_k·(log f − lf_k), clamped to the table's log range against rounding.
    out[i] = Math.exp(-(s.lq[k]! + s.slope[k]! * (Math.min(logHigh, Math.max(logLow, x)) - lf[k]!)))
  }
}

// 1/Q(f) of a Q table on the last band it was evaluated on, by table: a board sweeps the same band
// frame after frame (drag, Monte Carlo), and the log and exp per point cost more than the rest of
// the model. A different band (checked point by point) recomputes it.
type InverseQEntry = { frequencies: Float64Array; invQ: Float64Array }
const inverseQCache = new WeakMap<object, InverseQEntry>()

function sameValues(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false
  return true
}

let constantScratch = new Float64Array(0)

/**
 * 1/Q(f) of a part at each frequency (0 for a lossless part): a table's values are cached per
 * table and band, a constant Q fills a scratch array; valid until the next call, do not modify.
 */
export function inverseQOf(element: Pick<LumpedElement, 'q' | 'model'>, frequenciesHz: Float64Array): Float64Array {
  const table = element.model?.q
  if (!table || table.length === 0) {
    if (constantScratch.length !== frequenciesHz.length) constantScratch = new Float64Array(frequenciesHz.length)
    return constantScratch.fill(element.q === undefined ? 0 : 1 / element.q)
  }
  const hit = inverseQCache.get(table)
  if (hit && sameValues(hit.frequencies, frequenciesHz)) return hit.invQ
  const invQ = new Float64Array(frequenciesHz.length)
  fillInverseQ(element, frequenciesHz, invQ)
  inverseQCache.set(table, { frequencies: Float64Array.from(frequenciesHz), invQ })
  return invQ
}

/** Pad susceptance ωCpad (S) of a modelled part at `frequencyHz` (0 without pads). */
export function padSusceptance(part: { model?: PartModel }, frequencyHz: number): number {
  return 2 * Math.PI * frequencyHz * (part.model?.padC ?? 0)
}

/**
 * The chain matrix of a series part Z between two pads of susceptance B to ground:
 * P·S·P = [[1 + u, Z], [jB·(2 + u), 1 + u]], u = jB·Z, with P = [[1, 0], [jB, 1]] and
 * S = [[1, Z], [0, 1]]. Written into `out` as [aRe, aIm, bRe, bIm, cRe, cIm, dRe, dIm].
 */
export function padPiAbcd(zRe: number, zIm: number, b: number, out: Float64Array | number[]): void {
  const ur = -b * zIm, ui = b * zRe
  out[0] = 1 + ur; out[1] = ui
  out[2] = zRe; out[3] = zIm
  out[4] = -b * ui; out[5] = b * (2 + ur)
  out[6] = 1 + ur; out[7] = ui
}
