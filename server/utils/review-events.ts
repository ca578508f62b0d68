// Tells every open browser of a board that its review changed (a comment, reply, edit, deletion,
// resolution or verdict), so it fetches the list again. Each node tells its own listeners (the
// event stream route); with several nodes the event also goes out on "<prefix>review-events" and
// the other nodes tell theirs. The message carries no content, only what changed.
import { EventEmitter } from 'node:events'
import { useRedis, type RedisLink } from './redis'

export interface ReviewEvent {
  kind: 'comments' | 'verdicts'
  boardId: string
  /** The thread or snapshot concerned. */
  id: string
}

const emitter = new EventEmitter()
emitter.setMaxListeners(0)

let relayed: RedisLink | undefined

/** Subscribes once to the other nodes' review events (several nodes only). */
function relay(): RedisLink | undefined {
  const redis = useRedis()
  if (!redis || relayed === redis) return redis
  relayed = redis
  const channel = `${redis.prefix}review-events`
  redis.subscriber.subscribe(channel).catch((error: Error) => console.warn(`[review] subscribing failed: ${error.message}`))
  redis.subscriber.on('message', (name: string, text: string) => {
    if (name !== channel) return
    try {
      const { nodeId, event } = JSON.parse(text) as { nodeId: string, event: ReviewEvent }
      if (nodeId !== redis.nodeId) emitter.emit(`board:${event.boardId}`, event)
    }
    catch { /* not ours */ }
  })
  return redis
}

export function publishReviewEvent(event: ReviewEvent): void {
  emitter.emit(`board:${event.boardId}`, event)
  const redis = relay()
  redis?.commands.publish(`${redis.prefix}review-events`, JSON.stringify({ nodeId: redis.nodeId, event }))
    .catch((error: Error) => console.warn(`[review] publishing failed: ${error.message}`))
}

/** Calls `listener` for each event of the board until the returned function is called. */
export function onReviewEvent(boardId: string, listener: (event: ReviewEvent) => void): () => void {
  relay()
  emitter.on(`board:${boardId}`, listener)
  return () => emitter.off(`board:${boardId}`, listener)
}
