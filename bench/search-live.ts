// Match search, the parts that need a build: (1) the same bench inputs in the board page's Web
// Worker in Chromium through the page's test hook (composables/useHuntWorker.ts), median of
// several runs after a warm-up; (2) live fan-out latency (10 clients on one board, send until every
// other peer has applied it) while two searches keep running on the server through
// POST /api/rf/search, against the same measure with no search running.
import { startServer } from '../tests/support/server'
import { DEMO_USERS, signIn, signInPage } from '../tests/support/auth'
import { launchChromium } from '../tests/support/browser'
import { measureLatency } from './live'
import { searchBenchInput } from './search'

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

export type SearchLiveBench = {
  worker: { label: string, medianMs: number, workerMedianMs: number, bestDb: number }[] | { error: string }
  fanout: { idleP95Ms: number, idleMedianMs: number, busyP95Ms: number, busyMedianMs: number, searchesDone: number, searchStatuses: number[] }
}

export async function runSearchLiveBench(runs = 5): Promise<SearchLiveBench> {
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  try {
    let worker: SearchLiveBench['worker']
    const browser = await launchChromium()
    try {
      const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage()
      await signInPage(page, server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
      await page.goto(`${server.url}/boards/brackwater-915-antenna`)
      await page.waitForFunction(() => !!(window as unknown as { __gammaboardHunt?: unknown }).__gammaboardHunt, null, { timeout: 30_000 })
      worker = []
      for (const [label, q] of [['lossless', undefined], ['Q (L 40, C 200)', { L: 40, C: 200 }]] as const) {
        // No named helper functions inside evaluate: tsx would wrap them in a helper the page lacks.
        const out = await page.evaluate(async ({ input, runs }) => {
          const hook = (window as unknown as { __gammaboardHunt: { run: (i: unknown) => Promise<{ status: string, elapsedMs: number, bestDb: number }> } }).__gammaboardHunt
          const wall: number[] = []
          const inWorker: number[] = []
          let best = NaN
          for (let i = 0; i < runs + 1; i++) {
            const start = performance.now()
            const r = await hook.run(input)
            if (r.status !== 'done') throw new Error(`worker search ended ${r.status}`)
            if (i === 0) continue // warm-up (also loads the worker)
            wall.push(performance.now() - start)
            inWorker.push(r.elapsedMs)
            best = r.bestDb
          }
          return { wall, inWorker, best }
        }, { input: searchBenchInput(q), runs })
        worker.push({ label, medianMs: median(out.wall), workerMedianMs: median(out.inWorker), bestDb: out.best })
      }
    }
    catch (error) {
      worker = { error: error instanceof Error ? error.message : String(error) }
    }
    finally {
      await browser.close()
    }

    const cookie = await signIn(server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const idle = await measureLatency([server.url], cookie, 10, 300)
    // Two searches at a time, each started again as soon as it answers, for as long as the measure runs.
    let isMeasuring = true
    const statuses: number[] = []
    const body = JSON.stringify({ ...searchBenchInput({ L: 40, C: 200 }), series: 'E48' })
    const loop = async () => {
      while (isMeasuring) {
        const res = await fetch(`${server.url}/api/rf/search`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body })
        await res.arrayBuffer()
        statuses.push(res.status)
      }
    }
    const loops = [loop(), loop()]
    await new Promise(r => setTimeout(r, 300))
    const busy = await measureLatency([server.url], cookie, 10, 300)
    isMeasuring = false
    await Promise.all(loops)
    return {
      worker,
      fanout: { idleP95Ms: idle.p95Ms, idleMedianMs: idle.medianMs, busyP95Ms: busy.p95Ms, busyMedianMs: busy.medianMs, searchesDone: statuses.length, searchStatuses: [...new Set(statuses)] },
    }
  }
  finally {
    await server.stop()
  }
}

export function printSearchLiveBench(r: SearchLiveBench): void {
  if ('error' in r.worker) console.log(`search: worker run failed: ${r.worker.error}`)
  else {
    for (const w of r.worker) {
      console.log(`search (${w.label}): in the board page's worker (Chromium): median ${w.medianMs.toFixed(0)} ms on the page, ${w.workerMedianMs.toFixed(0)} ms inside the worker; best ${w.bestDb.toFixed(3)} dB`)
    }
  }
  const f = r.fanout
  console.log(`search: live fan-out (10 clients, 300 updates): idle median ${f.idleMedianMs.toFixed(2)} ms, p95 ${f.idleP95Ms.toFixed(2)} ms; with two searches running on the server (E48, 3 parts, ${f.searchesDone} answered, status ${f.searchStatuses.join('/')}): median ${f.busyMedianMs.toFixed(2)} ms, p95 ${f.busyP95Ms.toFixed(2)} ms`)
}
