// Frequency markers on the band and the band figures around them: the nearest band point to a
// frequency, the worst return loss across the band, and the bandwidth at a chosen return loss.

/** The index of the band point nearest `frequencyHz` (−1 for an empty band). */
export function nearestIndex(frequenciesHz: readonly number[], frequencyHz: number): number {
  let best = -1
  let bestDistance = Infinity
  frequenciesHz.forEach((f, i) => {
    const d = Math.abs(f - frequencyHz)
    if (d < bestDistance) { best = i; bestDistance = d }
  })
  return best
}

/** The lowest return loss (dB) across the whole band and where, or null for an empty band. */
export function worstReturnLoss(frequenciesHz: readonly number[], returnLossDb: readonly number[]): { returnLossDb: number, frequencyHz: number } | null {
  let worst: { returnLossDb: number, frequencyHz: number } | null = null
  returnLossDb.forEach((rl, i) => {
    if (worst === null || rl < worst.returnLossDb) worst = { returnLossDb: rl, frequencyHz: frequenciesHz[i]! }
  })
  return worst
}

export interface Bandwidth {
  /** Edges (Hz) of the widest stretch meeting the return loss, edges found by linear interpolation of RL between band points. */
  lowHz: number
  highHz: number
  widthHz: number
  /** widthHz over the stretch's centre frequency. */
  fractional: number
  /** True when the stretch runs into the band's start or stop (the real bandwidth may be wider). */
  isClippedByBand: boolean
}

function crossing(f0: number, rl0: number, f1: number, rl1: number, thresholdDb: number): number {
  if (rl1 === rl0) return f0
  return f0 + ((thresholdDb - rl0) / (rl1 - rl0)) * (f1 - f0)
}

/**
 * The widest contiguous stretch of the band where return loss ≥ `thresholdDb`, or null when no
 * band point meets it. RL is taken as linear between neighbouring points to place each edge.
 */
export function bandwidthAt(frequenciesHz: readonly number[], returnLossDb: readonly number[], thresholdDb: number): Bandwidth | null {
  const n = frequenciesHz.length
  let best: Bandwidth | null = null
  let i = 0
  while (i < n) {
    if (!(returnLossDb[i]! >= thresholdDb)) { i++; continue }
    const start = i
    while (i + 1 < n && returnLossDb[i + 1]! >= thresholdDb) i++
    const end = i
    const lowHz = start === 0 ? frequenciesHz[0]! : crossing(frequenciesHz[start - 1]!, returnLossDb[start - 1]!, frequenciesHz[start]!, returnLossDb[start]!, thresholdDb)
    const highHz = end === n - 1 ? frequenciesHz[n - 1]! : crossing(frequenciesHz[end]!, returnLossDb[end]!, frequenciesHz[end + 1]!, returnLossDb[end + 1]!, thresholdDb)
    const widthHz = highHz - lowHz
    if (!best || widthHz > best.widthHz) {
      best = { lowHz, highHz, widthHz, fractional: widthHz / ((lowHz + highHz) / 2), isClippedByBand: start === 0 || end === n - 1 }
    }
    i++
  }
  return best
}
