// What a board hands to a colleague: the designed ladder as a two-port Touchstone file across the
// band (port 1 at the source end, port 2 at the load end, both at the board's z0), or as a SPICE
// subcircuit for a circuit simulator.
import { formatEng, ladderSParameters, spiceNetlist, writeTouchstone, type BlockLookup, type Element } from '../rf'
import { withReferenceFrequency } from './band'

export interface DesignedNetworkInput {
  boardName: string
  z0: number
  designFrequencyHz: number
  frequenciesHz: readonly number[]
  /** From the load outwards. */
  elements: readonly Element[]
  blocks?: BlockLookup
}

/** The ladder alone as .s2p text (RI, MHz), with a comment naming the board and the port order. */
export function designedNetworkS2p(input: DesignedNetworkInput): string {
  const elements = withReferenceFrequency(input.elements, input.designFrequencyHz)
  const s = ladderSParameters({ z0: input.z0, frequencies: input.frequenciesHz, elements, blocks: input.blocks })
  return writeTouchstone({
    ports: 2,
    z0: input.z0,
    frequencies: [...input.frequenciesHz],
    s,
    format: 'RI',
    unit: 'MHZ',
    comment: `Gammaboard: matching network of "${input.boardName}"\nport 1: source end, port 2: load end; lumped parts at their exact values`,
  })
}

/**
 * The ladder as one SPICE subcircuit (`.subckt <board name> src ld`), its header naming the board,
 * the design frequency at which the finite-Q ESRs hold, and the port order. Measured blocks are
 * refused (RfInputError naming the element): they have no SPICE model.
 */
export function designedNetworkSpice(input: Pick<DesignedNetworkInput, 'boardName' | 'designFrequencyHz' | 'elements'>): string {
  return spiceNetlist(input.elements, {
    name: input.boardName,
    frequency: input.designFrequencyHz,
    title: [
      `Gammaboard: matching network of "${input.boardName}"`,
      `Design frequency ${formatEng(input.designFrequencyHz, 'Hz', 6)}: finite-Q ESRs hold at this frequency only.`,
      'Use: X1 <source-side node> <load-side node> <subcircuit name>',
    ],
  })
}

/** A file name from a board name: letters, digits and dashes only. */
export function exportFileName(boardName: string, suffix: string): string {
  const base = boardName.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'board'
  return `${base}${suffix}`
}
