// Finite-Q ladders shared by the losses and stress tests: each as RF-core element JSON and as the
// same circuit for ngspice (the product's netlist export: ESR = |X|/Q at the analysis frequency).
import { rlcImpedance, type Complex, type Element } from '../../../shared/rf/index'
import type { SpiceCircuit, SpiceRlc } from './spice-ladder'

export type LadderCase = {
  name: string
  frequencyHz: number
  source: SpiceRlc
  load: SpiceRlc
  elements: Element[]
}

const TWO_PI = 2 * Math.PI

export const LADDER_CASES: LadderCase[] = [
  {
    // An L match of a capacitive chip antenna (18 Ω with 9.66 pF in series) to 50 Ω.
    name: 'series L (Q 45), shunt C (Q 200), 50 Ω source',
    frequencyHz: 915e6,
    source: { r: 50 },
    load: { r: 18, c: 5.436e-12 },
    elements: [
      { kind: 'L', placement: 'series', value: 10e-9, q: 45 },
      { kind: 'C', placement: 'shunt', value: 3.9e-12, q: 200 },
    ],
  },
  {
    // A pi network behind a 30° line, into an inductive load, from a complex source.
    name: 'line, shunt C (Q 120), series L (Q 30), shunt C (Q 90), series R; 25 Ω + 1.1 nH source',
    frequencyHz: 2.44e9,
    source: { r: 25, l: 1.1e-9 },
    load: { r: 12, l: 0.8e-9 },
    elements: [
      { kind: 'line', z0: 50, deg: 30 },
      { kind: 'C', placement: 'shunt', value: 2.2e-12, q: 120 },
      { kind: 'L', placement: 'series', value: 3.3e-9, q: 30 },
      { kind: 'C', placement: 'shunt', value: 1.5e-12, q: 90 },
      { kind: 'R', placement: 'series', value: 1.2 },
    ],
  },
  {
    // A shunt open stub and a shunt short stub with lossy lumped parts between them.
    name: 'open stub, series C (Q 150), short stub, shunt L (Q 25)',
    frequencyHz: 868e6,
    source: { r: 50 },
    load: { r: 120, c: 1.2e-12 },
    elements: [
      { kind: 'stub', end: 'open', placement: 'shunt', z0: 60, deg: 40 },
      { kind: 'C', placement: 'series', value: 4.7e-12, q: 150 },
      { kind: 'stub', end: 'short', placement: 'shunt', z0: 45, deg: 70 },
      { kind: 'L', placement: 'shunt', value: 22e-9, q: 25 },
    ],
  },
]

/**
 * ESR = |X|/Q at `f` for a lumped L or C with a Q (the constant-Q model), R: its resistance,
 * written here apart from the RF core so that the netlist's ESR resistors are checked, not trusted.
 */
export function esrOf(e: Element, f: number): number {
  if (e.kind === 'R') return e.value
  if ((e.kind !== 'L' && e.kind !== 'C') || e.q === undefined) return 0
  const x = e.kind === 'L' ? TWO_PI * f * e.value : 1 / (TWO_PI * f * e.value)
  return x / e.q
}

/** The case as a SPICE circuit at `f` (default: the case's frequency), driven by `sourceVolts` RMS. */
export function circuitOf(c: LadderCase, sourceVolts: number, f = c.frequencyHz): SpiceCircuit {
  return { frequencyHz: f, sourceVolts, source: c.source, load: c.load, elements: c.elements }
}

/** The R-L/R-C model's impedance at f, through the RF core's terminal model. */
export function impedanceOfModel(m: SpiceRlc, f: number): Complex {
  return rlcImpedance({ topology: 'series', r: m.r, l: m.l, c: m.c }, f)
}

/** Lines and stubs pinned to `fRef` (needed for a band sweep). */
export function withFRef(elements: Element[], fRef: number): Element[] {
  return elements.map(e => (e.kind === 'line' || e.kind === 'stub') ? { ...e, fRef } : e)
}
