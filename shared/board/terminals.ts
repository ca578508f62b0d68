// The impedance of a board terminal (load or source) at a frequency, and the match goal.
import { rlcImpedance, type Complex } from '../rf'
import type { BoardSettings, Terminal } from './schema'
import { measuredImpedanceAt, type MeasuredLookup } from './measured'

/**
 * The terminal's impedance (Ω) at `frequencyHz`; a Z0 source is the board's real z0. A measured
 * terminal reads its file from `measured` (the nearest measured point outside the file's range;
 * callers flag that).
 */
export function terminalImpedance(terminal: Terminal, frequencyHz: number, z0: number, measured?: MeasuredLookup): Complex {
  switch (terminal.kind) {
    case 'impedance': return terminal.z
    case 'rlc': return rlcImpedance(terminal, frequencyHz)
    case 'measured': return measuredImpedanceAt(measured?.[terminal.uploadId], frequencyHz, z0)
    case 'z0': return { re: z0, im: 0 }
    default: throw new Error(`A ${(terminal as { kind: string }).kind} terminal needs its data to give an impedance`)
  }
}

/** The terminal's impedance at each frequency (one shared value for a fixed impedance). */
export function terminalImpedances(terminal: Terminal, frequenciesHz: readonly number[], z0: number, measured?: MeasuredLookup): Complex[] {
  if (terminal.kind === 'measured') return frequenciesHz.map(f => terminalImpedance(terminal, f, z0, measured))
  if (terminal.kind !== 'rlc') {
    const z = terminalImpedance(terminal, frequenciesHz[0] ?? 1, z0)
    return frequenciesHz.map(() => z)
  }
  return frequenciesHz.map(f => rlcImpedance(terminal, f))
}

/**
 * What reflection is measured against: the real z0 for a Z0 source, else the source impedance
 * itself (gammaOf then gives the power wave, zero at the conjugate match).
 */
export function reflectionReference(sourceZ: Complex, settings: Pick<BoardSettings, 'source' | 'z0'>): number | Complex {
  // A source without resistance delivers no power; the power wave is undefined there, so fall
  // back to z0 (the terminal editor warns about such a source).
  if (settings.source.kind === 'z0' || !(sourceZ.re > 0) || !Number.isFinite(sourceZ.im)) return settings.z0
  return sourceZ
}

/** Where the trace must end: the conjugate of the source impedance (z0 for a Z0 source). */
export function goalOf(sourceZ: Complex): Complex {
  return { re: sourceZ.re, im: -sourceZ.im }
}
