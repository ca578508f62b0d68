// A ladder between a source and a load, simulated by ngspice AC analysis: the independent check for
// losses and stress. The ladder itself is the product's own export (spiceLadder with probes: a 0 V
// source in series with each part as its ammeter), instanced once between an R-L/R-C source and
// load written here; finite Q is the export's series ESR at the one analysis frequency.
import { spiceLadder, type Complex, type Element } from '../../../shared/rf/index'
import { acLin, runAc } from './ngspice-run'

/** A load or source model: R in series with an optional L or C. */
export type SpiceRlc = { r: number, l?: number, c?: number }

export type SpiceCircuit = {
  frequencyHz: number
  /** RMS open-circuit voltage of the source (AC analysis is linear, so RMS in gives RMS out). */
  sourceVolts: number
  source: SpiceRlc
  load: SpiceRlc
  elements: Element[]
}

/** What ngspice AC analysis reports: node voltages and ammeter currents as complex phasors. */
export type SpiceResult = {
  /** The ladder's nodes from the load (`[0]`) to the input (last): one more than the series steps. */
  node: Complex[]
  /** Current through the ammeter of element i, into the part (for a line: its source-side end). */
  current: Complex[]
  /** For a line: current at its load-side end; for a stub: the far end's voltage (open) or current (short). */
  far: (Complex | null)[]
  inputCurrent: Complex
  loadCurrent: Complex
  /** The ESR (Ω) the export gave each element at the analysis frequency (R: its resistance). */
  esr: readonly number[]
}

function rlcLines(name: string, from: string, to: string, m: SpiceRlc): string[] {
  const lines = [`R${name} ${from} ${name}x ${m.r}`]
  if (m.l !== undefined) lines.push(`L${name} ${name}x ${to} ${m.l}`)
  else if (m.c !== undefined) lines.push(`C${name} ${name}x ${to} ${m.c}`)
  else lines.push(`V${name}w ${name}x ${to} DC 0`)
  return lines
}

/** Runs ngspice AC analysis of the circuit at its one frequency and reads every probe. */
export function runSpice(c: SpiceCircuit): SpiceResult {
  const ladder = spiceLadder(c.elements, { name: 'ladder', frequency: c.frequencyHz, probes: true })
  // Ports of the instance: src → nsrc, ld → nld; everything else is inside x1.
  const outer = (n: string) => (n === 'src' ? 'nsrc' : n === 'ld' ? 'nld' : `x1.${n}`)
  const nodes = [...new Set(ladder.nodes)]
  const body = [
    ladder.text,
    'X1 nsrc nld ladder',
    'Vload nld lterm DC 0', ...rlcLines('ld', 'lterm', '0', c.load),
    'Vin s1 nsrc DC 0', ...rlcLines('src', 'src0', 's1', c.source), `Vgen src0 0 DC 0 AC ${c.sourceVolts}`,
  ]
  const amm = (name: string) => `i(v.x1.${name.toLowerCase()})`
  const vectors = [
    ...nodes.map(n => `v(${outer(n)})`),
    ...ladder.ammeters.map((a, i) => {
      if (a === null) throw new Error(`element ${i} has no ammeter`)
      return amm(a)
    }),
    ...ladder.far.flatMap(f => (f === null ? [] : [f.startsWith('V') ? amm(f) : `v(x1.${f})`])),
    'i(Vin)', 'i(Vload)',
  ]
  const [row] = runAc('ladder check', ['.option rshunt=1e15'], body, [{ analysis: acLin(1, c.frequencyHz), vectors }])[0]!
  const values = row!.values
  let k = nodes.length + ladder.ammeters.length
  return {
    node: values.slice(0, nodes.length),
    current: values.slice(nodes.length, nodes.length + ladder.ammeters.length),
    far: ladder.far.map(f => (f === null ? null : values[k++]!)),
    inputCurrent: values[values.length - 2]!,
    loadCurrent: values[values.length - 1]!,
    esr: ladder.esr,
  }
}

export const abs = (z: Complex) => Math.hypot(z.re, z.im)
