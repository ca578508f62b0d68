// What the chart draws for colleagues: a pointer mark at their Γ position in their colour, and,
// while they drag, the element and its draft value beside it. Pure, so it is tested without Konva.
import { formatEng } from '../rf/units'
import { gammaToScreen, type ViewTransform } from '../chart/viewport'
import type { PresenceState } from './presence'

export interface PresenceMark {
  key: string
  x: number
  y: number
  colour: string
  label: string
}

const UNITS: Record<string, string> = { L: 'H', C: 'F', R: 'Ω' }

function draftText(kind: string | undefined, value: number): string {
  if (kind && UNITS[kind]) return formatEng(value, UNITS[kind])
  return `${value.toFixed(1)}°`
}

export function presenceMarks(
  peers: readonly (PresenceState & { clientId: number })[],
  elements: readonly { id: string, kind: string }[],
  view: ViewTransform,
): PresenceMark[] {
  const marks: PresenceMark[] = []
  for (const peer of peers) {
    if (!peer.pointer) continue
    const { x, y } = gammaToScreen(peer.pointer, view)
    const first = peer.user.name.split(/\s+/)[0] ?? peer.user.name
    let label = first
    if (peer.dragging) {
      const index = elements.findIndex(e => e.id === peer.dragging!.elementId)
      const element = elements[index]
      label = element ? `${first}: ${element.kind}${index + 1} ${draftText(element.kind, peer.dragging.value)}` : `${first}: dragging`
    }
    marks.push({ key: String(peer.clientId), x, y, colour: peer.user.colour, label })
  }
  return marks
}
