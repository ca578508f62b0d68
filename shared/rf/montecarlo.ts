/**
 * Monte Carlo tolerance analysis: N trials of the ladder with every lumped part drawn within its
 * tolerance, each swept across the band with the shared point kernel (points.ts), scored by its
 * worst in-band return loss against the band spec.
 *
 * Draws (per trial, per L/C/R part that has a spread, in ladder order, from one seeded stream):
 * - half-width h = max(tolerance·value, toleranceAbs) (toleranceAbs in SI units, e.g. 0.1e-12 F
 *   for a ±0.1 pF capacitor; a part with neither does not vary);
 * - 'uniform' (default): value + h·(2u − 1), u uniform in [0, 1) — every value in the window
 *   equally likely, the cautious reading of a tolerance band;
 * - 'gaussian': value + h·g/3 with g standard normal (Box–Muller) redrawn until |g| ≤ 3, so
 *   3σ = the tolerance and no part falls outside its window;
 * - a draw below zero is clipped to 0 (a part cannot have a negative value).
 * Lines, stubs and transformers, and Q, are not varied.
 *
 * Reproducible: the same input and seed give identical arrays to the last bit (seedrandom's
 * ARC4 stream; the trials run in order, so splitting a run into steps changes nothing).
 *
 * Speed: all buffers are allocated when the run is created; a trial copies the load into the
 * point buffer, applies each element (a reused mutable copy whose `value` is rewritten), and
 * scans |Γ|² — no object is allocated per trial.
 */
import seedrandom from 'seedrandom'
import type { Complex, Element } from './types'
import { asComplex, divideInto } from './complex'
import { RfInputError, describe, requireFinite, requirePositive } from './errors'
import { requireFrequency, validateElements } from './elements'
import { applyElementToPoints, createPoints, setPoint, type PointBuffer } from './points'
import { isUniformGrid } from './angles'
import type { Reference } from './gamma'
import { applyAbcdToPoints, hasMeasuredData, measuredAbcd, type Abcd, type BlockLookup } from './twoport'

export type ToleranceDistribution = 'uniform' | 'gaussian'

/** An element as the analysis reads it: lumped parts may carry `toleranceAbs` (SI units). */
export type TolerancedElement = Element & { readonly toleranceAbs?: number }

/** The band spec: return loss of at least `minReturnLossDb` at every band point from f1 to f2. */
export type BandSpec = { readonly minReturnLossDb: number; readonly f1Hz: number; readonly f2Hz: number }

export type MonteCarloInput = {
  /** Band frequencies (Hz); those inside [f1Hz, f2Hz] of the spec are the ones scored. */
  readonly frequencies: ArrayLike<number>
  /** Load impedance (Ω): one, or one per band frequency. */
  readonly load: Complex | readonly Complex[]
  /** What Γ is taken against per band frequency: a real Z0, or a source impedance (power wave). */
  readonly reference: Reference | readonly Reference[]
  /** The design frequency, its load and reference: where the cloud of end points is taken. */
  readonly design: { readonly frequencyHz: number; readonly load: Complex; readonly reference: Reference }
  /** From the load towards the source, Q already applied; lines and stubs must carry fRef. */
  readonly elements: readonly TolerancedElement[]
  readonly spec: BandSpec
  readonly trials: number
  readonly seed: string
  readonly distribution?: ToleranceDistribution
  /** How many trials' end points to keep for the cloud (default 500). */
  readonly cloudSize?: number
  /** Measured two-port data for `block` elements, by upload id (not varied). */
  readonly blocks?: BlockLookup
}

export type MonteCarloResult = {
  /** Trials run (less than asked only when a stepped run was stopped early). */
  readonly trials: number
  readonly passes: number
  /** passes / trials (0 for no trials). */
  readonly yield: number
  /** Worst in-band return loss (dB) of each trial, in trial order. */
  readonly worstReturnLossDb: Float64Array
  /** The ladder with nominal values: its worst in-band return loss (dB). */
  readonly nominalWorstReturnLossDb: number
  /** End impedances (Ω) at the design frequency of the first trials (an open is re = Infinity). */
  readonly cloudRe: Float64Array
  readonly cloudIm: Float64Array
}

/** A run that can be advanced in steps (for a worker that reports progress and can be cancelled). */
export type MonteCarloRun = {
  readonly total: number
  readonly completed: number
  /** Runs up to `count` more trials; returns the number completed so far. */
  step(count: number): number
  /** The result over the trials completed so far (arrays trimmed to that length). */
  result(): MonteCarloResult
}

type Variation = { element: { value: number }; nominal: number; halfWidth: number }

function perPoint<T>(value: T | readonly T[], n: number, argument: string): T[] {
  if (Array.isArray(value)) {
    if (value.length !== n) throw new RfInputError(argument, `has ${value.length} entries for ${n} frequencies`)
    return value as T[]
  }
  return Array.from({ length: n }, () => value as T)
}

function referenceParts(ref: Reference, argument: string): [number, number] {
  if (typeof ref === 'number') return [requirePositive(ref, argument), 0]
  const z = asComplex(ref, argument)
  if (!(z.re > 0)) throw new RfInputError(argument, `a complex reference needs a real part above zero, got ${z.re}`)
  return [z.re, z.im]
}

/** The spread of a lumped part: max(tolerance·value, toleranceAbs); 0 when it has neither. */
export function toleranceHalfWidth(element: TolerancedElement): number {
  if (element.kind !== 'L' && element.kind !== 'C' && element.kind !== 'R') return 0
  const relative = element.tolerance === undefined ? 0 : element.tolerance * element.value
  const absolute = element.toleranceAbs === undefined ? 0 : requireFinite(element.toleranceAbs, 'toleranceAbs')
  return Math.max(relative, absolute, 0)
}

/** Creates a stepped run (nothing is computed until `step`). Throws `RfInputError` for bad input. */
export function createMonteCarlo(input: MonteCarloInput): MonteCarloRun {
  const f = input?.frequencies
  if (!(Array.isArray(f) || f instanceof Float64Array) || f.length === 0) {
    throw new RfInputError('frequencies', `must be a non-empty array of Hz, got ${describe(f)}`)
  }
  const total = input.trials
  if (!Number.isInteger(total) || total < 0 || total > 10_000_000) {
    throw new RfInputError('trials', `must be a whole number from 0 to 10,000,000, got ${describe(total)}`)
  }
  if (typeof input.seed !== 'string') throw new RfInputError('seed', 'must be a string')
  const distribution = input.distribution ?? 'uniform'
  if (distribution !== 'uniform' && distribution !== 'gaussian') {
    throw new RfInputError('distribution', `must be "uniform" or "gaussian", got ${describe(distribution)}`)
  }
  const spec = input.spec
  const minRl = requireFinite(spec?.minReturnLossDb, 'spec.minReturnLossDb')
  requirePositive(spec.f1Hz, 'spec.f1Hz')
  requirePositive(spec.f2Hz, 'spec.f2Hz')
  const elements = validateElements(input.elements, 'elements', { requireFRef: true }) as TolerancedElement[]
  const loads = perPoint(input.load, f.length, 'load')
  const refs = perPoint(input.reference, f.length, 'reference')
  const inSpec: number[] = []
  for (let k = 0; k < f.length; k++) {
    requirePositive(f[k], `frequencies[${k}]`)
    if (f[k]! >= spec.f1Hz && f[k]! <= spec.f2Hz) inSpec.push(k)
  }
  if (inSpec.length === 0) throw new RfInputError('spec', 'no band frequency falls between f1Hz and f2Hz')
  const designHz = requireFrequency(input.design?.frequencyHz, 'design.frequencyHz')

  // The in-spec band frequencies are scored; the design frequency (the cloud) is a buffer of its own,
  // so an evenly spaced band stays evenly spaced for the kernel.
  const m = inSpec.length
  const freqs = new Float64Array(m)
  const start = createPoints(m)
  const refRe = new Float64Array(m)
  const refIm = new Float64Array(m)
  inSpec.forEach((k, j) => {
    freqs[j] = f[k]!
    setPoint(start, j, asComplex(loads[k], `load[${k}]`, true))
    ;[refRe[j], refIm[j]] = referenceParts(refs[k]!, Array.isArray(input.reference) ? `reference[${k}]` : 'reference')
  })
  const designFreqs = Float64Array.of(designHz)
  const designStart = createPoints(1)
  setPoint(designStart, 0, asComplex(input.design.load, 'design.load', true))
  referenceParts(input.design.reference, 'design.reference')
  const uniformGrid = isUniformGrid(freqs)

  const p = createPoints(m)
  const q = createPoints(1)
  // Reused mutable copies: only `value` changes from trial to trial.
  const trialElements = elements.map(e => ({ ...e })) as Element[]
  // Measured blocks do not vary: their chain matrices are taken once, at the run's frequencies.
  const blockMatrices: (Abcd[] | null)[] = elements.map((e, i) =>
    hasMeasuredData(e) ? measuredAbcd(e, input.blocks, freqs, { path: `elements[${i}]` }) : null)
  const designBlockMatrices: (Abcd[] | null)[] = elements.map((e, i) =>
    hasMeasuredData(e) ? measuredAbcd(e, input.blocks, designFreqs, { path: `elements[${i}]`, range: 'nearest' }) : null)
  const variations: Variation[] = []
  trialElements.forEach((e, i) => {
    const h = toleranceHalfWidth(elements[i]!)
    // A measured part is its file: it does not vary.
    if (h > 0 && (e.kind === 'L' || e.kind === 'C' || e.kind === 'R') && !hasMeasuredData(e)) {
      variations.push({ element: e as unknown as { value: number }, nominal: e.value, halfWidth: h })
    }
  })
  const cloudSize = Math.min(total, Math.max(0, Math.floor(input.cloudSize ?? 500)))
  const worst = new Float64Array(total)
  const cloudRe = new Float64Array(cloudSize)
  const cloudIm = new Float64Array(cloudSize)
  const quotient = new Float64Array(2)
  const maxGamma2 = 10 ** (-minRl / 10) // RL ≥ min ⇔ |Γ|² ≤ 10^(−min/10)
  const random = seedrandom(input.seed)
  let completed = 0
  let passes = 0

  function gaussian(): number {
    for (;;) {
      // Box–Muller; 1 − u keeps the logarithm's argument in (0, 1].
      const g = Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random())
      if (g >= -3 && g <= 3) return g
    }
  }

  const last = trialElements.length - 1
  /** Runs the ladder with the current values over `buffer` (reset to `from` first). */
  function applyLadder(buffer: PointBuffer, from: PointBuffer, at: Float64Array, blocks: (Abcd[] | null)[], uniform: boolean): void {
    buffer.aRe.set(from.aRe); buffer.aIm.set(from.aIm); buffer.bRe.set(from.bRe); buffer.bIm.set(from.bIm)
    for (let e = 0; e <= last; e++) {
      const matrices = blocks[e]
      if (matrices) applyAbcdToPoints(buffer, matrices)
      // Rescaling every fourth element (and after the last) is enough, as in sweep.
      else applyElementToPoints(buffer, trialElements[e]!, at, { uniformGrid: uniform, rescale: e % 4 === 3 || e === last })
    }
  }

  /** Sweeps the current values; returns the worst |Γ|² over the in-spec points. */
  function sweepOnce(): number {
    applyLadder(p, start, freqs, blockMatrices, uniformGrid)
    const { aRe, aIm, bRe, bIm } = p
    let worstG2 = 0
    for (let j = 0; j < m; j++) {
      // Γ = (z − zs*)/(z + zs) with z = a/b: (a − zs*·b)/(a + zs·b) — gammaOf on the flat point.
      const ar = aRe[j]!, ai = aIm[j]!, br = bRe[j]!, bi = bIm[j]!, sr = refRe[j]!, si = refIm[j]!
      const nr = ar - (sr * br + si * bi)
      const ni = ai - (sr * bi - si * br)
      const dr = ar + (sr * br - si * bi)
      const di = ai + (sr * bi + si * br)
      const g2 = (nr * nr + ni * ni) / (dr * dr + di * di)
      if (!(g2 <= worstG2)) worstG2 = g2 // also takes NaN/Infinity as worst
    }
    return worstG2
  }

  function returnLossOf(g2: number): number {
    if (Number.isNaN(g2)) return -Infinity
    return g2 > 0 ? -10 * Math.log10(g2) : Infinity
  }

  const nominalWorstReturnLossDb = returnLossOf(sweepOnce())

  function step(count: number): number {
    const end = Math.min(total, completed + Math.max(0, Math.floor(count)))
    const nv = variations.length
    for (let t = completed; t < end; t++) {
      for (let v = 0; v < nv; v++) {
        const d = variations[v]!
        const x = distribution === 'uniform' ? 2 * random() - 1 : gaussian() / 3
        const value = d.nominal + d.halfWidth * x
        d.element.value = value > 0 ? value : 0
      }
      const g2 = sweepOnce()
      worst[t] = returnLossOf(g2)
      if (g2 <= maxGamma2) passes++
      if (t < cloudSize) {
        applyLadder(q, designStart, designFreqs, designBlockMatrices, false)
        divideInto(q.aRe[0]!, q.aIm[0]!, q.bRe[0]!, q.bIm[0]!, quotient)
        cloudRe[t] = quotient[0]!
        cloudIm[t] = quotient[1]!
      }
    }
    completed = end
    return completed
  }

  return {
    total,
    get completed() { return completed },
    step,
    result(): MonteCarloResult {
      const shown = Math.min(completed, cloudSize)
      return {
        trials: completed,
        passes,
        yield: completed === 0 ? 0 : passes / completed,
        worstReturnLossDb: worst.slice(0, completed),
        nominalWorstReturnLossDb,
        cloudRe: cloudRe.slice(0, shown),
        cloudIm: cloudIm.slice(0, shown),
      }
    },
  }
}

/** Runs every trial at once (see `createMonteCarlo`). */
export function runMonteCarlo(input: MonteCarloInput): MonteCarloResult {
  const run = createMonteCarlo(input)
  run.step(run.total)
  return run.result()
}

/** A histogram: `counts[i]` values fell in [edges[i], edges[i + 1]); the last bin includes its top. */
export type Histogram = { readonly edges: number[]; readonly counts: number[] }

/**
 * Bins `values` (dB) into bins of `binWidth` aligned to whole multiples of it, from the lowest to
 * the highest finite value; values above the highest finite one (an exact match, +Infinity) go
 * in the top bin. An empty input gives no bins.
 */
export function histogramOf(values: ArrayLike<number>, binWidth = 0.5): Histogram {
  requirePositive(binWidth, 'binWidth')
  let lo = Infinity
  let hi = -Infinity
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!
    if (Number.isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v }
  }
  if (lo === Infinity) return { edges: [], counts: [] }
  const first = Math.floor(lo / binWidth)
  const bins = Math.max(1, Math.floor(hi / binWidth) - first + 1)
  const edges = Array.from({ length: bins + 1 }, (_, i) => (first + i) * binWidth)
  const counts = new Array<number>(bins).fill(0)
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!
    if (Number.isNaN(v)) continue
    const b = v === Infinity ? bins - 1 : v === -Infinity ? 0 : Math.min(bins - 1, Math.floor(v / binWidth) - first)
    counts[b]!++
  }
  return { edges, counts }
}
