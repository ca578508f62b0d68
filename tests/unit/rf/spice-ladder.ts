// A ladder as an ngspice netlist, and a runner for ngspice's AC analysis (`ngspice -b`, Debian's
// ngspice 39): the independent check for losses and stress. Each part is a physical SPICE element;
// finite Q is a plain resistor in series (ESR = |X|/Q at the one analysis frequency), so every
// run is at a single frequency. A 0 V source in series with each part is its ammeter.
import { spawnSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Complex } from '../../../shared/rf/index'

export type SpicePart =
  | { kind: 'L' | 'C' | 'R', placement: 'series' | 'shunt', value: number, esr?: number }
  | { kind: 'line', z0: number, deg: number }
  | { kind: 'stub', end: 'open' | 'short', placement: 'shunt', z0: number, deg: number }

/** A load or source model: R in series with an optional L or C. */
export type SpiceRlc = { r: number, l?: number, c?: number }

export type SpiceCircuit = {
  frequencyHz: number
  /** RMS open-circuit voltage of the source (AC analysis is linear, so RMS in gives RMS out). */
  sourceVolts: number
  source: SpiceRlc
  load: SpiceRlc
  parts: SpicePart[]
}

/** What ngspice AC analysis reports: node voltages and ammeter currents as complex phasors. */
export type SpiceResult = {
  /** v(n{i}): the node on the load side of element i (n0 the load node, n{N} the input node). */
  node: Complex[]
  /** Current through the ammeter of element i (for a line: its source-side end). */
  current: Complex[]
  /** For a line: current at its load-side end; for a stub: the far end's voltage (open) or current (short). */
  far: (Complex | null)[]
  inputCurrent: Complex
  loadCurrent: Complex
}

function rlcLines(name: string, from: string, to: string, m: SpiceRlc): string[] {
  const lines = [`R${name} ${from} ${name}x ${m.r}`]
  if (m.l !== undefined) lines.push(`L${name} ${name}x ${to} ${m.l}`)
  else if (m.c !== undefined) lines.push(`C${name} ${name}x ${to} ${m.c}`)
  else lines.push(`V${name}w ${name}x ${to} DC 0`)
  return lines
}

/** The netlist text and the list of probe vectors, in the order they are written. */
export function netlistOf(c: SpiceCircuit): { text: string, probes: string[] } {
  const td = (deg: number) => deg / (360 * c.frequencyHz)
  const lines: string[] = ['ladder check']
  const probes: string[] = []
  let node = 0
  lines.push('Vload n0 ld DC 0', ...rlcLines('ld', 'ld', '0', c.load))
  c.parts.forEach((p, i) => {
    const here = `n${node}`
    if (p.kind === 'line') {
      const up = `n${++node}`
      lines.push(`Va${i} ${up} m${i} DC 0`, `T${i} m${i} 0 k${i} 0 Z0=${p.z0} TD=${td(p.deg)}`, `Vb${i} k${i} ${here} DC 0`)
      return
    }
    if (p.kind === 'stub') {
      lines.push(`Va${i} ${here} m${i} DC 0`, `T${i} m${i} 0 e${i} 0 Z0=${p.z0} TD=${td(p.deg)}`)
      if (p.end === 'short') lines.push(`Vb${i} e${i} 0 DC 0`)
      return
    }
    const top = p.placement === 'series' ? `n${++node}` : here
    const bottom = p.placement === 'series' ? here : '0'
    const esrNode = p.esr !== undefined ? `r${i}` : bottom
    lines.push(`Va${i} ${top} m${i} DC 0`, `${p.kind}${i} m${i} ${esrNode} ${p.value}`)
    if (p.esr !== undefined) lines.push(`Resr${i} r${i} ${bottom} ${p.esr}`)
  })
  lines.push(`Vin s1 n${node} DC 0`, ...rlcLines('src', 'src0', 's1', c.source), `Vgen src0 0 DC 0 AC ${c.sourceVolts}`)
  for (let k = 0; k <= node; k++) probes.push(`v(n${k})`)
  c.parts.forEach((p, i) => {
    probes.push(`i(Va${i})`)
    if (p.kind === 'line') probes.push(`i(Vb${i})`)
    if (p.kind === 'stub') probes.push(p.end === 'open' ? `v(e${i})` : `i(Vb${i})`)
  })
  probes.push('i(Vin)', 'i(Vload)')
  return { text: lines.join('\n'), probes }
}

/** Runs ngspice AC analysis at the circuit's one frequency and reads every probe. */
export function runSpice(c: SpiceCircuit): SpiceResult {
  const { text, probes } = netlistOf(c)
  const dir = mkdtempSync(join(tmpdir(), 'gb-spice-'))
  try {
    const out = join(dir, 'out.txt')
    const vectors = probes.flatMap(p => [`real(${p})`, `imag(${p})`]).join(' ')
    const netlist = [
      text,
      '.option rshunt=1e15',
      '.control',
      'set numdgt=16',
      `ac lin 1 ${c.frequencyHz} ${c.frequencyHz}`,
      `wrdata ${out} ${vectors}`,
      '.endc',
      '.end',
      '',
    ].join('\n')
    const file = join(dir, 'ladder.cir')
    writeFileSync(file, netlist)
    // ngspice 39 exits with 1 whenever a T line is in the circuit, even after a clean analysis,
    // so the exit code says nothing: the check is that every probe came back as a number.
    const run = spawnSync('ngspice', ['-b', file], { encoding: 'utf8' })
    if (run.error) throw run.error
    const numbers = existsSync(out) ? readFileSync(out, 'utf8').trim().split(/\s+/).map(Number) : []
    if (numbers.length !== 4 * probes.length || numbers.some(x => !Number.isFinite(x))) {
      throw new Error(`ngspice gave ${numbers.length} numbers for ${probes.length} probes:\n${run.stdout}\n${run.stderr}`)
    }
    // wrdata writes "frequency value" per vector: keep every second number.
    const values = numbers.filter((_, k) => k % 2 === 1)
    const at = (p: string): Complex => {
      const k = probes.indexOf(p)
      if (k < 0) throw new Error(`no probe ${p}`)
      return { re: values[2 * k]!, im: values[2 * k + 1]! }
    }
    const nodeCount = probes.filter(p => p.startsWith('v(n')).length
    return {
      node: Array.from({ length: nodeCount }, (_, k) => at(`v(n${k})`)),
      current: c.parts.map((_, i) => at(`i(Va${i})`)),
      far: c.parts.map((p, i) => p.kind === 'line' ? at(`i(Vb${i})`) : p.kind === 'stub' ? at(p.end === 'open' ? `v(e${i})` : `i(Vb${i})`) : null),
      inputCurrent: at('i(Vin)'),
      loadCurrent: at('i(Vload)'),
    }
  }
  finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

export const abs = (z: Complex) => Math.hypot(z.re, z.im)
