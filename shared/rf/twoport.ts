/**
 * Two-ports: S-parameters ↔ chain (ABCD) matrices at a real reference impedance, a measured
 * two-port block cascaded inside a ladder, and the whole ladder as a two-port's S-parameters.
 *
 * Port convention (the whole file): port 1 faces the SOURCE, port 2 faces the LOAD, so a ladder
 * read from the load outwards is the chain product M = E[n−1]·…·E[1]·E[0] and the impedance seen
 * at port 1 with Z_L on port 2 is Z_in = (A·Z_L + B)/(C·Z_L + D). A measured .s2p placed in the
 * ladder therefore has its port 1 towards the source.
 *
 * Conversions (the standard chain-matrix relations for equal real port references Z0, common
 * practice — recalled from memory, checked here by the round trip and by
 * lumped parts in the tests):
 *   A = ((1+S11)(1−S22) + S12·S21)/(2·S21)       B = Z0·((1+S11)(1+S22) − S12·S21)/(2·S21)
 *   C = ((1−S11)(1−S22) − S12·S21)/(2·S21·Z0)    D = ((1−S11)(1+S22) + S12·S21)/(2·S21)
 * and back, with Δ = A + B/Z0 + C·Z0 + D:
 *   S11 = (A + B/Z0 − C·Z0 − D)/Δ   S12 = 2(AD − BC)/Δ   S21 = 2/Δ   S22 = (−A + B/Z0 − C·Z0 + D)/Δ
 */
import type { BlockElement, Complex, Element } from './types'
import { RfInputError, requirePositive } from './errors'
import { isInfinite } from './complex'
import { electricalDegrees, elementAdmittance, elementImpedance, validateElements, requireFrequency } from './elements'
import { applyElementToPoints, rescale, type PointBuffer } from './points'
import { interpolateMatrices, rangeOf, type InterpolationMode } from './interpolate'
import { isMeasuredPart, measuredPartImpedances } from './fixture'
import { hasModel, padPiAbcd, padSusceptance, type ModelledPart } from './models'

/** A chain matrix [[a, b], [c, d]]: (V1, I1) = M·(V2, I2), I2 flowing out of port 2. b in Ω, c in S. */
export type Abcd = { readonly a: Complex; readonly b: Complex; readonly c: Complex; readonly d: Complex }

/** Measured two-port data as parseTouchstone gives it: `s[k][i][j]` at frequencies[k] (Hz), referenced to z0 (Ω). */
export type TwoPortData = {
  readonly z0: number
  readonly frequencies: readonly number[]
  readonly s: readonly (readonly (readonly Complex[])[])[]
}

/** Measured blocks by upload id, resolved by the caller (the board's `{ kind: 'block', uploadId }` elements). */
export type BlockLookup = Readonly<Record<string, TwoPortData>>

/**
 * What a block does at a frequency outside its measured range: 'strict' (default) throws an
 * `RfInputError` naming the element and the range; 'nearest' uses the nearest measured point —
 * only for a single-frequency view that tells the user so.
 */
export type BlockRange = 'strict' | 'nearest'

// ---- small complex helpers on plain values (not hot) ----
const c = (re: number, im = 0): Complex => ({ re, im })
const add = (x: Complex, y: Complex): Complex => c(x.re + y.re, x.im + y.im)
const sub = (x: Complex, y: Complex): Complex => c(x.re - y.re, x.im - y.im)
const mul = (x: Complex, y: Complex): Complex => c(x.re * y.re - x.im * y.im, x.re * y.im + x.im * y.re)
const scale = (x: Complex, k: number): Complex => c(x.re * k, x.im * k)
function div(x: Complex, y: Complex): Complex {
  const d = y.re * y.re + y.im * y.im
  return c((x.re * y.re + x.im * y.im) / d, (x.im * y.re - x.re * y.im) / d)
}
const ONE = c(1)
const ZERO = c(0)

/** S (2×2, `s[i][j]`) at real reference z0 (Ω) → chain matrix. Throws when S21 = 0 (the block passes nothing). */
export function sToAbcd(s: readonly (readonly Complex[])[], z0: number): Abcd {
  requirePositive(z0, 'z0')
  const s11 = s[0]![0]!, s12 = s[0]![1]!, s21 = s[1]![0]!, s22 = s[1]![1]!
  if (s21.re === 0 && s21.im === 0) throw new RfInputError('s', 'S21 is zero: a two-port that passes nothing has no chain matrix')
  const p = mul(s12, s21)
  const twoS21 = scale(s21, 2)
  const onePlus11 = add(ONE, s11), oneMinus11 = sub(ONE, s11)
  const onePlus22 = add(ONE, s22), oneMinus22 = sub(ONE, s22)
  return {
    a: div(add(mul(onePlus11, oneMinus22), p), twoS21),
    b: scale(div(sub(mul(onePlus11, onePlus22), p), twoS21), z0),
    c: scale(div(sub(mul(oneMinus11, oneMinus22), p), twoS21), 1 / z0),
    d: div(add(mul(oneMinus11, onePlus22), p), twoS21),
  }
}

/** Chain matrix → S (`s[i][j]`, 2×2) at real reference z0 (Ω). */
export function abcdToS(m: Abcd, z0: number): Complex[][] {
  requirePositive(z0, 'z0')
  const bn = scale(m.b, 1 / z0)
  const cn = scale(m.c, z0)
  const delta = add(add(m.a, bn), add(cn, m.d))
  if (delta.re === 0 && delta.im === 0) throw new RfInputError('abcd', 'A + B/Z0 + C·Z0 + D is zero: no S-parameters')
  const det = sub(mul(m.a, m.d), mul(m.b, m.c))
  return [
    [div(sub(add(m.a, bn), add(cn, m.d)), delta), div(scale(det, 2), delta)],
    [div(c(2), delta), div(add(sub(bn, m.a), sub(m.d, cn)), delta)],
  ]
}

/** The chain product x·y (x on the source side of y). */
export function cascade(x: Abcd, y: Abcd): Abcd {
  return {
    a: add(mul(x.a, y.a), mul(x.b, y.c)),
    b: add(mul(x.a, y.b), mul(x.b, y.d)),
    c: add(mul(x.c, y.a), mul(x.d, y.c)),
    d: add(mul(x.c, y.b), mul(x.d, y.d)),
  }
}

const IDENTITY: Abcd = { a: ONE, b: ZERO, c: ZERO, d: ONE }

function dataOf(element: BlockElement, blocks: BlockLookup | undefined, path: string): TwoPortData {
  const data = blocks?.[element.uploadId]
  if (!data) throw new RfInputError(path, `measured block "${element.name ?? element.uploadId}" has no data (upload ${element.uploadId} not given)`)
  if (data.s[0]?.length !== 2) throw new RfInputError(path, `measured block "${element.name ?? element.uploadId}" must be a two-port (.s2p)`)
  return data
}

/**
 * The chain matrices of a measured block at each frequency: S interpolated linearly in re/im onto
 * the frequencies (interpolate.ts), then `sToAbcd` at the file's reference. Frequencies outside the
 * file's range throw (or, with 'nearest', take the nearest measured point).
 */
export function blockAbcd(
  element: BlockElement, blocks: BlockLookup | undefined, frequenciesHz: ArrayLike<number>,
  options: { path?: string; range?: BlockRange; mode?: InterpolationMode } = {},
): Abcd[] {
  const path = options.path ?? 'element'
  const data = dataOf(element, blocks, path)
  const range = rangeOf(data.frequencies)
  const targets = Array.from(frequenciesHz, f =>
    options.range === 'nearest' ? Math.min(range.fMaxHz, Math.max(range.fMinHz, f)) : f)
  const { values, outsideHz } = interpolateMatrices(data.frequencies, data.s, targets, options.mode)
  if (outsideHz.length > 0) {
    throw new RfInputError(path, `measured block "${element.name ?? element.uploadId}" covers ${range.fMinHz}–${range.fMaxHz} Hz; ${outsideHz.length} frequencies are outside it (first ${outsideHz[0]} Hz), and measured data is never extrapolated`)
  }
  return values.map(s => sToAbcd(s!, data.z0))
}

/** True for elements whose data comes from a measured file: a block, or a fixture-measured L or C part. */
export function hasMeasuredData(element: Element): boolean {
  return element.kind === 'block' || isMeasuredPart(element)
}

/**
 * The chain matrices of an element with measured data (see `hasMeasuredData`) at each frequency:
 * a block from its S (`blockAbcd`); a fixture-measured part as a series [[1, Z], [0, 1]] or shunt
 * [[1, 0], [1/Z, 1]] part with Z from its file (fixture.ts). Throws outside the file's range
 * (unless `range: 'nearest'`) and where the part blocks the signal.
 */
export function measuredAbcd(
  element: Element, blocks: BlockLookup | undefined, frequenciesHz: ArrayLike<number>,
  options: { path?: string; range?: BlockRange } = {},
): Abcd[] {
  if (element.kind === 'block') return blockAbcd(element, blocks, frequenciesHz, options)
  if (!isMeasuredPart(element)) throw new RfInputError(options.path ?? 'element', 'has no measured data')
  const isSeries = element.placement === 'series'
  return measuredPartImpedances(element, blocks, frequenciesHz, options).map((z, k) => {
    if (isSeries) {
      if (isInfinite(z)) throw new RfInputError(options.path ?? 'element', `the measured part is an open at ${frequenciesHz[k]} Hz and blocks the path`)
      return { a: ONE, b: z, c: ZERO, d: ONE }
    }
    if (z.re === 0 && z.im === 0) throw new RfInputError(options.path ?? 'element', `the measured part is a short at ${frequenciesHz[k]} Hz and blocks the path`)
    return { a: ONE, b: ZERO, c: isInfinite(z) ? ZERO : div(ONE, z), d: ONE }
  })
}

/** Applies chain matrices to homogeneous impedance points (points.ts): (a, b) → (A·a + B·b, C·a + D·b). */
export function applyAbcdToPoints(p: PointBuffer, matrices: readonly Abcd[]): void {
  const { n, aRe, aIm, bRe, bIm } = p
  for (let i = 0; i < n; i++) {
    const m = matrices[i]!
    const ar = aRe[i]!, ai = aIm[i]!, br = bRe[i]!, bi = bIm[i]!
    aRe[i] = m.a.re * ar - m.a.im * ai + m.b.re * br - m.b.im * bi
    aIm[i] = m.a.re * ai + m.a.im * ar + m.b.re * bi + m.b.im * br
    bRe[i] = m.c.re * ar - m.c.im * ai + m.d.re * br - m.d.im * bi
    bIm[i] = m.c.re * ai + m.c.im * ar + m.d.re * bi + m.d.im * br
  }
  rescale(p)
}

/**
 * One ladder step for trace and sweep: a measured block through its chain matrices, any other
 * element through the kernel of points.ts.
 */
export function applyLadderElement(
  p: PointBuffer, element: Element, frequenciesHz: ArrayLike<number>,
  blocks: BlockLookup | undefined, path: string, range: BlockRange = 'strict',
): void {
  if (hasMeasuredData(element)) applyAbcdToPoints(p, measuredAbcd(element, blocks, frequenciesHz, { path, range }))
  else applyElementToPoints(p, element, frequenciesHz)
}

/**
 * The chain matrix of one element at `frequencyHz`. Series part Z: [[1, Z], [0, 1]]; shunt part
 * Y: [[1, 0], [Y, 1]]; line of Zc and t = deg·f/fRef: [[cos t, j Zc sin t], [j sin t/Zc, cos t]];
 * n:1 transformer (n on the source side, V1 = n·V2, I1 = I2/n): [[n, 0], [0, 1/n]]; a block from
 * its measured S. A series open or a shunt short has no chain matrix and throws.
 */
export function elementAbcd(element: Element, frequencyHz: number, blocks?: BlockLookup, path = 'element'): Abcd {
  switch (element.kind) {
    case 'line': {
      const t = (electricalDegrees(element, frequencyHz) * Math.PI) / 180
      const cs = Math.cos(t), sn = Math.sin(t)
      return { a: c(cs), b: c(0, element.z0 * sn), c: c(0, sn / element.z0), d: c(cs) }
    }
    case 'xfmr':
      return { a: c(element.ratio), b: ZERO, c: ZERO, d: c(1 / element.ratio) }
    case 'block':
      return blockAbcd(element, blocks, [frequencyHz], { path })[0]!
    default: {
      if (isMeasuredPart(element)) return measuredAbcd(element, blocks, [frequencyHz], { path })[0]!
      if (element.placement === 'series') {
        // A modelled part's own Z (its pads left out), then its pads to ground at both ends.
        const z = elementImpedance(element, frequencyHz)
        if (isInfinite(z)) throw new RfInputError(path, 'a series open blocks the path: the ladder has no chain matrix here')
        if (hasModel(element) && element.model.padC) {
          const m = new Float64Array(8)
          padPiAbcd(z.re, z.im, padSusceptance(element, frequencyHz), m)
          return { a: c(m[0]!, m[1]!), b: c(m[2]!, m[3]!), c: c(m[4]!, m[5]!), d: c(m[6]!, m[7]!) }
        }
        return { a: ONE, b: z, c: ZERO, d: ONE }
      }
      // A shunt part's pad is in parallel with it: elementAdmittance would drop it, the kernel keeps it.
      const y = hasModel(element) ? shuntAdmittanceWithPad(element, frequencyHz) : elementAdmittance(element, frequencyHz)
      if (isInfinite(y)) throw new RfInputError(path, 'a shunt short blocks the path: the ladder has no chain matrix here')
      return { a: ONE, b: ZERO, c: y, d: ONE }
    }
  }
}

/** A shunt modelled part's admittance with its pad: the part on an open, through the kernel. */
function shuntAdmittanceWithPad(part: ModelledPart, frequencyHz: number): Complex {
  const y = elementAdmittance(part, frequencyHz)
  return isInfinite(y) ? y : c(y.re, y.im + padSusceptance(part, frequencyHz))
}

/** Arguments of `ladderSParameters`. */
export type LadderTwoPortInput = {
  /** Reference impedance of both ports (Ω). */
  readonly z0: number
  readonly frequencies: ArrayLike<number>
  /** From the load outwards; lines and stubs need fRef. */
  readonly elements: readonly Element[]
  readonly blocks?: BlockLookup
}

/**
 * The ladder alone as a two-port: `s[k][i][j]` at frequencies[k], port 1 at the source end, port 2
 * at the load end, both referenced to z0 — ready for writeTouchstone. With the load on port 2,
 * the impedance at port 1 is the same as `sweep` gives: Γ_in = S11 + S12·S21·Γ_L/(1 − S22·Γ_L).
 */
export function ladderSParameters(input: LadderTwoPortInput): Complex[][][] {
  const z0 = requirePositive(input?.z0, 'z0')
  const elements = validateElements(input.elements, 'elements', { requireFRef: true })
  const out: Complex[][][] = []
  for (let k = 0; k < input.frequencies.length; k++) {
    const f = requireFrequency(input.frequencies[k], `frequencies[${k}]`)
    let m = IDENTITY
    elements.forEach((e, i) => { m = cascade(elementAbcd(e, f, input.blocks, `elements[${i}]`), m) })
    out.push(abcdToS(m, z0))
  }
  return out
}
