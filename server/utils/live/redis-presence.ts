// "Who is in it now" across nodes: every few seconds each node writes, per board it has open, the
// people connected to it there into the hash "<prefix>present:<board>" (one field per node, with
// the time written); a reader merges this node's live list with the other nodes' fresh fields.
// Entries of a node that died go stale and are ignored, and the hash expires with its last writer.
import type { RedisLink } from '../redis'

export interface PresentPerson { userId: number, name: string, colour: string }

export interface LocalPresence {
  openBoards(): string[]
  presentIn(boardId: string): PresentPerson[]
}

const PUBLISH_EVERY_MS = 3000
const FRESH_MS = 10_000

export function createPresenceDirectory(redis: RedisLink, local: () => LocalPresence | undefined) {
  const keyOf = (boardId: string) => `${redis.prefix}present:${boardId}`
  let published = new Set<string>()

  async function publish(): Promise<void> {
    const hub = local()
    const boards = hub?.openBoards() ?? []
    const pipeline = redis.commands.pipeline()
    const at = Date.now()
    for (const boardId of boards) {
      const people = hub!.presentIn(boardId)
      if (people.length === 0) pipeline.hdel(keyOf(boardId), redis.nodeId)
      else pipeline.hset(keyOf(boardId), redis.nodeId, JSON.stringify({ at, people })).pexpire(keyOf(boardId), FRESH_MS)
    }
    for (const boardId of published) if (!boards.includes(boardId)) pipeline.hdel(keyOf(boardId), redis.nodeId)
    published = new Set(boards)
    await pipeline.exec()
  }

  const timer = setInterval(() => {
    publish().catch((error: Error) => console.warn(`[live] publishing presence failed: ${error.message}`))
  }, PUBLISH_EVERY_MS)
  timer.unref?.()

  /** Everyone in each board: this node's connections now, other nodes' as of their last write. */
  async function presentInMany(boardIds: string[]): Promise<Map<string, PresentPerson[]>> {
    const hub = local()
    const answer = new Map<string, PresentPerson[]>()
    let remote: ([Error | null, unknown] | null)[] = []
    if (boardIds.length) {
      const pipeline = redis.commands.pipeline()
      for (const boardId of boardIds) pipeline.hgetall(keyOf(boardId))
      remote = await pipeline.exec().catch(() => null) ?? []
    }
    const now = Date.now()
    boardIds.forEach((boardId, index) => {
      const people = new Map<number, PresentPerson>()
      for (const person of hub?.presentIn(boardId) ?? []) people.set(person.userId, person)
      const [error, fields] = remote[index] ?? [null, {}]
      for (const [nodeId, text] of Object.entries(error ? {} : fields as Record<string, string>)) {
        if (nodeId === redis.nodeId) continue
        try {
          const entry = JSON.parse(text) as { at: number, people: PresentPerson[] }
          if (now - entry.at <= FRESH_MS) for (const person of entry.people) if (!people.has(person.userId)) people.set(person.userId, person)
        }
        catch { /* a field we cannot read is skipped */ }
      }
      answer.set(boardId, [...people.values()])
    })
    return answer
  }

  return {
    presentInMany,
    publish,
    async close() {
      clearInterval(timer)
      const pipeline = redis.commands.pipeline()
      for (const boardId of published) pipeline.hdel(keyOf(boardId), redis.nodeId)
      await pipeline.exec().catch(() => {})
    },
  }
}
