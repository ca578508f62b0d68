// The live document of one board: y-websocket's sync and awareness protocols over Nitro's
// WebSocket handler. All checks happen in `upgrade`, before the socket opens; the room logic is
// in server/utils/live/rooms.ts.
import type { Peer } from 'crossws'
import { admitPeer } from '../../utils/live/admission'
import { useLiveHub } from '../../utils/live/hub'
import type { LiveConnection } from '../../utils/live/rooms'
import type { LiveIdentity } from '../../utils/live/types'

interface LivePeerContext {
  boardId?: string
  identity?: LiveIdentity
  connection?: LiveConnection
}

const contextOf = (peer: Peer) => peer.context as LivePeerContext

export default defineWebSocketHandler({
  async upgrade(request) {
    try {
      const { boardId, identity } = await admitPeer(request as Request)
      // What is put on request.context here is peer.context in the other hooks.
      Object.assign((request as { context: LivePeerContext }).context, { boardId, identity })
    }
    catch (error) {
      if (error instanceof Response) throw error
      console.error('[live] upgrade check failed', error)
      throw new Response('The live server could not check this connection.', { status: 500 })
    }
  },
  open(peer) {
    const context = contextOf(peer)
    if (!context.boardId || !context.identity) return peer.close(1011, 'not admitted')
    context.connection = useLiveHub().join(context.boardId, {
      send: data => peer.send(data),
      close: (code, reason) => peer.close(code, reason),
      // crossws exposes the node adapter's `ws` socket; its bufferedAmount counts unsent bytes.
      bufferedAmount: () => peer.websocket.bufferedAmount ?? 0,
      terminate: () => peer.terminate(),
    }, context.identity)
  },
  message(peer, message) {
    const connection = contextOf(peer).connection
    if (connection) useLiveHub().receive(connection, message.uint8Array())
  },
  close(peer) {
    const connection = contextOf(peer).connection
    if (connection) useLiveHub().leave(connection)
  },
  error(peer, error) {
    console.warn('[live] socket error', error)
    const connection = contextOf(peer).connection
    if (connection) useLiveHub().leave(connection)
  },
})
