// Equal-ripple (Chebyshev) low-pass prototype ladders and their low-pass / high-pass realisations
// for a load that is one of Fano's four R-C / R-L models (the first prototype element is the
// load's own reactive part). Prototype formulas: Pozar, Microwave Engineering, 4th ed., §8.3
// (recalled from memory; checked here through the Bode–Fano integral, which they must meet).
import type { Complex, Element, FanoModel } from '../../../shared/rf/index'

/** g1 … g(n+1) of an n-th order prototype with `rippleDb` of pass-band ripple (odd n: g(n+1) = 1). */
export function chebyshevG(n: number, rippleDb: number): number[] {
  const beta = Math.log(1 / Math.tanh(rippleDb / 17.37))
  const gamma = Math.sinh(beta / (2 * n))
  const a = (k: number) => Math.sin(((2 * k - 1) * Math.PI) / (2 * n))
  const b = (k: number) => gamma * gamma + Math.sin((k * Math.PI) / n) ** 2
  const g = [(2 * a(1)) / gamma]
  for (let k = 2; k <= n; k++) g.push((4 * a(k - 1) * a(k)) / (b(k - 1) * g[k - 2]!))
  g.push(n % 2 === 1 ? 1 : 1 / Math.tanh(beta / 4) ** 2)
  return g
}

/** The ripple (dB) at which an n-th order prototype has g1 = target (g1 grows with the ripple). */
export function rippleForG1(n: number, g1: number): number {
  let lo = 1e-9
  let hi = 30
  for (let i = 0; i < 200; i++) {
    const mid = Math.sqrt(lo * hi)
    if (chebyshevG(n, mid)[0]! < g1) lo = mid
    else hi = mid
  }
  return Math.sqrt(lo * hi)
}

export type ModelLadder = {
  /** The load model's reactive value: C (F) for R-C, L (H) for R-L. */
  reactive: number
  load: (fHz: number) => Complex
  /** The rest of the prototype, from the load out, ending at a source of R. */
  elements: Element[]
}

/**
 * The prototype `g` (odd order) at cut-off `fcHz` and impedance `r`, first element absorbed in
 * the load: low-pass for parallel R-C (shunt C first) and series R-L (series L first), high-pass
 * (ω → −ωc²/ω) for series R-C (series C first) and parallel R-L (shunt L first).
 */
export function modelLadder(model: FanoModel, g: readonly number[], fcHz: number, r: number): ModelLadder {
  const wc = 2 * Math.PI * fcHz
  const isLowPass = model === 'parallel-RC' || model === 'series-RL'
  const firstIsShunt = model.startsWith('parallel')
  const n = g.length - 1
  const part = (k: number): Element => {
    const isShunt = firstIsShunt ? k % 2 === 1 : k % 2 === 0
    const placement = isShunt ? 'shunt' : 'series'
    const gk = g[k - 1]!
    if (isLowPass) return isShunt ? { kind: 'C', placement, value: gk / (r * wc) } : { kind: 'L', placement, value: (gk * r) / wc }
    return isShunt ? { kind: 'L', placement, value: r / (wc * gk) } : { kind: 'C', placement, value: 1 / (r * wc * gk) }
  }
  const first = part(1) as { value: number }
  const reactive = first.value
  const load = (f: number): Complex => {
    const w = 2 * Math.PI * f
    const x = model.endsWith('RC') ? -1 / (w * reactive) : w * reactive
    if (!firstIsShunt) return { re: r, im: x }
    const d = r * r + x * x
    return { re: (r * x * x) / d, im: (r * r * x) / d }
  }
  return { reactive, load, elements: Array.from({ length: n - 1 }, (_, i) => part(i + 2)) }
}
