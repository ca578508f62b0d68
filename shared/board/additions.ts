// The palette of element kinds a person can add, with their keyboard shortcuts and starting values.
// Starting values are sized for the board: a reactance of about Z0 at the design frequency, rounded
// to E12, so a new tile moves the point a visible but modest distance.
import { nearestStandard } from '../rf'
import type { BoardSettings, ElementJson } from './schema'

export interface ElementAddition {
  id: string
  /** Shown in the palette and its tooltip. */
  label: string
  /** KeyboardEvent.key that adds it (upper case means with Shift). */
  key: string
  /** How the shortcut is written for people. */
  keyLabel: string
  make: (settings: Pick<BoardSettings, 'z0' | 'frequencyHz'>) => ElementJson
}

const TWO_PI = 2 * Math.PI

function inductorFor(s: Pick<BoardSettings, 'z0' | 'frequencyHz'>): number {
  return nearestStandard(s.z0 / (TWO_PI * s.frequencyHz), 'E12')
}
function capacitorFor(s: Pick<BoardSettings, 'z0' | 'frequencyHz'>): number {
  return nearestStandard(1 / (TWO_PI * s.frequencyHz * s.z0), 'E12')
}

export const ELEMENT_ADDITIONS: readonly ElementAddition[] = [
  { id: 'series-L', label: 'Series inductor', key: 'l', keyLabel: 'L', make: s => ({ kind: 'L', placement: 'series', value: inductorFor(s) }) },
  { id: 'shunt-L', label: 'Shunt inductor', key: 'L', keyLabel: 'Shift+L', make: s => ({ kind: 'L', placement: 'shunt', value: inductorFor(s) }) },
  { id: 'series-C', label: 'Series capacitor', key: 'c', keyLabel: 'C', make: s => ({ kind: 'C', placement: 'series', value: capacitorFor(s) }) },
  { id: 'shunt-C', label: 'Shunt capacitor', key: 'C', keyLabel: 'Shift+C', make: s => ({ kind: 'C', placement: 'shunt', value: capacitorFor(s) }) },
  { id: 'series-R', label: 'Series resistor', key: 'r', keyLabel: 'R', make: s => ({ kind: 'R', placement: 'series', value: nearestStandard(s.z0 / 5, 'E12') }) },
  { id: 'shunt-R', label: 'Shunt resistor', key: 'R', keyLabel: 'Shift+R', make: s => ({ kind: 'R', placement: 'shunt', value: nearestStandard(s.z0 * 10, 'E12') }) },
  { id: 'line', label: 'Transmission line', key: 't', keyLabel: 'T', make: s => ({ kind: 'line', z0: s.z0, deg: 30, fRef: s.frequencyHz }) },
  { id: 'shunt-open-stub', label: 'Shunt open stub', key: 'o', keyLabel: 'O', make: s => ({ kind: 'stub', end: 'open', placement: 'shunt', z0: s.z0, deg: 45, fRef: s.frequencyHz }) },
  { id: 'shunt-short-stub', label: 'Shunt shorted stub', key: 's', keyLabel: 'S', make: s => ({ kind: 'stub', end: 'short', placement: 'shunt', z0: s.z0, deg: 45, fRef: s.frequencyHz }) },
  { id: 'series-open-stub', label: 'Series open stub', key: 'O', keyLabel: 'Shift+O', make: s => ({ kind: 'stub', end: 'open', placement: 'series', z0: s.z0, deg: 45, fRef: s.frequencyHz }) },
  { id: 'series-short-stub', label: 'Series shorted stub', key: 'S', keyLabel: 'Shift+S', make: s => ({ kind: 'stub', end: 'short', placement: 'series', z0: s.z0, deg: 45, fRef: s.frequencyHz }) },
  { id: 'xfmr', label: 'Ideal transformer', key: 'n', keyLabel: 'N', make: () => ({ kind: 'xfmr', ratio: 1.5 }) },
]

export function additionForKey(key: string): ElementAddition | undefined {
  return ELEMENT_ADDITIONS.find(a => a.key === key)
}
