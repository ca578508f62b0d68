// The figures of the printable board report: the terminals in words and the stress on each part
// at the design frequency for a chosen available source power.
import { elementStress, formatEng, type BlockLookup, type Complex, type ElementStress } from '../rf'
import { formatComplex } from './format'
import type { BoardElement, Terminal } from './schema'

/** A terminal as one line of text ("42 − j18 Ω", "series R-L-C …", "measured: antenna.s1p"). */
export function describeTerminal(terminal: Terminal, fileNames: Readonly<Record<string, string>>): string {
  switch (terminal.kind) {
    case 'impedance': return formatComplex(terminal.z, 'Ω')
    case 'rlc': {
      const parts = [
        terminal.r !== undefined ? `R ${formatEng(terminal.r, 'Ω')}` : null,
        terminal.l !== undefined ? `L ${formatEng(terminal.l, 'H')}` : null,
        terminal.c !== undefined ? `C ${formatEng(terminal.c, 'F')}` : null,
      ].filter(Boolean)
      return `${terminal.topology} R-L-C: ${parts.join(', ')}`
    }
    case 'measured': return `measured: ${fileNames[terminal.uploadId] ?? terminal.uploadId}`
    default: return 'matched Z0 source'
  }
}

/** Stress per element at the design frequency, or the reason it cannot be computed. */
export function stressAtDesign(input: {
  frequencyHz: number
  load: Complex
  source: Complex
  powerW: number
  elements: readonly BoardElement[]
  blocks?: BlockLookup
}): { rows: ElementStress[], problem: string | null } {
  try {
    const { elements } = elementStress({ frequency: input.frequencyHz, load: input.load, source: input.source, powerW: input.powerW, elements: input.elements, blocks: input.blocks })
    return { rows: elements, problem: null }
  }
  catch (error) {
    return { rows: [], problem: error instanceof Error ? error.message : String(error) }
  }
}
