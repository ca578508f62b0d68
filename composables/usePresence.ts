// Presence on the open board, client side: what this user shows (pointer on the chart in Γ, the
// element being dragged with its draft value) and what colleagues show. The awareness object
// comes from the live provider; without one (not connected) the peer list is empty.
import type { Awareness } from 'y-protocols/awareness'
import { readPresence, type PresenceDrag, type PresencePointer, type PresenceState } from '#shared/live/presence'

export interface RemotePresence extends PresenceState {
  clientId: number
}

const peers = shallowRef<RemotePresence[]>([])
let awareness: Awareness | null = null
let pending: { pointer?: PresencePointer | null, dragging?: PresenceDrag | null } = {}
let timer: ReturnType<typeof setTimeout> | undefined

// Pointer moves arrive at 60+ Hz; colleagues see at most ~20 updates a second.
const THROTTLE_MS = 50

function flush() {
  timer = undefined
  if (!awareness) return
  const state = awareness.getLocalState() ?? {}
  awareness.setLocalState({ ...state, ...pending })
  pending = {}
}

function publish(patch: typeof pending) {
  pending = { ...pending, ...patch }
  if (!timer) timer = setTimeout(flush, THROTTLE_MS)
}

function refresh() {
  if (!awareness) return (peers.value = [])
  const own = awareness.clientID
  const list: RemotePresence[] = []
  awareness.getStates().forEach((raw, clientId) => {
    if (clientId === own) return
    const presence = readPresence(raw)
    if (presence) list.push({ ...presence, clientId })
  })
  peers.value = list.sort((a, b) => a.user.name.localeCompare(b.user.name) || a.clientId - b.clientId)
}

/** Called by the live connection when it has an awareness object (null when it goes away). */
function bind(next: Awareness | null) {
  awareness?.off('change', refresh)
  awareness = next
  if (awareness) {
    awareness.setLocalState({ pointer: null, dragging: null })
    awareness.on('change', refresh)
  }
  refresh()
}

export function usePresence() {
  return {
    /** Colleagues on this board, one entry per open tab, sorted by name. */
    peers: readonly(peers),
    bind,
    /** The chart reports the pointer position in Γ (null when it leaves the chart). */
    setPointer: (pointer: PresencePointer | null) => publish({ pointer }),
    setDragging: (dragging: PresenceDrag | null) => publish({ dragging }),
  }
}
