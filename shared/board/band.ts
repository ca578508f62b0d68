// The band of a board: its frequency grid and the verdict of a response against the band spec.
import type { BoardSettings } from './schema'

/** `points` frequencies (Hz) evenly spaced from start to stop, both included. */
export function bandFrequencies(settings: Pick<BoardSettings, 'bandStartHz' | 'bandStopHz' | 'bandPoints'>): number[] {
  const { bandStartHz: start, bandStopHz: stop, bandPoints: n } = settings
  const step = (stop - start) / (n - 1)
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? stop : start + i * step))
}

export interface BandVerdict {
  /** True when every band point inside [f1, f2] meets the minimum return loss. */
  isPass: boolean
  /** The lowest return loss (dB) inside [f1, f2], and where; null when no point falls inside. */
  worstReturnLossDb: number | null
  worstFrequencyHz: number | null
  /** How many band points fall inside [f1, f2]. */
  pointsInSpec: number
}

/** Checks return loss (dB, one per frequency) against the band spec "RL ≥ min from f1 to f2". */
export function bandVerdict(
  frequenciesHz: readonly number[],
  returnLossDb: readonly number[],
  spec: BoardSettings['spec'],
): BandVerdict {
  let worst: number | null = null
  let worstAt: number | null = null
  let count = 0
  frequenciesHz.forEach((f, i) => {
    if (f < spec.f1Hz || f > spec.f2Hz) return
    count++
    const rl = returnLossDb[i]!
    if (worst === null || rl < worst) { worst = rl; worstAt = f }
  })
  // A spec that no band point reaches cannot be shown to pass.
  const isPass = count > 0 && worst !== null && worst >= spec.minReturnLossDb
  return { isPass, worstReturnLossDb: worst, worstFrequencyHz: worstAt, pointsInSpec: count }
}

/**
 * The ladder ready for a sweep: a line or stub without fRef is taken at its stated length at the
 * design frequency (the same reading a single-frequency trace gives it).
 */
export function withReferenceFrequency<E extends { kind: string, fRef?: number }>(elements: readonly E[], designFrequencyHz: number): E[] {
  return elements.map(e =>
    (e.kind === 'line' || e.kind === 'stub') && e.fRef === undefined ? { ...e, fRef: designFrequencyHz } : e)
}
