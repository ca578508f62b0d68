// Seeded random ladders and loads shared by the property tests and the ngspice check.
import type { Complex, Element } from '../../../shared/rf/index'

type Rng = () => number

export type LadderOptions = { lossless?: boolean; length: number; kinds?: readonly Element['kind'][] }

/** A value spread over decades so that parts land in the tens-of-ohms range at f. */
function reactanceValue(rng: Rng, kind: 'L' | 'C', f: number): number {
  const x = 5 * 10 ** (rng() * 2.3) // 5 Ω … 1 kΩ
  const w = 2 * Math.PI * f
  return kind === 'L' ? x / w : 1 / (w * x)
}

/** A random ladder of `length` elements at design frequency f (lines and stubs carry fRef = f·(0.5…1.5)). */
export function randomLadder(rng: Rng, f: number, options: LadderOptions): Element[] {
  const kinds = options.kinds ?? (options.lossless ? ['L', 'C', 'line', 'stub', 'xfmr'] : ['L', 'C', 'R', 'line', 'stub', 'xfmr'])
  const out: Element[] = []
  for (let i = 0; i < options.length; i++) {
    const kind = kinds[Math.floor(rng() * kinds.length)]!
    const placement = rng() < 0.5 ? 'series' : 'shunt'
    const fRef = f * (0.5 + rng())
    switch (kind) {
      case 'L':
      case 'C': {
        const e: Element = { kind, placement, value: reactanceValue(rng, kind, f) }
        out.push(!options.lossless && rng() < 0.4 ? { ...e, q: 10 + rng() * 200 } : e)
        break
      }
      case 'R':
        out.push({ kind: 'R', placement, value: 10 ** (rng() * 3) })
        break
      case 'line':
        out.push({ kind: 'line', z0: 20 + rng() * 100, deg: rng() * 180, fRef })
        break
      case 'stub':
        out.push({ kind: 'stub', end: rng() < 0.5 ? 'open' : 'short', placement, z0: 20 + rng() * 100, deg: 5 + rng() * 170, fRef })
        break
      case 'xfmr':
        out.push({ kind: 'xfmr', ratio: 0.3 + rng() * 2.7 })
        break
    }
  }
  return out
}

/** A passive load: R in 1…500 Ω and X in −500…500 Ω. */
export function randomPassiveLoad(rng: Rng): Complex {
  return { re: 10 ** (rng() * 2.7), im: (rng() - 0.5) * 1000 }
}
