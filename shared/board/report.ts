// The printable board report's words for the inputs (stress comes from stores/realParts.ts).
import { formatEng } from '../rf'
import { formatComplex } from './format'
import type { Terminal } from './schema'

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
