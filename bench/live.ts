// Live co-editing on the built server over loopback: (1) 10 clients on one board, 1,000 updates
// sent one after another from rotating clients, time from send until every other peer has applied
// it; (2) 50 boards with 4 clients each, the server's resident memory per open board
// (VmRSS from /proc/<pid>/status before the sockets open and after every room is loaded).
// Then the same on two nodes sharing a throwaway PostgreSQL and Redis: the 10 clients alternate
// between the nodes, and 200 boards are each open on both nodes (one client on each).
import { readFileSync } from 'node:fs'
import { pathToFileURL } from 'node:url'
import { addElement, updateElement } from '../shared/board/ops'
import { readBoard } from '../shared/board/ydoc'
import { startServer } from '../tests/support/server'
import { createDatabase, startPostgres, startRedis } from '../tests/support/services'
import { DEMO_USERS, signIn } from '../tests/support/auth'
import { connectLive, waitUntil, whenSynced, type LiveClient } from '../tests/support/live-client'
import { createBoard } from '../tests/live/helpers'

interface LatencyFigures { nodes: number, clients: number, updates: number, medianMs: number, p95Ms: number, maxMs: number }
interface MemoryFigures { nodes: number, boards: number, clientsPerBoard: number, rssBeforeMiB: number[], rssAfterMiB: number[], perBoardKiB: number[] }

export interface LiveBenchResult {
  single: { latency: LatencyFigures, memory: MemoryFigures }
  twoNodes: { latency: LatencyFigures, memory: MemoryFigures }
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!

export function rssKiB(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8')
  const match = /^VmRSS:\s+(\d+) kB/m.exec(status)
  if (!match) throw new Error('no VmRSS in /proc status')
  return Number(match[1])
}

/** Peer i connects to node i mod n. */
export async function measureLatency(baseUrls: string[], cookie: string, clients = 10, updates = 1000): Promise<LatencyFigures> {
  const boardId = await createBoard(baseUrls[0]!, cookie, 'Bench latency')
  const peers: LiveClient[] = Array.from({ length: clients }, (_, i) => connectLive(baseUrls[i % baseUrls.length]!, boardId, { cookie }))
  try {
    await Promise.all(peers.map(p => whenSynced(p, 20_000)))
    const id = addElement(peers[0]!.doc, { kind: 'C', placement: 'shunt', value: 1e-12 })
    await waitUntil(() => peers.every(p => readBoard(p.doc).elements.length === 1), 10_000)
    // Count remote updates as each peer's provider applies them (origin = the provider).
    const arrived = new Array<number>(clients).fill(0)
    peers.forEach((peer, index) => peer.doc.on('update', (_u: Uint8Array, origin: unknown) => {
      if (origin === peer.provider) arrived[index]!++
    }))
    const samples: number[] = []
    for (let i = 0; i < updates; i++) {
      const sender = i % clients
      const expected = arrived.map((n, index) => (index === sender ? n : n + 1))
      const start = performance.now()
      updateElement(peers[sender]!.doc, id, { value: 1e-12 * (2 + i / updates) })
      await new Promise<void>((ok, fail) => {
        const deadline = start + 5000
        const check = () => {
          if (arrived.every((n, index) => n >= expected[index]!)) return ok()
          if (performance.now() > deadline) return fail(new Error(`update ${i} did not reach every peer in 5 s`))
          setImmediate(check)
        }
        check()
      })
      samples.push(performance.now() - start)
    }
    samples.sort((a, b) => a - b)
    return { nodes: baseUrls.length, clients, updates, medianMs: quantile(samples, 0.5), p95Ms: quantile(samples, 0.95), maxMs: samples.at(-1)! }
  }
  finally {
    for (const peer of peers) peer.destroy()
  }
}

/** Each board's clients spread over the nodes (client k on node k mod n); RSS of every node. */
async function measureMemory(baseUrls: string[], cookie: string, pids: number[], boards = 50, clientsPerBoard = 4): Promise<MemoryFigures> {
  const ids: string[] = []
  for (let i = 0; i < boards; i++) ids.push(await createBoard(baseUrls[0]!, cookie, `Bench memory ${i + 1}`))
  await new Promise(r => setTimeout(r, 3000)) // let the latency room unload and the heap settle
  const before = pids.map(rssKiB)
  const peers: LiveClient[] = []
  try {
    for (const id of ids) {
      const group = Array.from({ length: clientsPerBoard }, (_, k) => connectLive(baseUrls[k % baseUrls.length]!, id, { cookie }))
      peers.push(...group)
      await Promise.all(group.map(p => whenSynced(p, 20_000)))
      // A realistic ladder: six elements and each peer's presence.
      for (let k = 0; k < 6; k++) addElement(group[0]!.doc, { kind: k % 2 ? 'L' : 'C', placement: k % 2 ? 'series' : 'shunt', value: (k + 1) * 1e-9 })
      group.forEach((p, k) => p.provider.awareness.setLocalStateField('pointer', { re: k / 10, im: 0 }))
    }
    await waitUntil(() => peers.every(p => readBoard(p.doc).elements.length === 6), 20_000)
    await new Promise(r => setTimeout(r, 2500))
    const after = pids.map(rssKiB)
    return {
      nodes: pids.length, boards, clientsPerBoard,
      rssBeforeMiB: before.map(k => k / 1024), rssAfterMiB: after.map(k => k / 1024), perBoardKiB: after.map((k, i) => (k - before[i]!) / boards),
    }
  }
  finally {
    for (const peer of peers) peer.destroy()
  }
}

async function runSingleNode() {
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  try {
    const cookie = await signIn(server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const latency = await measureLatency([server.url], cookie)
    const memory = await measureMemory([server.url], cookie, [server.process.pid!])
    return { latency, memory }
  }
  finally {
    await server.stop()
  }
}

async function runTwoNodes() {
  const [postgres, redis] = await Promise.all([startPostgres(), startRedis()])
  const services = { postgres: postgres.url, redis: redis.url }
  const nodes: Awaited<ReturnType<typeof startServer>>[] = []
  try {
    const database = await createDatabase(postgres.url, 'bench')
    for (let i = 0; i < 2; i++) nodes.push(await startServer({ dbFile: database, services, env: { GAMMABOARD_SEED: 'demo' } }))
    const urls = nodes.map(n => n.url)
    const cookie = await signIn(urls[0]!, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const latency = await measureLatency(urls, cookie)
    const memory = await measureMemory(urls, cookie, nodes.map(n => n.process.pid!), 200, 2)
    return { latency, memory }
  }
  finally {
    for (const node of nodes) await node.stop()
    await redis.stop()
    await postgres.stop()
  }
}

export async function runLiveBench(): Promise<LiveBenchResult> {
  return { single: await runSingleNode(), twoNodes: await runTwoNodes() }
}

export function printLiveBench(result: LiveBenchResult): void {
  for (const [target, { latency: l, memory: m }] of [['one node', result.single], ['two nodes', result.twoNodes]] as const) {
    const spread = l.nodes > 1 ? ` over ${l.nodes} nodes` : ''
    console.log(`live (${target}): ${l.clients} clients${spread}, ${l.updates} updates, send to every peer: median ${l.medianMs.toFixed(2)} ms, p95 ${l.p95Ms.toFixed(2)} ms, max ${l.maxMs.toFixed(2)} ms (target p95 < ${l.nodes > 1 ? 25 : 20} ms)`)
    m.perBoardKiB.forEach((perBoard, i) => {
      console.log(`live (${target}): ${m.boards} boards x ${m.clientsPerBoard} clients: node ${i + 1} RSS ${m.rssBeforeMiB[i]!.toFixed(1)} -> ${m.rssAfterMiB[i]!.toFixed(1)} MiB, ${perBoard.toFixed(0)} KiB per open board`)
    })
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runLiveBench().then(printLiveBench).catch((error) => {
    console.error(error)
    process.exit(1)
  })
}
