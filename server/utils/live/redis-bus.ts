// RelayBus over Redis pub/sub: channel "<prefix>board:<id>", binary messages. ioredis subscribes
// again by itself after a reconnect; what was published while the link was down is then asked
// for again (onResume), since pub/sub keeps nothing for absent listeners.
import type { RedisLink } from '../redis'
import type { RelayBus } from './relay'

export function createRedisBus(redis: RedisLink): RelayBus & { onResume(listener: () => void): void } {
  const handlers = new Map<string, (bytes: Uint8Array) => void>()
  const resumeListeners = new Set<() => void>()
  const channelOf = (boardId: string) => `${redis.prefix}board:${boardId}`
  const prefix = channelOf('')
  let wasReady = false

  redis.subscriber.on('messageBuffer', (channel: Buffer, message: Buffer) => {
    const name = channel.toString()
    if (!name.startsWith(prefix)) return
    handlers.get(name.slice(prefix.length))?.(new Uint8Array(message.buffer, message.byteOffset, message.byteLength))
  })
  redis.subscriber.on('ready', () => {
    if (wasReady) for (const listener of resumeListeners) listener()
    wasReady = true
  })

  return {
    nodeId: redis.nodeId,
    async subscribe(boardId, onMessage) {
      handlers.set(boardId, onMessage)
      await redis.subscriber.subscribe(channelOf(boardId))
    },
    unsubscribe(boardId) {
      handlers.delete(boardId)
      redis.subscriber.unsubscribe(channelOf(boardId)).catch(() => {})
    },
    publish(boardId, bytes) {
      redis.commands.publish(channelOf(boardId), Buffer.from(bytes)).catch((error: Error) => {
        console.warn(`[live] publishing to board ${boardId} failed: ${error.message}`)
      })
    },
    onResume(listener) {
      resumeListeners.add(listener)
    },
  }
}
