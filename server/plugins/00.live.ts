// Start-up wiring of the live server.
// NOTE: the file name sorts before database.ts on purpose. Nitro registers plugins in file-name
// order and runs 'close' hooks in that order, so on shutdown (SIGTERM) the rooms are flushed to
// SQLite before the database plugin closes the connection.
import { setLiveBridge } from '../database/live-bridge'
import { MAX_FRAME_BYTES } from '../../shared/live/protocol'
import { existingLiveHub, useLiveHub } from '../utils/live/hub'

export default defineNitroPlugin((nitroApp) => {
  // The node adapter reads these `ws` options when the server starts: frames above the limit are
  // refused by `ws` itself (close 1009) before they are buffered whole.
  const app = nitroApp.h3App as unknown as { options: { websocket?: Record<string, unknown> } }
  app.options.websocket = { ...app.options.websocket, serverOptions: { maxPayload: MAX_FRAME_BYTES } }

  // REST routes (snapshot restore, board JSON, member changes) reach the rooms through the bridge.
  setLiveBridge({
    openDoc: boardId => existingLiveHub()?.openDoc(boardId),
    editBoard: (boardId, edit) => useLiveHub().editBoard(boardId, edit),
    refreshRole: (userId, workspaceId, role) => existingLiveHub()?.refreshRole(userId, workspaceId, role) ?? 0,
    presentIn: boardId => existingLiveHub()?.presentIn(boardId) ?? [],
    closeSocketsOf: userId => existingLiveHub()?.closeSocketsOf(userId, undefined, 'signed out') ?? 0,
    closeSession: sessionKey => existingLiveHub()?.closeSession(sessionKey) ?? 0,
    closeBoard: boardId => existingLiveHub()?.closeBoard(boardId) ?? 0,
  })

  nitroApp.hooks.hook('close', async () => {
    await existingLiveHub()?.shutdown()
  })
})
