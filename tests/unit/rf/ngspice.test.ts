// Independent check of the RF core against ngspice AC analysis: random ladders (fixed seed) of
// L, C and R in series and shunt (some with finite Q, the ESR added as a resistor in series with
// the part, valued at the analysis frequency), lossless lines and stubs as SPICE T elements
// (TD = deg/(360·fRef)) and ideal transformers (E + F sources), on random loads. The circuits go
// into two netlists (R-L-C ladders, and ladders with lines, stubs and transformers), each holding
// its circuits as independent networks driven by their own 1 A AC current source so that
// V(in_k) = Zin_k, with one `ac` run per analysis frequency: ngspice start-up is what costs time.
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import seedrandom from 'seedrandom'
import { inputImpedance, type Complex, type Element } from '../../../shared/rf/index'
import { REL_TOL, complexError } from './reference'
import { randomLadder } from './random-ladders'

const SOURCE = 'ngspice AC analysis'
const FREQUENCIES = [1e6, 13.56e6, 100e6, 433.92e6, 915e6, 2.45e9]
const PER_FREQUENCY = 40 // 240 circuits

type Batch = 'lumped' | 'distributed'
type Circuit = {
  id: number
  batch: Batch
  frequency: number
  load: { r: number; l?: number; c?: number }
  elements: Element[]
  inputNode?: string
}

/**
 * A distributed ladder made solvable at DC, which ngspice needs before an AC run when the circuit
 * holds T, E or F elements (its NOOPAC option only applies to R-L-C circuits): every inductor has
 * a finite Q (its ESR breaks loops of inductors, lines and shorted stubs), and no series capacitor
 * or series open stub cuts a node off from ground. The RF core is checked on the same ladder.
 */
function dcSafe(e: Element, rng: () => number): Element {
  if (e.kind === 'L' && e.q === undefined) return { ...e, q: 20 + rng() * 200 }
  if (e.kind === 'C' && e.placement === 'series') return { ...e, placement: 'shunt' }
  if (e.kind === 'stub' && e.placement === 'series' && e.end === 'open') return { ...e, end: 'short' }
  return e
}

function makeCircuits(): Circuit[] {
  const rng = seedrandom('gammaboard-ngspice-ladders')
  const out: Circuit[] = []
  for (const f of FREQUENCIES) {
    for (let k = 0; k < PER_FREQUENCY; k++) {
      const w = 2 * Math.PI * f
      const batch: Batch = k % 2 === 0 ? 'lumped' : 'distributed'
      const r = 10 ** (rng() * 2.7)
      const x = (rng() - 0.5) * 600
      // Distributed circuits get an R + L load so that the load end has a DC path.
      const load = x > 0 || batch === 'distributed' ? { r, l: Math.abs(x) / w + 1e-12 } : { r, c: -1 / (w * x) }
      const length = 1 + Math.floor(rng() * 8)
      const elements = batch === 'lumped'
        ? randomLadder(rng, f, { length, kinds: ['L', 'C', 'R'] })
        : randomLadder(rng, f, { length, kinds: ['L', 'C', 'R', 'line', 'line', 'stub', 'stub', 'xfmr'] }).map((e) => dcSafe(e, rng))
      out.push({ id: out.length, batch, frequency: f, load, elements })
    }
  }
  return out
}

const num = (v: number) => v.toPrecision(17)

/** SPICE lines for one circuit; the input node is `in<k>`. */
function netlistOf(c: Circuit): string[] {
  const k = c.id
  const w = 2 * Math.PI * c.frequency
  const lines: string[] = [`* circuit ${k} at ${c.frequency} Hz`]
  let node = `n${k}_0`
  // Load: R, then L or C in series, to ground.
  lines.push(`RL${k} ${node} n${k}_l ${num(c.load.r)}`)
  if (c.load.l !== undefined) lines.push(`LL${k} n${k}_l 0 ${num(c.load.l)}`)
  else lines.push(`CL${k} n${k}_l 0 ${num(c.load.c!)}`)
  c.elements.forEach((e, i) => {
    const tag = `${k}_${i}`
    const next = `n${k}_${i + 1}`
    if (e.kind === 'block') throw new Error('no measured blocks in the SPICE ladders')
    const b = e.kind === 'line' || e.kind === 'xfmr' ? '' : e.placement === 'series' ? next : '0'
    switch (e.kind) {
      case 'L':
      case 'C':
      case 'R': {
        const esr = e.q === undefined || e.kind === 'R' ? 0 : e.kind === 'L' ? (w * e.value) / e.q : 1 / (w * e.value * e.q)
        const end = esr > 0 ? `m${tag}` : b
        lines.push(`${e.kind}${tag} ${node} ${end} ${num(e.value)}`)
        if (esr > 0) lines.push(`RQ${tag} m${tag} ${b} ${num(esr)}`)
        break
      }
      case 'line':
        lines.push(`T${tag} ${node} 0 ${next} 0 Z0=${num(e.z0)} TD=${num(e.deg / (360 * e.fRef!))}`)
        break
      case 'stub': {
        // The far port, referred to ground, is left open or shorted.
        lines.push(`T${tag} ${node} ${b} s${tag} 0 Z0=${num(e.z0)} TD=${num(e.deg / (360 * e.fRef!))}`)
        if (e.end === 'short') lines.push(`VS${tag} s${tag} 0 0`)
        break
      }
      case 'xfmr':
        // n:1 with n on the source side: V(next) = n·V(node), I(into node) = n·I(primary).
        lines.push(`E${tag} ${next} x${tag} ${node} 0 ${num(e.ratio)}`)
        lines.push(`VX${tag} x${tag} 0 0`)
        lines.push(`F${tag} 0 ${node} VX${tag} ${num(e.ratio)}`)
        break
    }
    if (e.kind === 'line' || e.kind === 'xfmr' || e.placement === 'series') node = next
  })
  lines.push(`I${k} 0 ${node} AC 1`)
  c.inputNode = node
  return lines
}

const circuits = makeCircuits()
const results = new Map<number, Complex>()
let workDir = ''

function requireNgspice(): void {
  const found = spawnSync('sh', ['-c', 'command -v ngspice'], { encoding: 'utf8' })
  if (found.status !== 0 || found.stdout.trim() === '') {
    throw new Error('ngspice is not on PATH: run `bash scripts/ensure-system-deps.sh` as root (npm test does this first)')
  }
}

function runBatch(batch: Batch): void {
  const members = circuits.filter((c) => c.batch === batch)
  const body = members.flatMap(netlistOf)
  const control = ['.control', 'set numdgt=16']
  FREQUENCIES.forEach((f, j) => {
    const group = members.filter((c) => c.frequency === f)
    control.push(`ac lin 1 ${num(f)} ${num(f)}`)
    control.push(`wrdata ${path.join(workDir, `${batch}${j}.txt`)} ${group.map((c) => `v(${c.inputNode})`).join(' ')}`)
  })
  control.push('quit', '.endc')
  // rshunt (1e-18 S at every node) gives capacitor-only nodes a DC path; noopac skips the DC
  // operating point of the R-L-C batch, which a linear AC run does not need.
  const options = batch === 'lumped' ? '.option rshunt=1e18 noopac' : '.option rshunt=1e18'
  const netlist = [`gammaboard ${batch} ladders`, options, ...body, ...control, '.end', ''].join('\n')
  const file = path.join(workDir, `${batch}.cir`)
  writeFileSync(file, netlist)
  const run = spawnSync('ngspice', ['-b', file], { encoding: 'utf8', timeout: 60_000 })
  const log = `${run.stdout ?? ''}${run.stderr ?? ''}`
  FREQUENCIES.forEach((f, j) => {
    const group = members.filter((c) => c.frequency === f)
    const out = path.join(workDir, `${batch}${j}.txt`)
    if (!existsSync(out)) throw new Error(`ngspice (exit ${run.status}) wrote no ${batch} result at ${f} Hz; its log ends:\n${log.slice(-2000)}`)
    const cols = readFileSync(out, 'utf8').trim().split(/\s+/).map(Number)
    if (cols.length !== 3 * group.length) throw new Error(`ngspice ${batch} output at ${f} Hz has ${cols.length} numbers, expected ${3 * group.length}`)
    group.forEach((c, i) => results.set(c.id, { re: cols[3 * i + 1]!, im: cols[3 * i + 2]! }))
  })
}

beforeAll(() => {
  requireNgspice()
  workDir = mkdtempSync(path.join(tmpdir(), 'gammaboard-ngspice-'))
  runBatch('lumped')
  runBatch('distributed')
}, 60_000)

afterAll(() => {
  if (workDir && !process.env.KEEP_NGSPICE) rmSync(workDir, { recursive: true, force: true })
})

describe(`trace against ${SOURCE} (${circuits.length} random ladders, two netlists)`, () => {
  it('covers at least 200 ladders, with finite-Q parts, lines, stubs and transformers among them', () => {
    expect(circuits.length).toBeGreaterThanOrEqual(200)
    const all = circuits.flatMap((c) => c.elements)
    expect(all.filter((e) => 'q' in e && e.q !== undefined).length).toBeGreaterThan(50)
    for (const kind of ['line', 'stub', 'xfmr', 'R'] as const) expect(all.some((e) => e.kind === kind)).toBe(true)
  })

  it('agrees on every ladder to 1e-6 relative, worst case included', () => {
    let worst = 0
    for (const c of circuits) {
      const w = 2 * Math.PI * c.frequency
      const load = { re: c.load.r, im: c.load.l !== undefined ? w * c.load.l : -1 / (w * c.load.c!) }
      worst = Math.max(worst, complexError(inputImpedance({ z0: 50, frequency: c.frequency, load, elements: c.elements }), results.get(c.id)!, 1e-9))
    }
    if (process.env.RF_REPORT) console.log(`worst relative difference against ngspice: ${worst.toExponential(2)}`)
    expect(worst, `source: ${SOURCE}`).toBeLessThanOrEqual(REL_TOL)
  })

  it.each(circuits.map((c) => [c.id, c.frequency, c.elements.map((e) => e.kind).join(' '), c] as const))(
    'ladder %i at %d Hz: %s',
    (_id, f, _kinds, c) => {
      const w = 2 * Math.PI * f
      const load = { re: c.load.r, im: c.load.l !== undefined ? w * c.load.l : -1 / (w * c.load.c!) }
      const ours = inputImpedance({ z0: 50, frequency: f, load, elements: c.elements })
      const spice = results.get(c.id)!
      expect(complexError(ours, spice, 1e-9), `source: ${SOURCE}; ours ${ours.re}${ours.im >= 0 ? '+' : ''}${ours.im}j, ngspice ${spice.re}${spice.im >= 0 ? '+' : ''}${spice.im}j`).toBeLessThanOrEqual(REL_TOL)
    },
  )
})
