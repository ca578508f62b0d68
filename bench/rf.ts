// RF core speed: trace of a 10-element ladder, a 1001-point × 10-element band sweep (against
// numpy's vectorised sweep of the same ladder and band, run by bench/numpy_sweep.py in the same
// run, with the ratio and the largest relative difference of the results), and solveL per call.
// On a shared machine the median wanders with the load, so the fastest run is reported too and
// the sweep and numpy timings alternate over several rounds.
import { spawnSync } from 'node:child_process'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { solveL, sweep, sweepFlat, trace, type Complex, type Element } from '../shared/rf/index'

type Timing = { medianUs: number; minUs: number }

export interface RfBenchResult {
  trace: Timing
  sweep: Timing
  sweepFlat: Timing
  solveL: Timing
  numpy: (Timing & { version: string }) | { error: string }
  /** ours/numpy, median of the per-round ratios of medians, and of the fastest runs. */
  ratio?: { sweep: Timing; sweepFlat: Timing }
  maxRelDiff?: number
}

const F0 = 2.44e9
/** A 10-element ladder with every kind (finite Q on some parts), specified at 2.44 GHz. */
export const BENCH_LADDER: Element[] = [
  { kind: 'C', placement: 'shunt', value: 1.2e-12, q: 300 },
  { kind: 'L', placement: 'series', value: 3.3e-9, q: 60 },
  { kind: 'line', z0: 50, deg: 30, fRef: F0 },
  { kind: 'C', placement: 'shunt', value: 0.8e-12 },
  { kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 40, fRef: F0 },
  { kind: 'L', placement: 'series', value: 2.2e-9 },
  { kind: 'R', placement: 'series', value: 0.5 },
  { kind: 'line', z0: 35, deg: 20, fRef: F0 },
  { kind: 'C', placement: 'series', value: 4.7e-12, q: 400 },
  { kind: 'xfmr', ratio: 1.2 },
]
export const BENCH_LOAD: Complex = { re: 42, im: -18 }
export const BENCH_BAND = Array.from({ length: 1001 }, (_, i) => 2.0e9 + (0.9e9 * i) / 1000)

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

/** Time per call (µs) over `runs` runs of `inner` calls each, after a warm-up. */
function perCall(runs: number, inner: number, work: () => unknown): Timing {
  for (let i = 0; i < inner; i++) work()
  const times: number[] = []
  for (let r = 0; r < runs; r++) {
    const start = performance.now()
    for (let i = 0; i < inner; i++) work()
    times.push(((performance.now() - start) * 1000) / inner)
  }
  return { medianUs: median(times), minUs: Math.min(...times) }
}

type NumpyRun = Timing & { version: string; re: number[]; im: number[] }

function runNumpy(repeats: number): NumpyRun | { error: string } {
  const script = fileURLToPath(new URL('./numpy_sweep.py', import.meta.url))
  const input = JSON.stringify({ z0: 50, frequencies: BENCH_BAND, load: BENCH_LOAD, elements: BENCH_LADDER, repeats })
  const run = spawnSync('python3', [script], { input, encoding: 'utf8', timeout: 120_000 })
  if (run.status !== 0) return { error: (run.stderr || run.error?.message || 'python3 failed').trim().slice(-400) }
  const out = JSON.parse(run.stdout) as { medianMs: number; minMs: number; numpy: string; re: number[]; im: number[] }
  return { medianUs: out.medianMs * 1000, minUs: out.minMs * 1000, version: out.numpy, re: out.re, im: out.im }
}

const combine = (ts: Timing[]): Timing => ({ medianUs: median(ts.map((t) => t.medianUs)), minUs: Math.min(...ts.map((t) => t.minUs)) })

/** Sweep timings alternate with numpy runs over `rounds` rounds so that both see the same load. */
export function runRfBench(rounds = 5): RfBenchResult {
  const args = { z0: 50, frequency: F0, load: BENCH_LOAD, elements: BENCH_LADDER }
  const sweepArgs = { z0: 50, frequencies: BENCH_BAND, load: BENCH_LOAD, elements: BENCH_LADDER }
  const traceT = perCall(15, 2000, () => trace(args))
  const solveLT = perCall(15, 2000, () => solveL({ z0: 50, frequency: F0, from: { re: 12, im: -30 }, to: { re: 50, im: 0 } }))
  for (let i = 0; i < 400; i++) {
    sweep(sweepArgs)
    sweepFlat(sweepArgs)
  }
  const rows: { sweep: Timing; flat: Timing; numpy: NumpyRun }[] = []
  for (let round = 0; round < rounds; round++) {
    // Each call timed on its own, as numpy_sweep.py times each of its runs.
    const s = perCall(200, 1, () => sweep(sweepArgs))
    const f = perCall(200, 1, () => sweepFlat(sweepArgs))
    const np = runNumpy(200)
    if ('error' in np) return { trace: traceT, sweep: s, sweepFlat: f, solveL: solveLT, numpy: np }
    rows.push({ sweep: s, flat: f, numpy: np })
    if (process.env.RF_BENCH_ROUNDS) {
      console.log(`  round ${round + 1}: sweep ${s.medianUs.toFixed(1)}/${s.minUs.toFixed(1)} µs, sweepFlat ${f.medianUs.toFixed(1)}/${f.minUs.toFixed(1)} µs, numpy ${np.medianUs.toFixed(1)}/${np.minUs.toFixed(1)} µs (median/fastest)`)
    }
  }
  const ratioOf = (pick: (r: (typeof rows)[number]) => Timing): Timing => ({
    medianUs: median(rows.map((r) => pick(r).medianUs / r.numpy.medianUs)),
    minUs: median(rows.map((r) => pick(r).minUs / r.numpy.minUs)),
  })
  const reference = rows[rows.length - 1]!.numpy
  const ours = sweep(sweepArgs)
  const maxRelDiff = Math.max(...ours.map((z, i) => {
    const re = reference.re[i]!
    const im = reference.im[i]!
    return Math.hypot(z.re - re, z.im - im) / Math.hypot(re, im)
  }))
  return {
    trace: traceT, solveL: solveLT,
    sweep: combine(rows.map((r) => r.sweep)), sweepFlat: combine(rows.map((r) => r.flat)),
    numpy: { ...combine(rows.map((r) => r.numpy)), version: reference.version },
    ratio: { sweep: ratioOf((r) => r.sweep), sweepFlat: ratioOf((r) => r.flat) },
    maxRelDiff,
  }
}

const fmt = (t: Timing, digits = 1) => `median ${t.medianUs.toFixed(digits)} µs, fastest ${t.minUs.toFixed(digits)} µs`

export function printRfBench(r: RfBenchResult): void {
  console.log(`rf: trace, 10 elements: ${fmt(r.trace, 2)} per call`)
  console.log(`rf: sweep, 1001 frequencies × 10 elements: ${fmt(r.sweep)} per call ({re, im}[] out)`)
  console.log(`rf: sweepFlat, the same band (Float64Array out): ${fmt(r.sweepFlat)} per call`)
  console.log(`rf: solveL (complex to real, both topologies): ${fmt(r.solveL, 2)} per call`)
  if ('error' in r.numpy) {
    console.log(`rf: numpy reference sweep not run: ${r.numpy.error}`)
    return
  }
  console.log(`rf: numpy ${r.numpy.version} vectorised sweep of the same ladder and band: ${fmt(r.numpy)}`)
  const q = r.ratio!
  console.log(`rf: ratio ours/numpy (target ≤ 1.0): sweep ${q.sweep.medianUs.toFixed(2)} by medians, ${q.sweep.minUs.toFixed(2)} by fastest runs; sweepFlat ${q.sweepFlat.medianUs.toFixed(2)} / ${q.sweepFlat.minUs.toFixed(2)}`)
  console.log(`rf: max relative difference between our sweep and numpy's: ${r.maxRelDiff!.toExponential(2)}`)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printRfBench(runRfBench())
}
