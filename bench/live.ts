// Live co-editing on the built server over loopback: (1) 10 clients on one board, 1,000 updates
// sent one after another from rotating clients, time from send until every other peer has applied
// it; (2) 50 boards with 4 clients each, the server's resident memory per open board
// (VmRSS from /proc/<pid>/status before the sockets open and after every room is loaded).
import { readFileSync } from 'node:fs'
import { pathToFileURL } from 'node:url'
import { addElement, updateElement } from '../shared/board/ops'
import { readBoard } from '../shared/board/ydoc'
import { startServer } from '../tests/support/server'
import { DEMO_USERS, signIn } from '../tests/support/auth'
import { connectLive, waitUntil, whenSynced, type LiveClient } from '../tests/support/live-client'
import { createBoard } from '../tests/live/helpers'

export interface LiveBenchResult {
  latency: { clients: number, updates: number, medianMs: number, p95Ms: number, maxMs: number }
  memory: { boards: number, clientsPerBoard: number, rssBeforeMiB: number, rssAfterMiB: number, perBoardKiB: number }
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!

function rssKiB(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8')
  const match = /^VmRSS:\s+(\d+) kB/m.exec(status)
  if (!match) throw new Error('no VmRSS in /proc status')
  return Number(match[1])
}

async function measureLatency(baseUrl: string, cookie: string, clients = 10, updates = 1000) {
  const boardId = await createBoard(baseUrl, cookie, 'Bench latency')
  const peers: LiveClient[] = Array.from({ length: clients }, () => connectLive(baseUrl, boardId, { cookie }))
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
    return { clients, updates, medianMs: quantile(samples, 0.5), p95Ms: quantile(samples, 0.95), maxMs: samples.at(-1)! }
  }
  finally {
    for (const peer of peers) peer.destroy()
  }
}

async function measureMemory(baseUrl: string, cookie: string, pid: number, boards = 50, clientsPerBoard = 4) {
  const ids: string[] = []
  for (let i = 0; i < boards; i++) ids.push(await createBoard(baseUrl, cookie, `Bench memory ${i + 1}`))
  await new Promise(r => setTimeout(r, 3000)) // let the latency room unload and the heap settle
  const before = rssKiB(pid)
  const peers: LiveClient[] = []
  try {
    for (const id of ids) {
      const group = Array.from({ length: clientsPerBoard }, () => connectLive(baseUrl, id, { cookie }))
      peers.push(...group)
      await Promise.all(group.map(p => whenSynced(p, 20_000)))
      // A realistic ladder: six elements and each peer's presence.
      for (let k = 0; k < 6; k++) addElement(group[0]!.doc, { kind: k % 2 ? 'L' : 'C', placement: k % 2 ? 'series' : 'shunt', value: (k + 1) * 1e-9 })
      group.forEach((p, k) => p.provider.awareness.setLocalStateField('pointer', { re: k / 10, im: 0 }))
    }
    await waitUntil(() => peers.every(p => readBoard(p.doc).elements.length === 6), 20_000)
    await new Promise(r => setTimeout(r, 2500))
    const after = rssKiB(pid)
    return { boards, clientsPerBoard, rssBeforeMiB: before / 1024, rssAfterMiB: after / 1024, perBoardKiB: (after - before) / boards }
  }
  finally {
    for (const peer of peers) peer.destroy()
  }
}

export async function runLiveBench(): Promise<LiveBenchResult> {
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  try {
    const cookie = await signIn(server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const latency = await measureLatency(server.url, cookie)
    const memory = await measureMemory(server.url, cookie, server.process.pid!)
    return { latency, memory }
  }
  finally {
    await server.stop()
  }
}

export function printLiveBench(result: LiveBenchResult): void {
  const { latency: l, memory: m } = result
  console.log(`live: ${l.clients} clients, ${l.updates} updates, send to every peer: median ${l.medianMs.toFixed(2)} ms, p95 ${l.p95Ms.toFixed(2)} ms, max ${l.maxMs.toFixed(2)} ms (target p95 < 20 ms)`)
  console.log(`live: ${m.boards} boards x ${m.clientsPerBoard} clients: server RSS ${m.rssBeforeMiB.toFixed(1)} -> ${m.rssAfterMiB.toFixed(1)} MiB, ${m.perBoardKiB.toFixed(0)} KiB per open board`)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runLiveBench().then(printLiveBench).catch((error) => {
    console.error(error)
    process.exit(1)
  })
}
