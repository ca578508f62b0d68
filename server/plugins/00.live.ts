// Start-up wiring of the live server.
// NOTE: the file name sorts before database.ts on purpose. Nitro registers plugins in file-name
// order and runs 'close' hooks in that order, so on shutdown (SIGTERM) the rooms are flushed to
// SQLite before the database plugin closes the connection.
import { setLiveBridge } from '../database/live-bridge'
import { MAX_FRAME_BYTES } from '../../shared/live/protocol'
import { existingLiveHub, useLiveHub } from '../utils/live/hub'
import { createRedisControl, type LiveCommand } from '../utils/live/redis-control'
import { createPresenceDirectory } from '../utils/live/redis-presence'
import { closeRedis, useRedis } from '../utils/redis'

/** Runs a socket command on this node's rooms (none open: nothing to do). */
function runHere(command: LiveCommand): number {
  const hub = existingLiveHub()
  if (!hub) return 0
  switch (command.kind) {
    case 'refreshRole': return hub.refreshRole(command.userId, command.workspaceId, command.role)
    case 'closeSocketsOf': return hub.closeSocketsOf(command.userId, undefined, 'signed out')
    case 'closeSession': return hub.closeSession(command.sessionKey)
    case 'closeBoard': return hub.closeBoard(command.boardId)
  }
}

export default defineNitroPlugin((nitroApp) => {
  // The node adapter reads these `ws` options when the server starts: frames above the limit are
  // refused by `ws` itself (close 1009) before they are buffered whole.
  const app = nitroApp.h3App as unknown as { options: { websocket?: Record<string, unknown> } }
  app.options.websocket = { ...app.options.websocket, serverOptions: { maxPayload: MAX_FRAME_BYTES } }

  // With several nodes, socket commands run here at once and on every other node on arrival.
  const redis = useRedis()
  const control = redis ? createRedisControl(redis, runHere) : undefined
  const directory = redis ? createPresenceDirectory(redis, existingLiveHub) : undefined
  const everywhere = (command: LiveCommand) => {
    control?.publish(command)
    return runHere(command)
  }

  // REST routes (snapshot restore, board JSON, member changes) reach the rooms through the bridge.
  setLiveBridge({
    openDoc: boardId => existingLiveHub()?.openDoc(boardId),
    editBoard: (boardId, edit) => useLiveHub().editBoard(boardId, edit),
    refreshRole: (userId, workspaceId, role) => everywhere({ kind: 'refreshRole', userId, workspaceId, role }),
    presentIn: boardId => existingLiveHub()?.presentIn(boardId) ?? [],
    presentInMany: async (boardIds) => {
      if (directory) return directory.presentInMany(boardIds)
      const hub = existingLiveHub()
      return new Map(boardIds.map(id => [id, hub?.presentIn(id) ?? []]))
    },
    closeSocketsOf: userId => everywhere({ kind: 'closeSocketsOf', userId }),
    closeSession: sessionKey => everywhere({ kind: 'closeSession', sessionKey }),
    closeBoard: boardId => everywhere({ kind: 'closeBoard', boardId }),
  })

  nitroApp.hooks.hook('close', async () => {
    await existingLiveHub()?.shutdown()
    await directory?.close()
    await closeRedis()
  })
})
