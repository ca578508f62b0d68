// Touchstone reading and writing speed: a generated 100,000-line .s2p (MA, MHz), parsed and written
// several times in this process; the median and the fastest run are reported (target: parse < 300 ms),
// in wall time and in this process's CPU time (steadier when other processes share the cores).
import { pathToFileURL } from 'node:url'
import { parseTouchstone, writeTouchstone } from '../shared/rf/touchstone'
import { sampleS2p } from './touchstone-sample'

export interface TouchstoneBenchResult {
  rows: number
  bytes: number
  runs: number
  parse: RunTimes
  write: RunTimes
}

interface RunTimes { medianMs: number, minMs: number, medianCpuMs: number }

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

function timeRuns(runs: number, work: () => void): RunTimes {
  const wall: number[] = []
  const cpu: number[] = []
  for (let run = 0; run < runs; run++) {
    const before = process.cpuUsage()
    const start = performance.now()
    work()
    wall.push(performance.now() - start)
    const used = process.cpuUsage(before)
    cpu.push((used.user + used.system) / 1000)
  }
  return { medianMs: median(wall), minMs: Math.min(...wall), medianCpuMs: median(cpu) }
}

export function runTouchstoneBench(rows = 100_000, runs = 9): TouchstoneBenchResult {
  const text = sampleS2p(rows)
  const parse = timeRuns(runs, () => {
    if (parseTouchstone(text, 'bench.s2p').frequencies.length !== rows) throw new Error('the sample did not read back whole')
  })
  const data = parseTouchstone(text, 'bench.s2p')
  const write = timeRuns(runs, () => {
    writeTouchstone({ ...data, format: 'MA', unit: 'MHZ' })
  })
  return { rows, bytes: text.length, runs, parse, write }
}

export function printTouchstoneBench(r: TouchstoneBenchResult): void {
  const mb = (r.bytes / 1024 / 1024).toFixed(1)
  console.log(`touchstone: parse ${r.rows.toLocaleString('en')}-line .s2p (${mb} MiB): median ${r.parse.medianMs.toFixed(1)} ms, fastest ${r.parse.minMs.toFixed(1)} ms, median CPU ${r.parse.medianCpuMs.toFixed(1)} ms over ${r.runs} runs (target < 300 ms)`)
  console.log(`touchstone: write the same data (MA, MHz): median ${r.write.medianMs.toFixed(1)} ms, fastest ${r.write.minMs.toFixed(1)} ms, median CPU ${r.write.medianCpuMs.toFixed(1)} ms`)
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printTouchstoneBench(runTouchstoneBench())
}
