/**
 * The SPICE hand-off: a ladder as one subcircuit `.subckt NAME src ld` (source-side node first,
 * load-side node second, ground `0`) that a circuit simulator (ngspice, and SPICE3 dialects in
 * general) runs unchanged.
 *
 * Element models, the same as trace and sweep use (points.ts):
 * - L and C are ideal parts; a finite Q adds a series resistor holding the ESR = |X|/Q at
 *   `frequency` (the constant-Q model; with a model's Q table, Q at `frequency`), so results with
 *   lossy parts hold at that one frequency. A part model's parasitics are parts too: an inductor's
 *   Cp = 1/((2π·srf)²·L) across it and its ESR, a capacitor's ESL in series, pads to ground at
 *   each end of a series part and at the live end of a shunt part (models.ts).
 * - R is a resistor; lines and stubs are lossless T elements, TD = deg/(360·fRef) with fRef
 *   defaulting to `frequency`; a short stub's far port is tied to ground.
 * - The transformer is ideal, n:1 with n on the source side, ground-referenced on both sides: a
 *   voltage-controlled voltage source V(out) = n·V(in) and a current-controlled current source
 *   returning n·I(out) into the load side (the usual E + F pair).
 * Special values follow the RF core: a part or line that is a short (L or R of 0, a 0° line or short
 * stub) becomes a 0 V source (a wire); one that is an open (C of 0, a 0° open stub) is left out.
 * Measured blocks and fixture-measured parts have no SPICE model and are refused.
 */
import type { Element } from './types'
import { RfInputError, requirePositive } from './errors'
import { electricalDegrees, elementImpedance, validateElements } from './elements'
import { partQAt } from './models'
import { isMeasuredPart } from './fixture'

/** Options for `spiceNetlist`. */
export type SpiceNetlistOptions = {
  /** The subcircuit's name (characters outside A–Z, a–z, 0–9 and _ become _). */
  readonly name: string
  /** Hz: the frequency at which finite-Q ESRs are valued and lengths without fRef are taken. */
  readonly frequency: number
  /** Lines of the header comment (e.g. the board's name); each is written after a `*`. */
  readonly title?: readonly string[]
  /**
   * Put a 0 V source in series with every part as its ammeter (`VA<k>` on the source side, `VB<k>`
   * at a line's load end or a stub's far end), for simulations that read each part's current.
   */
  readonly probes?: boolean
}

/** The subcircuit and where to read it: node and source names inside the subcircuit, per element. */
export type SpiceLadder = {
  readonly text: string
  /** For element k (0 = next to the load): the node on its load side; the last entry is `src`. */
  readonly nodes: readonly string[]
  /** For element k: its ESR in Ω (0 for a lossless part, the resistance for an R). */
  readonly esr: readonly number[]
  /** For element k with `probes`: the ammeter on its source side (current into the part), or null. */
  readonly ammeters: readonly (string | null)[]
  /** With `probes`: a line's load-end ammeter, an open stub's far node or a short stub's far ammeter. */
  readonly far: readonly (string | null)[]
}

/** A SPICE number: the shortest text that reads back as the same double. */
const num = (x: number) => String(x)

/** The subcircuit name: a SPICE identifier. */
function subcircuitName(name: unknown): string {
  if (typeof name !== 'string' || name.trim() === '') throw new RfInputError('name', 'must be a non-empty subcircuit name')
  const id = name.trim().replace(/[^A-Za-z0-9_]/g, '_')
  return /^[A-Za-z_]/.test(id) ? id : `x_${id}`
}

/** Does the element move the ladder to a new node (series parts, lines, transformers)? */
function advances(e: Element): boolean {
  return e.kind === 'line' || e.kind === 'xfmr' || e.kind === 'block' || e.placement === 'series'
}

/**
 * The ladder as a SPICE subcircuit with the names of its nodes and probes. Element k is numbered
 * k + 1 in the netlist (`L1` sits next to the load); internal nodes are `n1`, `n2`, … from the load.
 * Throws `RfInputError` for bad element JSON, a measured block, a bad name or frequency.
 */
export function spiceLadder(elements: readonly Element[], options: SpiceNetlistOptions): SpiceLadder {
  const list = validateElements(elements)
  const f = requirePositive(options.frequency, 'frequency')
  const name = subcircuitName(options.name)
  const probes = options.probes === true
  list.forEach((e, k) => {
    if (isMeasuredPart(e)) throw new RfInputError(`elements[${k}].measured`, 'a part given by its fixture measurement has no SPICE model: give it a value and model first')
    if (e.kind === 'block') throw new RfInputError(`elements[${k}]`, 'a measured block has no SPICE model: replace it by parts first')
  })
  const steps = list.filter(advances).length
  const lines: string[] = []
  const nodes: string[] = []
  const esr: number[] = []
  const ammeters: (string | null)[] = []
  const far: (string | null)[] = []
  let step = 0
  let here = 'ld'
  const next = () => (++step === steps ? 'src' : `n${step}`)

  list.forEach((e, k) => {
    const id = k + 1
    nodes.push(here)
    esr.push(0)
    ammeters.push(null)
    far.push(null)
    const to = advances(e) ? next() : here
    // The source-side terminal of the part, behind its ammeter when probed.
    const entry = (from: string) => {
      if (!probes) return from
      lines.push(`VA${id} ${from} a${id} DC 0`)
      ammeters[k] = `VA${id}`
      return `a${id}`
    }
    const wire = (a: string, b: string, why: string) => lines.push(`* ${why}: a wire`, `VW${id} ${a} ${b} DC 0`)
    switch (e.kind) {
      case 'L': case 'C': case 'R': {
        const top = e.placement === 'series' ? to : here
        const bottom = e.placement === 'series' ? here : '0'
        const isOpen = e.kind === 'C' && e.value === 0
        if (isOpen) { lines.push(`* ${e.kind}${id}: 0 F is an open, left out`); break }
        if (e.value === 0) { wire(entry(top), bottom, `${e.kind}${id} of 0 is a short`); break }
        const q = e.kind === 'R' ? undefined : partQAt(e, f)
        // ESR = ωL/Q(f) or 1/(ωC·Q(f)): the ideal part's loss with Q(f) (parasitics apart).
        const loss = e.kind === 'R' ? e.value : q === undefined ? 0 : elementImpedance({ kind: e.kind, placement: 'series', value: e.value, q }, f).re
        esr[k] = loss
        const start = entry(top)
        const m = e.kind === 'R' ? undefined : e.model
        if (e.kind === 'R') lines.push(`R${id} ${start} ${bottom} ${num(e.value)}`)
        else {
          // The chain of the part: L or C, then ESL (a capacitor's), then the ESR, to `bottom`.
          const chain: [string, number][] = [[`${e.kind}${id}`, e.value]]
          if (e.kind === 'C' && m?.esl) chain.push([`LS${id}`, m.esl])
          if (loss > 0) chain.push([`RQ${id}`, loss])
          if (q !== undefined) lines.push(`* ${e.kind}${id}: Q ${num(q)} at ${num(f)} Hz, ESR ${num(loss)} ohm`)
          let from = start
          chain.forEach(([part, value], j) => {
            const end = j === chain.length - 1 ? bottom : `q${id}_${j + 1}`
            lines.push(`${part} ${from} ${end} ${num(value)}`)
            from = end
          })
          if (e.kind === 'L' && m?.srf) {
            lines.push(`* L${id}: self-resonance ${num(m.srf)} Hz, Cp across the inductor and its ESR`, `CP${id} ${start} ${bottom} ${num(1 / ((2 * Math.PI * m.srf) ** 2 * e.value))}`)
          }
        }
        if (m?.padC) {
          lines.push(`* ${e.kind}${id}: pad capacitance to ground`)
          const ends = e.placement === 'series' ? [top, bottom] : [top]
          ends.forEach((n, j) => lines.push(`CPAD${id}_${j + 1} ${n} 0 ${num(m.padC!)}`))
        }
        break
      }
      case 'line': {
        const deg = electricalDegrees(e, f)
        if (deg === 0) { wire(entry(to), here, `line ${id} of 0 degrees`); break }
        const end = probes ? `b${id}` : here
        lines.push(`T${id} ${entry(to)} 0 ${end} 0 Z0=${num(e.z0)} TD=${num(deg / (360 * f))}`)
        if (probes) { lines.push(`VB${id} b${id} ${here} DC 0`); far[k] = `VB${id}` }
        break
      }
      case 'stub': {
        const deg = electricalDegrees(e, f)
        const top = e.placement === 'series' ? to : here
        const bottom = e.placement === 'series' ? here : '0'
        if (deg === 0 && e.end === 'open') { lines.push(`* stub ${id}: an open stub of 0 degrees is an open, left out`); break }
        if (deg === 0) { wire(entry(top), bottom, `short stub ${id} of 0 degrees`); break }
        const start = entry(top)
        // The far port: tied to ground for a short end (through an ammeter when probed), free when open.
        const end = e.end === 'short' && !probes ? '0' : `e${id}`
        lines.push(`* stub ${id}: ${e.end} end, in ${e.placement}`, `T${id} ${start} ${bottom} ${end} 0 Z0=${num(e.z0)} TD=${num(deg / (360 * f))}`)
        if (e.end === 'short' && probes) { lines.push(`VB${id} e${id} 0 DC 0`); far[k] = `VB${id}` }
        if (e.end === 'open' && probes) far[k] = `e${id}`
        break
      }
      case 'xfmr': {
        // V(to) = n·V(here); the primary current I(VX) comes back n times into `here`.
        lines.push(
          `* transformer ${id}: ideal ${num(e.ratio)}:1, ${num(e.ratio)} on the source side`,
          `E${id} ${to} x${id} ${here} 0 ${num(e.ratio)}`,
          `VX${id} x${id} 0 DC 0`,
          `F${id} 0 ${here} VX${id} ${num(e.ratio)}`,
        )
        break
      }
    }
    here = to
  })
  nodes.push('src')
  if (steps === 0) lines.push('* no series element: the ports are one node', 'VW0 src ld DC 0')

  const header = [
    ...(options.title ?? []).map(t => `* ${t.replace(/[\r\n]+/g, ' ')}`),
    `* Matching network, ${list.length} element${list.length === 1 ? '' : 's'}; ports: src (source side), ld (load side), ground 0.`,
    `* Finite-Q ESRs are valued at ${num(f)} Hz and hold at that frequency only; lines and stubs are lossless.`,
  ]
  const text = [...header, `.subckt ${name} src ld`, ...lines, `.ends ${name}`, ''].join('\n')
  return { text, nodes, esr, ammeters, far }
}

/**
 * The text of one SPICE subcircuit `.subckt NAME src ld` for the ladder (see `spiceLadder` for the
 * element models): finite-Q L and C get a series ESR resistor valued at `frequency`; lines and stubs
 * are lossless T elements; the transformer is ideal (n:1, n on the source side).
 */
export function spiceNetlist(elements: readonly Element[], options: SpiceNetlistOptions): string {
  return spiceLadder(elements, options).text
}
