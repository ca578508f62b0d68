// The node's Redis connections when GAMMABOARD_REDIS_URL is set (several nodes), else undefined:
// one for commands and publishing, one in subscriber mode (Redis allows nothing else on it).
// Keys and channels start with GAMMABOARD_REDIS_PREFIX (default "gammaboard:"), so one Redis can
// serve several separate installations.
import { randomUUID } from 'node:crypto'
import Redis from 'ioredis'

export interface RedisLink {
  /** This process's id in messages it publishes, so it can ignore its own echo. */
  nodeId: string
  prefix: string
  commands: Redis
  subscriber: Redis
}

let link: RedisLink | undefined

export function redisUrl(env: NodeJS.ProcessEnv = process.env): string | undefined {
  const url = env.GAMMABOARD_REDIS_URL?.trim()
  if (!url) return undefined
  if (!/^rediss?:\/\//.test(url)) throw new Error('GAMMABOARD_REDIS_URL must be a redis:// or rediss:// URL')
  return url
}

export function useRedis(): RedisLink | undefined {
  if (link) return link
  const url = redisUrl()
  if (!url) return undefined
  // Commands wait in ioredis's offline queue while Redis is away, but never more than 5 s each;
  // reconnection goes on forever, backing off to 2 s.
  const options = { maxRetriesPerRequest: 2, connectTimeout: 5000, retryStrategy: (times: number) => Math.min(times * 100, 2000) }
  const commands = new Redis(url, options)
  const subscriber = new Redis(url, options)
  for (const [name, client] of [['commands', commands], ['subscriber', subscriber]] as const) {
    client.on('error', (error: Error) => console.warn(`[redis] ${name} connection: ${error.message}`))
  }
  link = { nodeId: randomUUID(), prefix: process.env.GAMMABOARD_REDIS_PREFIX?.trim() || 'gammaboard:', commands, subscriber }
  return link
}

/** Answers within timeoutMs whether Redis replies to PING (for /api/health). */
export async function redisIsUp(timeoutMs = 1000): Promise<boolean> {
  const redis = useRedis()
  if (!redis) return false
  let timer: ReturnType<typeof setTimeout> | undefined
  const late = new Promise<boolean>((ok) => { timer = setTimeout(() => ok(false), timeoutMs) })
  try {
    return await Promise.race([redis.commands.ping().then(reply => reply === 'PONG', () => false), late])
  }
  finally {
    clearTimeout(timer)
  }
}

export async function closeRedis(): Promise<void> {
  if (!link) return
  const { commands, subscriber } = link
  link = undefined
  await Promise.allSettled([subscriber.quit(), commands.quit()])
}
