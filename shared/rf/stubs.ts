/**
 * Single-stub matching: where to place a stub on a line from the load and how long to make it.
 */
import ComplexJs from 'complex.js'
import type { Complex, Element, Placement } from './types'
import { asComplex } from './complex'
import { RfInputError, describe, requireFinite, requirePositive } from './errors'
import { requireFrequency } from './elements'

/** A single-stub match: `d` line length from the load, `l` stub length, both in wavelengths in [0, 0.5). */
export type StubSolution = { readonly d: number; readonly l: number }

/** Arguments of `solveStub`. The stub is shunt and of the line's Z0 unless told otherwise. */
export type SolveStubInput = {
  /** The line's characteristic impedance and the match target (Ω). */
  readonly z0: number
  readonly frequency: number
  readonly load: Complex | number
  readonly end: 'open' | 'short'
  readonly placement?: Placement
  readonly stubZ0?: number
}

const TWO_PI = 2 * Math.PI

function wrapHalf(x: number): number {
  const w = x - 0.5 * Math.floor(x / 0.5)
  return w >= 0.5 - 1e-15 ? 0 : w // 0.5 wavelength is the same place as 0
}

/**
 * Every single-stub match of `load` on a line of `z0`, sorted by d.
 *
 * Method: with u = zL/Z0 for a series stub or u = yL·Z0 for a shunt one (the point moves the
 * same way in either plane), the line gives u(θ) = (u cos θ + j sin θ)/(cos θ + j u sin θ),
 * θ = βd. Asking Re u(θ) = 1 gives the quadratic form (g − 1) cos²θ + 2b cosθ sinθ +
 * (g − g² − b²) sin²θ = 0 for u = g + jb, solved in the angle 2θ, so d = λ/4 (tan βd infinite)
 * needs no special case. The stub then cancels the leftover x = Im u(θ), with k = x·Zs/Z0
 * (shunt) or x·Z0/Zs (series): shunt open and series short need tan βl = −k, shunt short and
 * series open cot βl = k (common practice; checked against the reference cases).
 * No solution without a positive resistance; an already matched load gives d = 0 with no stub (open: l = 0; short: l = λ/4).
 */
export function solveStub(input: SolveStubInput): StubSolution[] {
  const z0 = requirePositive(input?.z0, 'z0')
  requireFrequency(input.frequency, 'frequency')
  const load = asComplex(input.load, 'load', true)
  if (input.end !== 'open' && input.end !== 'short') {
    throw new RfInputError('end', `must be "open" or "short", got ${describe(input.end)}`)
  }
  const placement = input.placement ?? 'shunt'
  if (placement !== 'series' && placement !== 'shunt') {
    throw new RfInputError('placement', `must be "series" or "shunt", got ${describe(placement)}`)
  }
  const stubZ0 = input.stubZ0 === undefined ? z0 : requirePositive(input.stubZ0, 'stubZ0')
  if (!Number.isFinite(load.re) || !(load.re > 0)) return []
  const zn = new ComplexJs(load.re / z0, load.im / z0)
  const u = placement === 'shunt' ? zn.inverse() : zn
  const g = u.re
  const b = u.im
  // A c² + Bq cs + C s² = M + P cos 2θ + R sin 2θ.
  const A = g - 1
  const Bq = 2 * b
  const C = g - g * g - b * b
  const M = (A + C) / 2
  const P = (A - C) / 2
  const R = Bq / 2
  const rho = Math.hypot(P, R)
  let thetas: number[]
  if (rho <= 1e-14 * (Math.abs(M) + 1)) {
    thetas = [0] // u = 1: already matched, every d works; take d = 0
  } else {
    const phi = Math.atan2(R, P)
    const alpha = Math.acos(Math.max(-1, Math.min(1, -M / rho)))
    thetas = alpha < 1e-9 ? [phi / 2] : [(phi + alpha) / 2, (phi - alpha) / 2]
  }
  const solutions = thetas.map((theta) => {
    const c = Math.cos(theta)
    const s = Math.sin(theta)
    const j = new ComplexJs(0, 1)
    const at = u.mul(c).add(j.mul(s)).div(new ComplexJs(c, 0).add(j.mul(u).mul(s)))
    const k = at.im * (placement === 'shunt' ? stubZ0 / z0 : z0 / stubZ0)
    // shunt: stub admittance·Zs must be −j k; series: stub impedance/Zs must be −j k.
    //   open shunt j tan βl = −j k → tan βl = −k;  short shunt −j cot βl = −j k → cot βl = k
    //   open series −j cot βl = −j k → cot βl = k;  short series j tan βl = −j k → tan βl = −k
    const usesTan = (input.end === 'open') === (placement === 'shunt')
    const bl = usesTan ? Math.atan(-k) : Math.atan2(1, k)
    return { d: wrapHalf(theta / TWO_PI), l: wrapHalf(bl / TWO_PI) }
  })
  solutions.sort((x, y) => x.d - y.d)
  return solutions.filter((s, i) => i === 0 || Math.abs(s.d - solutions[i - 1]!.d) > 1e-12)
}

/** Options of `stubToElements`: the same line, frequency and stub as given to `solveStub`. */
export type StubLadderOptions = Omit<SolveStubInput, 'load'>

/**
 * A stub solution as element JSON in trace order: a line of d·360° (left out when d = 0) then the
 * stub of l·360° (left out when an open stub has l = 0), both with fRef = frequency.
 */
export function stubToElements(solution: StubSolution, options: StubLadderOptions): Element[] {
  const z0 = requirePositive(options.z0, 'z0')
  const fRef = requireFrequency(options.frequency, 'frequency')
  const d = requireFinite(solution.d, 'solution.d')
  const l = requireFinite(solution.l, 'solution.l')
  if (d < 0 || l < 0) throw new RfInputError('solution', 'lengths must not be negative')
  const out: Element[] = []
  if (d > 0) out.push({ kind: 'line', z0, deg: d * 360, fRef })
  if (l > 0 || options.end === 'short') {
    out.push({ kind: 'stub', end: options.end, placement: options.placement ?? 'shunt', z0: options.stubZ0 ?? z0, deg: l * 360, fRef })
  }
  return out
}
