// Commands every node must carry out on its own sockets: a member's role changed or they were
// removed, a session or all of a user's sessions ended, a board was deleted. The node that takes
// the request runs it at once and publishes it on "<prefix>control"; the others run it on arrival.
import type { RedisLink } from '../redis'
import type { LiveRole } from '../../../shared/live/protocol'

export type LiveCommand =
  | { kind: 'refreshRole', userId: number, workspaceId: number, role: LiveRole | null }
  | { kind: 'closeSocketsOf', userId: number }
  | { kind: 'closeSession', sessionKey: string }
  | { kind: 'closeBoard', boardId: string }

export interface LiveControl {
  /** Publishes a command to the other nodes (the caller has already run it here). */
  publish(command: LiveCommand): void
}

export function createRedisControl(redis: RedisLink, run: (command: LiveCommand) => void): LiveControl {
  const channel = `${redis.prefix}control`
  redis.subscriber.subscribe(channel).catch((error: Error) => console.error(`[live] control channel: ${error.message}`))
  redis.subscriber.on('message', (name: string, text: string) => {
    if (name !== channel) return
    try {
      const message = JSON.parse(text) as { nodeId: string, command: LiveCommand }
      if (message.nodeId !== redis.nodeId) run(message.command)
    }
    catch (error) {
      console.warn('[live] bad control message', error)
    }
  })
  return {
    publish(command) {
      redis.commands.publish(channel, JSON.stringify({ nodeId: redis.nodeId, command }))
        .catch((error: Error) => console.error(`[live] publishing ${command.kind} failed: ${error.message}`))
    },
  }
}
