// Frequency markers the user places on the band plot or the chart's band ribbon, with their
// readouts, and the band figures (worst return loss, bandwidth at a chosen return loss).
// Session scope on purpose: markers are one person's look at the response, so they stay out of
// the shared document and its undo history; each colleague places their own.
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { readoutOf, type PointReadout } from '#shared/board/readout'
import { bandwidthAt, nearestIndex, worstReturnLoss } from '#shared/board/markers'
import { useBoardStore } from '~/stores/board'

export interface MarkerReadout extends PointReadout {
  frequencyHz: number
}

/** At most this many markers; a new one past it replaces the oldest. */
export const MAX_MARKERS = 6

export const useMarkersStore = defineStore('markers', () => {
  const board = useBoardStore()
  /** Marker frequencies (Hz), each on a band point. */
  const frequenciesHz = ref<number[]>([])
  /** The return loss (dB) the bandwidth is measured at; null follows the band spec's minimum. */
  const bandwidthThresholdDb = ref<number | null>(null)

  /** Places a marker on the band point nearest `frequencyHz`; a second click there removes it. */
  function toggleAt(frequencyHz: number) {
    const i = nearestIndex(board.bandFrequencies, frequencyHz)
    if (i < 0) return
    const f = board.bandFrequencies[i]!
    if (frequenciesHz.value.includes(f)) frequenciesHz.value = frequenciesHz.value.filter(x => x !== f)
    else frequenciesHz.value = [...frequenciesHz.value, f].slice(-MAX_MARKERS).sort((a, b) => a - b)
  }
  function remove(frequencyHz: number) {
    frequenciesHz.value = frequenciesHz.value.filter(f => f !== frequencyHz)
  }
  function clear() {
    frequenciesHz.value = []
  }
  function setBandwidthThreshold(db: number | null) {
    bandwidthThresholdDb.value = db !== null && Number.isFinite(db) && db > 0 ? db : null
  }

  // Marker readouts, worst return loss and bandwidth read the settled band: during a drag they
  // follow every 120 ms (the band plot shows the live curve meanwhile).
  /** Each marker's readout at the source end of the ladder (Γ against the board's reference). */
  const readouts = computed<MarkerReadout[]>(() => frequenciesHz.value.flatMap((f) => {
    const i = nearestIndex(board.bandFrequencies, f)
    if (i < 0) return []
    const ref = board.settings.source.kind === 'z0' ? board.z0 : board.reference
    return [{ frequencyHz: board.bandFrequencies[i]!, ...readoutOf(board.settledBandSweep[i]!, ref) }]
  }))

  const worst = computed(() => worstReturnLoss(board.bandFrequencies, board.settledBandReturnLossDb))
  const thresholdDb = computed(() => bandwidthThresholdDb.value ?? board.settings.spec.minReturnLossDb)
  const bandwidth = computed(() => bandwidthAt(board.bandFrequencies, board.settledBandReturnLossDb, thresholdDb.value))

  return { frequenciesHz, bandwidthThresholdDb, thresholdDb, readouts, worst, bandwidth, toggleAt, remove, clear, setBandwidthThreshold }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useMarkersStore, import.meta.hot))
