/**
 * Closed-form matching networks: every lossless L network between two impedances, pi and T
 * networks for a chosen loaded Q, and the quarter-wave transformer. Single-stub matches are in
 * stubs.ts.
 *
 * Conventions: `from` is the start point (the load side), `to` the impedance wanted after the
 * network (for a conjugate match to a source Zs, pass to = Zs*). Returned ladders are element JSON
 * in trace order (from the `from` side out), with fRef-free lumped L and C values for `frequency`.
 * A part whose reactance or susceptance comes out zero is left out.
 */
import ComplexJs from 'complex.js'
import type { Complex, Element } from './types'
import { asComplex } from './complex'
import { RfInputError, requirePositive } from './errors'
import { requireFrequency } from './elements'

/** `shunt-series`: the part next to `from` is shunt; `series-shunt`: it is series. */
export type LTopology = 'shunt-series' | 'series-shunt'

/** One lossless reactive step: a series reactance X (Ω) or a shunt susceptance B (S). */
type Step = { readonly placement: 'series' | 'shunt'; readonly value: number }

// A discriminant within this fraction of its terms is the boundary case (one double root).
const BOUNDARY = 1e-12
// A reactance or susceptance below this fraction of the circuit's scale has vanished.
const VANISH = 1e-12

/**
 * The two-step solutions of one topology from `from` to `to` (both with positive real parts).
 * shunt-series: y1 = 1/from + jB must satisfy Re(1/y1) = Rt, so (B0 + B)² = G/Rt − G² with
 * G + jB0 = 1/from; then X = Xt − Im(1/y1). series-shunt is the dual in admittance:
 * (X0 + X)² = R/Gt − R² with R + jX0 = from and Gt + jBt = 1/to; then B = Bt − Im(1/z1).
 * Both closed forms follow from equating real parts on a constant-conductance / constant-resistance
 * circle (common practice; checked against the reference cases).
 */
function lSteps(from: ComplexJs, to: ComplexJs, topology: LTopology): Step[][] {
  const isShuntFirst = topology === 'shunt-series'
  // Work in the first step's own plane: admittance for a shunt part, impedance for a series one.
  const a = isShuntFirst ? from.inverse() : from // G + jB0  or  R + jX0
  const b = isShuntFirst ? to : to.inverse() //  Rt + jXt or  Gt + jBt
  if (!(a.re > 0) || !(b.re > 0) || !Number.isFinite(a.re) || !Number.isFinite(b.re)) return []
  const term = a.re / b.re
  let disc = term - a.re * a.re
  if (Math.abs(disc) <= BOUNDARY * term) disc = 0
  if (disc < 0) return []
  const roots = disc === 0 ? [0] : [Math.sqrt(disc), -Math.sqrt(disc)]
  const [first, second] = isShuntFirst ? (['shunt', 'series'] as const) : (['series', 'shunt'] as const)
  return roots.map((r) => {
    const mid = new ComplexJs(a.re, r).inverse() // the point after step one, in the other plane
    return [
      { placement: first, value: r - a.im },
      { placement: second, value: b.im - mid.im },
    ]
  })
}

/** Merges neighbouring steps of the same placement and drops vanished ones. */
function compact(steps: readonly Step[], scaleOhm: number): Step[] {
  const out: Step[] = []
  for (const s of steps) {
    const last = out[out.length - 1]
    if (last && last.placement === s.placement) out[out.length - 1] = { placement: s.placement, value: last.value + s.value }
    else out.push(s)
  }
  const kept = out.filter((s) => Math.abs(s.value) > VANISH * (s.placement === 'series' ? scaleOhm : 1 / scaleOhm))
  return kept.length === out.length ? kept : compact(kept, scaleOhm)
}

/**
 * The lumped part for a reactive step at `frequencyHz`: series X > 0 is L = X/ω, X < 0 is
 * C = −1/(ωX); shunt B > 0 is C = B/ω, B < 0 is L = −1/(ωB).
 */
export function reactiveElement(placement: 'series' | 'shunt', reactanceOrSusceptance: number, frequencyHz: number): Element {
  const w = 2 * Math.PI * requireFrequency(frequencyHz, 'frequencyHz')
  const v = reactanceOrSusceptance
  if (!Number.isFinite(v) || v === 0) throw new RfInputError('reactance', `must be finite and non-zero, got ${v}`)
  if (placement === 'series') return v > 0 ? { kind: 'L', placement, value: v / w } : { kind: 'C', placement, value: -1 / (w * v) }
  return v > 0 ? { kind: 'C', placement, value: v / w } : { kind: 'L', placement, value: -1 / (w * v) }
}

function toElements(steps: readonly Step[], frequencyHz: number, scaleOhm: number): Element[] {
  return compact(steps, scaleOhm).map((s) => reactiveElement(s.placement, s.value, frequencyHz))
}

function sameLadder(x: readonly Element[], y: readonly Element[]): boolean {
  return x.length === y.length && x.every((e, i) => {
    const f = y[i]!
    return e.kind === f.kind && 'value' in e && 'value' in f && e.placement === f.placement &&
      Math.abs(e.value - f.value) <= 1e-9 * Math.abs(f.value)
  })
}

function dedupe(ladders: Element[][]): Element[][] {
  return ladders.filter((l, i) => ladders.findIndex((m) => sameLadder(l, m)) === i)
}

function scaleOf(...zs: ComplexJs[]): number {
  return Math.max(...zs.map((z) => z.abs()), 1e-30)
}

/** Arguments of `solveL`; `z0` is validated and kept for the API's symmetry. */
export type SolveLInput = {
  readonly z0?: number
  readonly frequency: number
  readonly from: Complex | number
  readonly to: Complex | number
}

/**
 * Every lossless two-element L network (arrays of element JSON) whose trace from `from` ends at
 * `to`, both topologies: shunt-series solutions first, then series-shunt, each with the + root
 * first. A solution in which a part vanishes keeps only the other part (a match already in place
 * gives `[]` as its single solution); solutions that coincide are listed once. No solution (an
 * empty list) when either end has no positive resistance, or when neither topology can reach:
 * shunt-series needs Re(to) ≤ 1/Re(1/from), series-shunt needs Re(from) ≤ 1/Re(1/to).
 */
export function solveL(input: SolveLInput): Element[][] {
  if (input.z0 !== undefined) requirePositive(input.z0, 'z0')
  const f = requireFrequency(input.frequency, 'frequency')
  const from = asComplex(input.from, 'from')
  const to = asComplex(input.to, 'to')
  const a = new ComplexJs(from.re, from.im)
  const b = new ComplexJs(to.re, to.im)
  if (a.isZero() || b.isZero()) return []
  const scale = scaleOf(a, b)
  const all = (['shunt-series', 'series-shunt'] as const).flatMap((t) => lSteps(a, b, t).map((s) => toElements(s, f, scale)))
  return dedupe(all)
}

/** Arguments of `solvePi` and `solveT`: the loaded Q is the highest node Q in the network. */
export type SolveQNetworkInput = SolveLInput & { readonly q: number }

function parallelResistance(z: ComplexJs): number {
  return 1 / z.inverse().re
}

function qNetwork(input: SolveQNetworkInput, kind: 'pi' | 'T'): Element[][] {
  if (input.z0 !== undefined) requirePositive(input.z0, 'z0')
  const f = requireFrequency(input.frequency, 'frequency')
  const q = requirePositive(input.q, 'q')
  const from = asComplex(input.from, 'from')
  const to = asComplex(input.to, 'to')
  const a = new ComplexJs(from.re, from.im)
  const b = new ComplexJs(to.re, to.im)
  if (!(from.re > 0)) throw new RfInputError('from', 'needs a resistance above zero')
  if (!(to.re > 0)) throw new RfInputError('to', 'needs a resistance above zero')
  // pi: parallel-equivalent resistances; T: series resistances.
  const ra = kind === 'pi' ? parallelResistance(a) : a.re
  const rb = kind === 'pi' ? parallelResistance(b) : b.re
  const hi = Math.max(ra, rb)
  const lo = Math.min(ra, rb)
  const qMin = Math.sqrt(hi / lo - 1)
  if (q < qMin * (1 - 1e-12)) {
    throw new RfInputError('q', `must be at least ${qMin.toPrecision(6)} to reach from ${ra.toPrecision(6)} Ω to ${rb.toPrecision(6)} Ω`)
  }
  const rv = kind === 'pi' ? hi / (q * q + 1) : lo * (q * q + 1)
  const virtual = new ComplexJs(kind === 'pi' ? Math.min(rv, lo) : Math.max(rv, hi), 0)
  const [firstHalf, secondHalf] = kind === 'pi' ? (['shunt-series', 'series-shunt'] as const) : (['series-shunt', 'shunt-series'] as const)
  const scale = scaleOf(a, b, virtual)
  const ladders: Element[][] = []
  for (const s1 of lSteps(a, virtual, firstHalf)) {
    for (const s2 of lSteps(virtual, b, secondHalf)) ladders.push(toElements([...s1, ...s2], f, scale))
  }
  return dedupe(ladders)
}

/**
 * Pi networks (shunt, series, shunt) from `from` to `to` with loaded Q `q`, by the virtual
 * resistance method: two back-to-back L networks through a virtual resistance
 * Rv = Rhigh/(Q² + 1) below both ends, where Rhigh is the larger parallel-equivalent resistance
 * 1/Re(1/z) of the two terminals, so Q = √(Rhigh/Rv − 1) is the higher section's Q. Up to four
 * ladders (the sign choices of each half). Throws naming `q` when Q < √(Rhigh/Rlow − 1), the
 * single L network's Q. Common practice (e.g. RF amplifier output-network design).
 */
export function solvePi(input: SolveQNetworkInput): Element[][] {
  return qNetwork(input, 'pi')
}

/**
 * T networks (series, shunt, series) from `from` to `to` with loaded Q `q`: the dual of `solvePi`,
 * through a virtual resistance Rv = Rlow·(Q² + 1) above both ends, Rlow being the smaller series
 * resistance Re(z) of the two terminals, so Q = √(Rv/Rlow − 1). Throws naming `q` when
 * Q < √(Rhigh/Rlow − 1).
 */
export function solveT(input: SolveQNetworkInput): Element[][] {
  return qNetwork(input, 'T')
}

/**
 * The characteristic impedance (Ω) of a quarter-wave transformer from a resistive load to z0:
 * Zt = √(rLoad·z0), since a 90° line gives Zin = Zt²/rLoad.
 */
export function quarterWave(rLoad: number, z0: number): number {
  return Math.sqrt(requirePositive(rLoad, 'rLoad') * requirePositive(z0, 'z0'))
}
