// A template's trace as a tiny picture: the Γ points after each element at the design frequency,
// mapped into an SVG box (Γ = 1 at the right edge, +j up). Partial elements are sampled so series
// and shunt moves bend along their circles instead of cutting straight across.
import { gammaOf, trace, type Complex } from '#shared/rf'
import { terminalImpedance } from '#shared/board/terminals'
import type { BoardContent, BoardElement } from '#shared/board/schema'

const STEPS = 10

/** The element at a fraction of its main value (L/C/R value, line or stub length). */
function partial(element: BoardElement, fraction: number): BoardElement {
  switch (element.kind) {
    // Start each part where it changes nothing: zero series impedance, zero shunt admittance.
    case 'L':
    case 'R': return element.placement === 'series' ? { ...element, value: element.value * fraction } : { ...element, value: element.value / Math.max(fraction, 1e-3) }
    case 'C': return element.placement === 'shunt' ? { ...element, value: element.value * fraction } : { ...element, value: element.value / Math.max(fraction, 1e-3) }
    case 'line':
    case 'stub': return { ...element, deg: element.deg * fraction }
    default: return element
  }
}

/** Γ points along the ladder, or an empty list when the content cannot be traced. */
export function thumbnailGammas(content: BoardContent): Complex[] {
  const { z0, frequencyHz, load } = content.settings
  try {
    const loadZ = terminalImpedance(load, frequencyHz, z0)
    const points: Complex[] = [gammaOf(loadZ, z0)]
    content.elements.forEach((element, index) => {
      const before = content.elements.slice(0, index)
      for (let step = 1; step <= STEPS; step++) {
        const zs = trace({ z0, frequency: frequencyHz, load: loadZ, elements: [...before, partial(element, step / STEPS)] })
        points.push(gammaOf(zs[zs.length - 1]!, z0))
      }
    })
    return points.filter(g => Number.isFinite(g.re) && Number.isFinite(g.im))
  }
  catch {
    return []
  }
}

/** SVG polyline points for a box of `size` pixels with the unit circle inset by `pad`. */
export function thumbnailPolyline(gammas: Complex[], size: number, pad = 4): string {
  const radius = size / 2 - pad
  return gammas.map(g => `${(size / 2 + g.re * radius).toFixed(1)},${(size / 2 - g.im * radius).toFixed(1)}`).join(' ')
}
