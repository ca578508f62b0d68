// Ladder hunt: the board's match search (shared/rf searchMatches) run in a Web Worker. Plain
// state only (options, progress, the last result); the worker lives in useHuntWorker. Applying a
// candidate goes through the board store (one undo step, synced like any edit).
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import { gammaOf, returnLossDb, sweep, type ESeriesName, type SearchCandidate, type SearchInput } from '#shared/rf'
import { huntPlan, type HuntPlan } from '#shared/board/hunt'
import type { ElementJson } from '#shared/board/schema'
import { useBoardStore } from '~/stores/board'
import { useMeasuredStore } from '~/stores/measured'
import { useHuntWorker } from '~/composables/useHuntWorker'

export type HuntStatus = 'idle' | 'running' | 'done' | 'cancelled' | 'error'

export type HuntRow = {
  id: string
  /** The whole ladder the board gets on "use": the fixed elements, then the candidate. */
  ladder: ElementJson[]
  elements: SearchCandidate['elements']
  worstReturnLossDb: number
  centreLossDb: number
  /** Return loss (dB) at each searched frequency, for the small band curve. */
  curveDb: number[]
  /** Fano's limit minus the worst return loss (dB); null without a limit. */
  marginDb: number | null
}

export const useHuntStore = defineStore('hunt', () => {
  const board = useBoardStore()
  const measured = useMeasuredStore()
  const worker = useHuntWorker()

  const series = ref<ESeriesName>('E24')
  const maxElements = ref<2 | 3>(3)
  const status = ref<HuntStatus>('idle')
  const completed = ref(0)
  const total = ref(0)
  const error = ref<string | null>(null)
  const elapsedMs = ref<number | null>(null)
  const searched = ref(0)
  /** The plan and result of the last finished run (kept as they were, even if the board moves on). */
  const resultPlan = shallowRef<HuntPlan | null>(null)
  const candidates = shallowRef<SearchCandidate[]>([])

  const plan = computed<HuntPlan>(() => huntPlan({
    settings: board.settings,
    elements: board.elements,
    bandFrequencies: board.bandFrequencies,
    bandLoadZ: board.bandLoadZ,
    blocks: measured.files,
  }))
  const fano = computed(() => plan.value.fano)
  const canRun = computed(() => plan.value.frequencies.length > 0 && !board.isMeasuredPending)

  function input(): SearchInput {
    const p = plan.value
    return {
      z0: board.z0, frequencies: [...p.frequencies], load: p.load.map(z => ({ re: z.re, im: z.im })),
      series: series.value, maxElements: maxElements.value,
      q: p.q ? { ...p.q } : undefined,
    }
  }

  const rows = computed<HuntRow[]>(() => {
    const p = resultPlan.value
    if (!p) return []
    return candidates.value.map((c, i) => {
      const z = sweep({ z0: board.z0, frequencies: p.frequencies, load: p.load, elements: c.elements })
      return {
        id: `hunt-${i}`,
        ladder: [...p.fixed, ...c.elements] as ElementJson[],
        elements: c.elements,
        worstReturnLossDb: c.worstReturnLossDb,
        centreLossDb: c.centreLossDb,
        curveDb: z.map(zz => returnLossDb(gammaOf(zz, board.z0))),
        marginDb: p.fano ? p.fano.limitDb - c.worstReturnLossDb : null,
      }
    })
  })

  async function run(): Promise<void> {
    if (!canRun.value) return
    const p = plan.value
    status.value = 'running'
    error.value = null
    completed.value = 0
    total.value = 1
    const outcome = await worker.start(input(), (done, all) => { completed.value = done; total.value = all })
    if (outcome.status === 'done') {
      status.value = 'done'
      elapsedMs.value = outcome.elapsedMs
      searched.value = outcome.result.searched
      resultPlan.value = p
      candidates.value = outcome.result.candidates
      completed.value = total.value
    }
    else if (status.value === 'running') {
      status.value = outcome.status
      error.value = outcome.message ?? null
    }
  }

  function cancel(): void {
    if (status.value === 'running') worker.cancel()
  }

  function preview(row: HuntRow | null): void {
    board.setPreview(row ? row.ladder : null)
  }

  /** Replaces the ladder with the row's (reviewers: refused by the board store). */
  function use(row: HuntRow): string | null {
    return board.applySolution(row.ladder)
  }

  return {
    series, maxElements, status, completed, total, error, elapsedMs, searched, resultPlan, candidates,
    plan, fano, canRun, rows,
    run, cancel, preview, use,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useHuntStore, import.meta.hot))
