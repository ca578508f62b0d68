// Words the chart shows when a drag reaches what a part cannot do.
import type { Element } from '../rf/types'

/** Why a drag of this element is held ("blocked: 'sign'"), in the user's terms. */
export function signBlockMessage(element: Element): string {
  if (element.kind === 'L') {
    return element.placement === 'series'
      ? 'An inductor can only add positive reactance — use a capacitor to go the other way.'
      : 'A shunt inductor can only add negative susceptance — use a shunt capacitor to go the other way.'
  }
  if (element.kind === 'C') {
    return element.placement === 'series'
      ? 'A capacitor can only add negative reactance — use an inductor to go the other way.'
      : 'A shunt capacitor can only add positive susceptance — use a shunt inductor to go the other way.'
  }
  if (element.kind === 'R') {
    return element.placement === 'series'
      ? 'A series resistor can only add resistance, never take it away.'
      : 'A shunt resistor can only add conductance, never take it away.'
  }
  return 'This element cannot go further that way.'
}
