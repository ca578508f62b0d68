// Connects the open board's Y.Doc to the live server (/live/<boardId>) with y-websocket: remote
// edits arrive with the provider as their origin, so the UndoManager (ORIGIN_LOCAL only) never
// undoes a colleague's change. The server says whether we may edit; until it has, we may not.
import { WebsocketProvider } from 'y-websocket'
import { listenForAccessNotice, reconnectWithJitter } from '#shared/live/provider'
import { RECONNECT_MAX_MS } from '#shared/live/backoff'

/** The part of the page's board store the connection drives: read-only until the server allows
 * editing, and the drag draft shown to colleagues. Passed in: composables never import stores. */
export interface LiveBoardTarget {
  readOnly: boolean
  readonly draft: { elementId: string, value: number } | null
}

export type LiveStatus = 'offline' | 'connecting' | 'connected' | 'synced' | 'refused'

const status = ref<LiveStatus>('offline')
let provider: WebsocketProvider | null = null
let detach: (() => void) | null = null

function liveServerUrl(): string {
  const { protocol, host } = window.location
  return `${protocol === 'https:' ? 'wss' : 'ws'}://${host}/live`
}

function stop() {
  detach?.()
  detach = null
  usePresence().bind(null)
  provider?.destroy()
  provider = null
  status.value = 'offline'
}

function start(boardId: string, store: LiveBoardTarget) {
  stop()
  const doc = useBoardDoc().doc
  if (!doc) throw new Error('Open the board document before connecting it')
  // The safe side until the server's access notice arrives.
  store.readOnly = true
  const next = new WebsocketProvider(liveServerUrl(), encodeURIComponent(boardId), doc, {
    connect: false,
    disableBc: true,
    maxBackoffTime: RECONNECT_MAX_MS,
  })
  // Editing starts once the document has synced (before that it is empty) and the role allows it.
  let mayEdit = false
  listenForAccessNotice(next, (notice) => {
    mayEdit = !notice.readOnly
    store.readOnly = !(mayEdit && next.synced)
  })
  const stopJitter = reconnectWithJitter(next)
  next.on('status', ({ status: s }) => { status.value = s === 'connected' ? (next.synced ? 'synced' : 'connected') : s === 'connecting' ? 'connecting' : 'offline' })
  next.on('sync', (isSynced: boolean) => {
    if (!isSynced) return
    status.value = 'synced'
    store.readOnly = !mayEdit
  })
  next.on('closed', () => { status.value = 'refused' })
  usePresence().bind(next.awareness)
  // A drag draft is shown to colleagues while it lasts; the document changes only on release.
  const stopDraft = watch(() => store.draft, (draft) => {
    usePresence().setDragging(draft ? { elementId: draft.elementId, value: draft.value } : null)
  })
  provider = next
  detach = () => {
    stopDraft()
    stopJitter()
  }
  next.connect()
}

export function useLiveBoard() {
  return { start, stop, status: readonly(status) }
}
