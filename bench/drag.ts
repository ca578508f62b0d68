// Dragging on the chart in Chromium: 300 pointer moves dragging one element of a 10-element ladder
// with a 401-point band, on the built server. For each move the page records, through the chart's
// test hook (components/chart/ChartStage.vue), the time from the pointermove handler (latency) and
// from the frame callback that applies it (work) until the store is updated and the layers have
// drawn. The board is made for the run: created over the API and filled over the live socket.
import { pathToFileURL } from 'node:url'
import { chromium } from 'playwright-core'
import { replaceLadder, updateSettings } from '../shared/board/ops'
import type { NewElement } from '../shared/board/ops'
import { startServer } from '../tests/support/server'
import { DEMO_USERS, signIn, signInPage } from '../tests/support/auth'
import { connectLive, waitUntil, whenSynced } from '../tests/support/live-client'
import { createBoard } from '../tests/live/helpers'

export interface DragBenchResult {
  moves: number
  frames: number
  latency: { medianMs: number, p95Ms: number, maxMs: number }
  work: { medianMs: number, p95Ms: number, maxMs: number }
}

const MOVES = 300

/** Ten elements of every draggable kind at 915 MHz; the shunt C in the middle is dragged. */
const BENCH_LADDER: NewElement[] = [
  { id: 'b1', kind: 'L', placement: 'series', value: 4.7e-9, q: 40 },
  { id: 'b2', kind: 'C', placement: 'shunt', value: 1.8e-12 },
  { id: 'b3', kind: 'line', z0: 50, deg: 12, fRef: 915e6 },
  { id: 'b4', kind: 'C', placement: 'series', value: 6.8e-12, q: 200 },
  { id: 'b5', kind: 'L', placement: 'shunt', value: 22e-9 },
  { id: 'b6', kind: 'C', placement: 'shunt', value: 2.2e-12 },
  { id: 'b7', kind: 'L', placement: 'series', value: 3.3e-9 },
  { id: 'b8', kind: 'R', placement: 'series', value: 1 },
  { id: 'b9', kind: 'stub', end: 'open', placement: 'shunt', z0: 60, deg: 8, fRef: 915e6 },
  { id: 'b10', kind: 'line', z0: 60, deg: 6, fRef: 915e6 },
]
const DRAGGED = 'b6'

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!
function summary(values: number[]) {
  const sorted = [...values].sort((a, b) => a - b)
  return { medianMs: quantile(sorted, 0.5), p95Ms: quantile(sorted, 0.95), maxMs: sorted[sorted.length - 1]! }
}

async function makeBenchBoard(baseUrl: string, cookie: string): Promise<string> {
  const id = await createBoard(baseUrl, cookie, 'Benchmark: 10 elements, 401-point band')
  const client = connectLive(baseUrl, id, { cookie })
  try {
    await whenSynced(client, 20_000)
    updateSettings(client.doc, { frequencyHz: 915e6, bandStartHz: 860e6, bandStopHz: 970e6, bandPoints: 401, snapSeries: 'none' })
    replaceLadder(client.doc, BENCH_LADDER)
    // The room has the edits once the server echoes nothing pending: wait for the socket to drain.
    await waitUntil(() => (client.provider.ws?.bufferedAmount ?? 0) === 0, 5000, 'the edits to be sent')
    await new Promise(r => setTimeout(r, 300))
  }
  finally {
    client.destroy()
  }
  return id
}

export async function runDragBench(): Promise<DragBenchResult> {
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  })
  try {
    const cookie = await signIn(server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const boardId = await makeBenchBoard(server.url, cookie)
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage()
    await signInPage(page, server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    await page.goto(`${server.url}/boards/${boardId}`)
    await page.waitForFunction((id) => {
      const hook = (window as unknown as { __gammaboardChart?: { handles: () => { id: string }[] } }).__gammaboardChart
      return !!hook && hook.handles().some(h => h.id === id)
    }, DRAGGED, { timeout: 20_000 })
    const tileCount = await page.evaluate(() => document.querySelectorAll('[data-testid="ladder-tile"]').length)
    if (tileCount !== BENCH_LADDER.length) throw new Error(`expected ${BENCH_LADDER.length} tiles, found ${tileCount}`)

    const start = await page.evaluate((id) => {
      const hook = (window as unknown as { __gammaboardChart: { handles: () => { id: string, x: number, y: number }[] } }).__gammaboardChart
      return hook.handles().find(h => h.id === id)!
    }, DRAGGED)
    await page.mouse.move(start.x, start.y)
    await page.mouse.down()
    await page.evaluate(() => (window as unknown as { __gammaboardChart: { perf: { start: () => void } } }).__gammaboardChart.perf.start())
    for (let i = 1; i <= MOVES; i++) {
      // Back and forth along a slanted path around the handle, so the value keeps changing.
      const t = Math.sin((i / MOVES) * 6 * Math.PI)
      await page.mouse.move(start.x - 35 * t, start.y + 60 * t)
      // One frame per move: every move is drawn and measured.
      await page.evaluate(() => new Promise(r => requestAnimationFrame(() => r(null))))
    }
    const samples = await page.evaluate(() =>
      (window as unknown as { __gammaboardChart: { perf: { stop: () => { latencyMs: number, workMs: number }[] } } }).__gammaboardChart.perf.stop())
    await page.mouse.up()
    if (samples.length === 0) throw new Error('the drag recorded no frames')
    return {
      moves: MOVES,
      frames: samples.length,
      latency: summary(samples.map(s => s.latencyMs)),
      work: summary(samples.map(s => s.workMs)),
    }
  }
  finally {
    await browser.close()
    await server.stop()
  }
}

export function printDragBench(r: DragBenchResult): void {
  const f = (x: number) => x.toFixed(2)
  console.log(`drag: ${r.moves} pointer moves on a 10-element ladder with a 401-point band, ${r.frames} frames drawn`)
  console.log(`drag: pointer event → drawn frame: median ${f(r.latency.medianMs)} ms, p95 ${f(r.latency.p95Ms)} ms, max ${f(r.latency.maxMs)} ms (target p95 < 8 ms)`)
  console.log(`drag: compute and draw in the frame: median ${f(r.work.medianMs)} ms, p95 ${f(r.work.p95Ms)} ms, max ${f(r.work.maxMs)} ms`)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runDragBench().then(printDragBench).catch((error) => {
    console.error(error)
    process.exit(1)
  })
}
