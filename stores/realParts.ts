// Real parts on the open board: losses with finite Q, stress at the source power, the Monte Carlo
// input, and the snap-all preview. Reads the board store (which holds the document snapshot) and
// writes only through its actions; session choices (power unit, trials, seed) live here.
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import {
  elementStress, lossesAcrossBand, lossesAt,
  type Complex, type ElementStress, type MonteCarloInput, type ToleranceDistribution,
} from '#shared/rf'
import type { BoardElement, SnapSeries } from '#shared/board/schema'
import {
  DEFAULT_SOURCE_POWER_W, parsePowerW, parseQ, parseRating, parseTolerance, plainCopy, type PowerUnit,
} from '#shared/board/real-parts'
import { snapped, useBoardStore } from '~/stores/board'
import { useMeasuredStore } from '~/stores/measured'

type Series = Exclude<SnapSeries, 'none'>

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error)
}

/** Runs `compute`, turning a thrown input error into a message for the panel. */
function attempt<T>(compute: () => T): { value: T | null, error: string | null } {
  try {
    return { value: compute(), error: null }
  }
  catch (error) {
    return { value: null, error: messageOf(error) }
  }
}

export const useRealPartsStore = defineStore('realParts', () => {
  const board = useBoardStore()
  const measured = useMeasuredStore()

  // ---- session choices ----
  const powerUnit = ref<PowerUnit>('dBm')
  const trials = ref(2000)
  const seed = ref('brackwater')
  const distribution = ref<ToleranceDistribution>('uniform')
  const snapSeries = ref<Series | null>(null)

  // ---- source ----
  const sourcePowerW = computed(() => board.settings.sourcePowerW ?? DEFAULT_SOURCE_POWER_W)
  /** The source impedance that drives the stress and loss figures (Z0 for a matched source). */
  const sourceZ = computed<Complex>(() => board.settings.source.kind === 'z0' ? { re: board.z0, im: 0 } : board.sourceZ)
  const bandSourceZ = computed<Complex[]>(() => board.bandReferences.map(r => typeof r === 'number' ? { re: r, im: 0 } : r))

  // ---- stress at the design frequency ----
  const stressOutcome = computed(() => attempt(() => elementStress({
    frequency: board.frequencyHz,
    load: board.loadZ,
    source: sourceZ.value,
    powerW: sourcePowerW.value,
    elements: board.analysisLadder,
    blocks: measured.files,
  })))
  const stress = computed(() => stressOutcome.value.value)
  const stressError = computed(() => stressOutcome.value.error)
  /** Each element's stress by id (pending measured blocks are absent). */
  const stressById = computed<Record<string, ElementStress>>(() => {
    const out: Record<string, ElementStress> = {}
    const result = stress.value
    if (!result) return out
    board.analysisLadder.forEach((e, i) => { out[(e as BoardElement).id] = result.elements[i]! })
    return out
  })
  const overRatingIds = computed(() => Object.entries(stressById.value)
    .filter(([, s]) => s.isOverVoltage || s.isOverCurrent).map(([id]) => id))

  // ---- losses ----
  const lossesOutcome = computed(() => attempt(() => lossesAt({
    frequency: board.frequencyHz, load: board.loadZ, source: sourceZ.value, elements: board.analysisLadder, blocks: measured.files,
  })))
  const lossesAtDesign = computed(() => lossesOutcome.value.value)
  const lossesError = computed(() => lossesOutcome.value.error)
  const bandLossesOutcome = computed(() => attempt(() => board.bandFrequencies.length === 0 ? null : lossesAcrossBand({
    frequencies: board.bandFrequencies, load: board.bandLoadZ, source: bandSourceZ.value, elements: board.analysisLadder, blocks: measured.files,
  })))
  /** Over the spec band: the lowest efficiency and the highest insertion loss, with where. */
  const bandLossSummary = computed(() => {
    const band = bandLossesOutcome.value.value
    if (!band) return null
    const { f1Hz, f2Hz } = board.settings.spec
    let lowest: { efficiency: number, frequencyHz: number } | null = null
    let highest: { insertionLossDb: number, frequencyHz: number } | null = null
    board.bandFrequencies.forEach((f, k) => {
      if (f < f1Hz || f > f2Hz) return
      if (!lowest || band.efficiency[k]! < lowest.efficiency) lowest = { efficiency: band.efficiency[k]!, frequencyHz: f }
      if (!highest || band.insertionLossDb[k]! > highest.insertionLossDb) highest = { insertionLossDb: band.insertionLossDb[k]!, frequencyHz: f }
    })
    return { lowest, highest }
  })

  // ---- snap all ----
  const chosenSeries = computed<Series>(() => snapSeries.value ?? board.partsSeries)
  const snapPreview = computed(() => attempt(() => {
    const series = chosenSeries.value
    const ladder = snapped(board.elements, series)
    const changed = ladder.filter((e, i) => e !== board.elements[i] && (e as { value: number }).value !== (board.elements[i] as { value: number }).value).length
    // "Now" is the settled band: read live, it would redo the snapped sweep on every drag move.
    return { series, changed, before: board.settledBandVerdict, after: board.bandVerdictOf(ladder) }
  }))

  // ---- Monte Carlo ----
  /** What a run depends on, so a result can be marked stale when the design changes. */
  const analysisKey = computed(() => JSON.stringify([
    board.analysisLadder, board.settings.load, board.settings.source, board.settings.spec, board.settings.z0,
    board.settings.frequencyHz, board.settings.bandStartHz, board.settings.bandStopHz, board.settings.bandPoints,
    trials.value, seed.value, distribution.value,
  ]))
  const tolerancedCount = computed(() => board.analysisLadder.filter(e => (e.kind === 'L' || e.kind === 'C' || e.kind === 'R')
    && ((e.tolerance ?? 0) > 0 || ((e as { toleranceAbs?: number }).toleranceAbs ?? 0) > 0)).length)

  /** The run's input as plain data (posted to the worker). */
  function monteCarloInput(): MonteCarloInput {
    const ladder = board.analysisLadder
    const blockIds = new Set(ladder.flatMap(e => e.kind === 'block' ? [e.uploadId] : []))
    return plainCopy({
      frequencies: board.bandFrequencies,
      load: board.bandLoadZ,
      reference: board.bandReferences,
      design: { frequencyHz: board.frequencyHz, load: board.loadZ, reference: board.reference },
      elements: ladder,
      spec: board.settings.spec,
      trials: trials.value,
      seed: seed.value,
      distribution: distribution.value,
      cloudSize: 400,
      blocks: Object.fromEntries(Object.entries(measured.files).filter(([id]) => blockIds.has(id))),
    }) as MonteCarloInput
  }

  // ---- edits (through the board store) ----
  function setSourcePower(text: string): string | null {
    return attempt(() => parsePowerW(text, powerUnit.value)).error ?? board.updateSettings({ sourcePowerW: parsePowerW(text, powerUnit.value) })
  }
  function setDefaultQ(kind: 'L' | 'C', text: string): string | null {
    const parsed = attempt(() => parseQ(text))
    if (parsed.error) return parsed.error
    const next = { ...(board.settings.defaultQ ?? {}), [kind]: parsed.value ?? undefined }
    if (next[kind] === undefined) delete next[kind]
    return board.updateSettings({ defaultQ: Object.keys(next).length ? next : undefined })
  }
  function setTolerance(id: string, text: string): string | null {
    const element = board.elements.find(e => e.id === id)
    if (!element) return 'That element is no longer on the board.'
    const parsed = attempt(() => parseTolerance(text, element.kind))
    return parsed.error ?? board.updateElement(id, parsed.value!)
  }
  function setRating(id: string, field: 'vRatingV' | 'iRatingA', text: string): string | null {
    const parsed = attempt(() => parseRating(text, field === 'vRatingV' ? 'V' : 'A'))
    return parsed.error ?? board.updateElement(id, { [field]: parsed.value ?? undefined })
  }
  function snapAll(): string | null {
    return board.snapAll(chosenSeries.value)
  }

  return {
    powerUnit, trials, seed, distribution, snapSeries,
    sourcePowerW, sourceZ, stress, stressError, stressById, overRatingIds,
    lossesAtDesign, lossesError, bandLossSummary, chosenSeries, snapPreview, analysisKey, tolerancedCount,
    monteCarloInput, setSourcePower, setDefaultQ, setTolerance, setRating, snapAll,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useRealPartsStore, import.meta.hot))
