// The process's one live hub, storing boards through the boards table, and joined to the other
// nodes through Redis when GAMMABOARD_REDIS_URL is set. Lazily created so that nothing touches the
// database before the first connection or server-side edit.
import { appendBoardUpdate, loadStoredBoard, saveBoardState } from '../../database/board-store'
import { useDb } from '../db'
import { useRedis } from '../redis'
import { createRedisBus } from './redis-bus'
import { createLiveHub, type LiveHub } from './rooms'

let hub: LiveHub | undefined

export function useLiveHub(): LiveHub {
  const redis = useRedis()
  hub ??= createLiveHub({
    relay: redis ? createRedisBus(redis) : undefined,
    store: {
      loadState: async boardId => loadStoredBoard(await useDb(), boardId),
      saveState: async (boardId, update, coveredLogId) => saveBoardState(await useDb(), boardId, update, coveredLogId),
      appendUpdate: async (boardId, update) => appendBoardUpdate(await useDb(), boardId, update),
    },
  })
  return hub
}

/** The hub if one was created (shutdown must not create one just to close it). */
export function existingLiveHub(): LiveHub | undefined {
  return hub
}
