// The element palette: eight hues of our own, one per kind of element (series and shunt apart for
// L and C, the most common parts). Mid-dark so that traces and tiles stay readable on the paper
// background and when printed; each has a pale tint for tile backgrounds.
import type { ElementJson } from './schema'

export interface ElementHue {
  readonly slot: HueSlot
  readonly name: string
  /** Stroke and text colour. */
  readonly hex: string
  /** Pale background of the same hue. */
  readonly tint: string
}

export type HueSlot =
  | 'seriesL' | 'shuntL' | 'seriesC' | 'shuntC' | 'resistor' | 'line' | 'stub' | 'transformer'

export const ELEMENT_HUES: readonly ElementHue[] = [
  { slot: 'seriesL', name: 'cobalt', hex: '#2f5fa7', tint: '#e3ebf6' },
  { slot: 'shuntL', name: 'plum', hex: '#7b4a9e', tint: '#eee6f4' },
  { slot: 'seriesC', name: 'rust', hex: '#a8461f', tint: '#f6e6de' },
  { slot: 'shuntC', name: 'ochre', hex: '#94700a', tint: '#f4eed9' },
  { slot: 'resistor', name: 'olive', hex: '#56692a', tint: '#e9eedd' },
  { slot: 'line', name: 'pine', hex: '#1d7566', tint: '#dcefeb' },
  { slot: 'stub', name: 'berry', hex: '#a1375f', tint: '#f5e1e9' },
  { slot: 'transformer', name: 'graphite', hex: '#4a4e57', tint: '#e6e7ea' },
]

const BY_SLOT = new Map(ELEMENT_HUES.map(h => [h.slot, h]))

type HueInput = Pick<ElementJson, 'kind'> & { placement?: string }

export function hueSlotFor(element: HueInput): HueSlot {
  switch (element.kind) {
    case 'L': return element.placement === 'shunt' ? 'shuntL' : 'seriesL'
    case 'C': return element.placement === 'shunt' ? 'shuntC' : 'seriesC'
    case 'R': return 'resistor'
    case 'line': return 'line'
    case 'stub': return 'stub'
    default: return 'transformer'
  }
}

/** The full hue record of an element. */
export function elementHueOf(element: HueInput): ElementHue {
  return BY_SLOT.get(hueSlotFor(element))!
}

/** The stroke colour (hex) of an element's tile and trace segment. */
export function hueFor(element: HueInput): string {
  return elementHueOf(element).hex
}

/** The pale background colour of an element's tile. */
export function tintFor(element: HueInput): string {
  return elementHueOf(element).tint
}
