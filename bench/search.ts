// Match search: E24, up to 3 parts, 21 frequencies, lossless and with Q (L 40, C 200):
// (1) searchMatches in this Node process (median of several runs after a warm-up);
// (2) a plain exhaustive enumeration of the same set in C (bench/search-exhaustive.c, compiled
//     here with the system cc -O3), one run each, and the ratio Node / C (target ≤ 0.05, and
//     under 1 s in Node); the C best must equal the search's best.
// The worker and live fan-out parts (they need a build and Chromium) are in bench/search-live.ts.
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { SEARCH_VALUE_RANGES, returnLossDb, searchMatches, standardValuesBetween, type SearchInput, type SearchQ } from '../shared/rf/index'

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

/** An invented 2.4 GHz chip antenna: a series R-C-like load moving across 2.30–2.50 GHz, 21 points. */
export function searchBenchInput(q?: SearchQ): SearchInput {
  const frequencies = Array.from({ length: 21 }, (_, i) => 2.3e9 + (i * 0.2e9) / 20)
  const load = frequencies.map((f) => ({ re: 14 + 4 * (f / 2.4e9 - 1), im: -28 * (2.4e9 / f) + 6 }))
  return { z0: 50, frequencies, load, series: 'E24', maxElements: 3, q }
}

export type SearchBenchCase = {
  label: string
  nodeMedianMs: number
  nodeMinMs: number
  bestDb: number
  scored: number
  searched: number
  exhaustive: { seconds: number; ladders: number; bestDb: number } | { error: string }
}

function exhaustiveInput(input: SearchInput): string {
  const freqs = Array.from(input.frequencies)
  const loads = Array.isArray(input.load) ? input.load : freqs.map(() => input.load)
  const parts: string[] = []
  for (const isSeries of [1, 0]) {
    for (const [kind, code] of [['L', 0], ['C', 1]] as const) {
      const [min, max] = SEARCH_VALUE_RANGES[kind]
      for (const v of standardValuesBetween(input.series, min, max)) parts.push(`${code} ${isSeries} ${v} ${input.q?.[kind] ?? 0}`)
    }
  }
  return [`${input.z0} ${freqs.length}`, ...freqs.map((f, i) => `${f} ${(loads as { re: number; im: number }[])[i]!.re} ${(loads as { re: number; im: number }[])[i]!.im}`), String(parts.length), ...parts, ''].join('\n')
}

function compileExhaustive(dir: string): string {
  const source = fileURLToPath(new URL('./search-exhaustive.c', import.meta.url))
  const binary = join(dir, 'search-exhaustive')
  execFileSync('cc', ['-O3', '-march=native', '-o', binary, source, '-lm'], { stdio: 'pipe' })
  return binary
}

export function runSearchBench(runs = 7): SearchBenchCase[] {
  const dir = mkdtempSync(join(tmpdir(), 'gammaboard-search-bench-'))
  try {
    let binary: string | null = null
    let compileError = ''
    try { binary = compileExhaustive(dir) } catch (error) { compileError = String(error) }
    return [['lossless', undefined], ['Q (L 40, C 200)', { L: 40, C: 200 }]].map(([label, q]) => {
      const input = searchBenchInput(q as SearchQ | undefined)
      searchMatches(input) // warm-up
      const times: number[] = []
      let result = searchMatches(input)
      for (let i = 0; i < runs; i++) {
        const start = performance.now()
        result = searchMatches(input)
        times.push(performance.now() - start)
      }
      let exhaustive: SearchBenchCase['exhaustive'] = { error: compileError || 'not run' }
      if (binary) {
        const out = spawnSync(binary, ['3'], { input: exhaustiveInput(input), encoding: 'utf8', maxBuffer: 1 << 20 })
        const [gamma, ladders, seconds] = out.stdout.trim().split(/\s+/).map(Number)
        exhaustive = out.status === 0 ? { seconds: seconds!, ladders: ladders!, bestDb: returnLossDb(gamma!) } : { error: out.stderr || `exit ${out.status}` }
      }
      return {
        label: label as string,
        nodeMedianMs: median(times),
        nodeMinMs: Math.min(...times),
        bestDb: result.candidates[0]!.worstReturnLossDb,
        scored: result.scored,
        searched: result.searched,
        exhaustive,
      }
    })
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

export function printSearchBench(cases: SearchBenchCase[]): void {
  for (const c of cases) {
    console.log(`search (${c.label}): E24, 1–3 parts, 21 frequencies, ${c.searched.toExponential(3)} ladders: Node median ${c.nodeMedianMs.toFixed(0)} ms, fastest ${c.nodeMinMs.toFixed(0)} ms (target < 1000 ms); ${c.scored} scored; best ${c.bestDb.toFixed(3)} dB`)
    if ('error' in c.exhaustive) console.log(`search (${c.label}): exhaustive C run failed: ${c.exhaustive.error}`)
    else {
      const ratio = c.nodeMedianMs / 1000 / c.exhaustive.seconds
      const same = Math.abs(c.exhaustive.bestDb - c.bestDb) < 1e-6 ? 'same best' : `DIFFERENT best ${c.exhaustive.bestDb.toFixed(3)} dB`
      console.log(`search (${c.label}): plain exhaustive enumeration in C (cc -O3): ${c.exhaustive.seconds.toFixed(2)} s for ${c.exhaustive.ladders.toExponential(3)} ladders, ${same}; ratio Node/C ${ratio.toFixed(4)} (target ≤ 0.05)`)
    }
  }
}
