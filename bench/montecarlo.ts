// Monte Carlo tolerance analysis: 10,000 trials of a 6-element ladder over 201 band frequencies,
// (1) in this Node process, (2) in the board page's Web Worker in Chromium on the built server,
// through the page's test hook (composables/useMonteCarlo.ts). Median and fastest of several
// runs after warm-up (target: median under 300 ms). The same seed runs in both, so the yields
// printed should agree to the last digit.
import { pathToFileURL } from 'node:url'
import { runMonteCarlo, type MonteCarloInput } from '../shared/rf/montecarlo'
import { startServer } from '../tests/support/server'
import { DEMO_USERS, signInPage } from '../tests/support/auth'
import { launchChromium } from '../tests/support/browser'

export interface MonteCarloBenchResult {
  trials: number
  frequencies: number
  elements: number
  runs: number
  node: { medianMs: number, minMs: number, yield: number }
  worker: { medianMs: number, minMs: number, workerMedianMs: number, yield: number } | null
  workerError: string | null
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

/** An invented 915 MHz match with six toleranced parts (a pi-T ladder), 201 points 880–950 MHz. */
export function benchInput(trials = 10_000): MonteCarloInput {
  const frequencies = Array.from({ length: 201 }, (_, i) => 880e6 + i * (70e6 / 200))
  const load = { re: 18, im: -32 }
  return {
    frequencies,
    load,
    reference: 50,
    design: { frequencyHz: 915e6, load, reference: 50 },
    elements: [
      { kind: 'L', placement: 'series', value: 10e-9, q: 45, tolerance: 0.02 },
      { kind: 'C', placement: 'shunt', value: 3.9e-12, q: 200, tolerance: 0.05 },
      { kind: 'L', placement: 'series', value: 4.7e-9, q: 40, tolerance: 0.02 },
      { kind: 'C', placement: 'shunt', value: 2.2e-12, q: 200, toleranceAbs: 0.1e-12 },
      { kind: 'L', placement: 'series', value: 2.2e-9, q: 40, tolerance: 0.05 },
      { kind: 'C', placement: 'shunt', value: 1e-12, q: 200, tolerance: 0.05 },
    ],
    spec: { minReturnLossDb: 10, f1Hz: 880e6, f2Hz: 950e6 },
    trials,
    seed: 'bench-montecarlo',
  }
}

function timeNode(runs: number): MonteCarloBenchResult['node'] {
  const input = benchInput()
  for (let i = 0; i < 2; i++) runMonteCarlo(input) // warm-up
  const times: number[] = []
  let result = 0
  for (let i = 0; i < runs; i++) {
    const start = performance.now()
    result = runMonteCarlo(input).yield
    times.push(performance.now() - start)
  }
  return { medianMs: median(times), minMs: Math.min(...times), yield: result }
}

async function timeWorker(runs: number): Promise<NonNullable<MonteCarloBenchResult['worker']>> {
  const server = await startServer({ env: { GAMMABOARD_SEED: 'demo' } })
  const browser = await launchChromium()
  let out: { wall: number[], inWorker: number[], y: number }
  try {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage()
    await signInPage(page, server.url, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    await page.goto(`${server.url}/boards/brackwater-915-antenna`)
    await page.waitForFunction(() => !!(window as unknown as { __gammaboardMonteCarlo?: unknown }).__gammaboardMonteCarlo, null, { timeout: 30_000 })
    // No named helper functions inside evaluate: tsx would wrap them in a helper the page lacks.
    out = await page.evaluate(async ({ input, runs }) => {
      const hook = (window as unknown as { __gammaboardMonteCarlo: { run: (i: unknown) => Promise<{ status: string, yield: number | null, elapsedMs: number | null }> } }).__gammaboardMonteCarlo
      const wall: number[] = []
      const inWorker: number[] = []
      let y = NaN
      for (let i = 0; i < runs + 2; i++) {
        const start = performance.now()
        const outcome = await hook.run(input)
        const ms = performance.now() - start
        if (outcome.status !== 'done') throw new Error(`worker run ended ${outcome.status}`)
        if (i < 2) continue // warm-up (the first run also loads the worker)
        wall.push(ms)
        inWorker.push(outcome.elapsedMs!)
        y = outcome.yield!
      }
      return { wall, inWorker, y }
    }, { input: benchInput(), runs })
  }
  finally {
    await browser.close()
    await server.stop()
  }
  return { medianMs: median(out.wall), minMs: Math.min(...out.wall), workerMedianMs: median(out.inWorker), yield: out.y }
}

export async function runMonteCarloBench(runs = 9): Promise<MonteCarloBenchResult> {
  const node = timeNode(runs)
  let worker: MonteCarloBenchResult['worker'] = null
  let workerError: string | null = null
  try {
    worker = await timeWorker(runs)
  }
  catch (error) {
    workerError = error instanceof Error ? error.message : String(error)
  }
  return { trials: 10_000, frequencies: 201, elements: 6, runs, node, worker, workerError }
}

export function printMonteCarloBench(r: MonteCarloBenchResult): void {
  const size = `${r.trials.toLocaleString('en')} trials × ${r.frequencies} frequencies × ${r.elements} elements`
  console.log(`montecarlo: ${size} in Node: median ${r.node.medianMs.toFixed(1)} ms, fastest ${r.node.minMs.toFixed(1)} ms over ${r.runs} runs (target < 300 ms); yield ${r.node.yield}`)
  if (r.worker) {
    console.log(`montecarlo: the same in the board page's worker (Chromium): median ${r.worker.medianMs.toFixed(1)} ms from start to result on the page, ${r.worker.workerMedianMs.toFixed(1)} ms inside the worker, fastest ${r.worker.minMs.toFixed(1)} ms; yield ${r.worker.yield}${r.worker.yield === r.node.yield ? ' (same as Node)' : ' (DIFFERS from Node)'}`)
  }
  else console.log(`montecarlo: worker run failed: ${r.workerError}`)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  void runMonteCarloBench().then(printMonteCarloBench)
}
