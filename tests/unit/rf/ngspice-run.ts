// Running ngspice (Debian's ngspice 39, `ngspice -b`) on a deck built around the product's own
// netlists (spiceNetlist), and reading its AC analysis back. One place for the batch run, the
// exit-code quirk and the wrdata format, shared by every ngspice check.
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import type { Complex } from '../../../shared/rf/index'

/** One `ac` analysis and the complex vectors to write after it (`v(in)`, `i(v.x1.va2)`, …). */
export type AcRun = { analysis: string, vectors: readonly string[] }

/** One row of a run: the frequency and each vector's complex value, in the order asked. */
export type AcRow = { frequency: number, values: Complex[] }

export function requireNgspice(): void {
  const found = spawnSync('sh', ['-c', 'command -v ngspice'], { encoding: 'utf8' })
  if (found.status !== 0 || found.stdout.trim() === '') {
    throw new Error('ngspice is not on PATH: run `bash scripts/ensure-system-deps.sh` as root (npm test does this first)')
  }
}

/** ngspice's `ac lin N f1 f2` (a single point when f1 = f2). */
export const acLin = (points: number, f1: number, f2 = f1) => `ac lin ${points} ${f1} ${f2}`

/**
 * Runs ngspice in batch mode on `body` (subcircuits, instances, sources) with `options` lines,
 * one `ac` analysis per run, and returns each run's rows. Throws with the end of ngspice's log
 * when a run wrote nothing or the wrong count of numbers.
 */
export function runAc(title: string, options: readonly string[], body: readonly string[], runs: readonly AcRun[]): AcRow[][] {
  const dir = mkdtempSync(path.join(tmpdir(), 'gb-ngspice-'))
  try {
    const control = ['.control', 'set numdgt=16']
    runs.forEach((r, j) => control.push(r.analysis, `wrdata ${path.join(dir, `run${j}.txt`)} ${r.vectors.join(' ')}`))
    control.push('quit', '.endc')
    const file = path.join(dir, 'deck.cir')
    writeFileSync(file, [title, ...options, ...body, ...control, '.end', ''].join('\n'))
    const run = spawnSync('ngspice', ['-b', file], { encoding: 'utf8', timeout: 60_000 })
    if (run.error) throw run.error
    // ngspice 39 exits with 1 whenever a T line is in the circuit, even after a clean analysis,
    // so the exit code says nothing: the check is that every vector came back as numbers.
    const log = `${run.stdout ?? ''}${run.stderr ?? ''}`
    return runs.map((r, j) => {
      const out = path.join(dir, `run${j}.txt`)
      if (!existsSync(out)) throw new Error(`ngspice (exit ${run.status}) wrote no result for run ${j}; its log ends:\n${log.slice(-2000)}`)
      // wrdata writes, for each complex vector, "frequency re im" on every row.
      return readFileSync(out, 'utf8').trim().split('\n').map((line) => {
        const cols = line.trim().split(/\s+/).map(Number)
        if (cols.length !== 3 * r.vectors.length || cols.some(x => !Number.isFinite(x))) {
          throw new Error(`ngspice run ${j} row has ${cols.length} numbers for ${r.vectors.length} vectors:\n${line}\n${log.slice(-2000)}`)
        }
        return { frequency: cols[0]!, values: r.vectors.map((_, k) => ({ re: cols[3 * k + 1]!, im: cols[3 * k + 2]! })) }
      })
    })
  }
  finally {
    if (!process.env.KEEP_NGSPICE) rmSync(dir, { recursive: true, force: true })
  }
}
