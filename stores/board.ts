// The reactive view of the open board: plain snapshots read from the Y.Doc, session state (the
// selection, a drag draft, a solver preview, chart toggles) and computed RF results. Edits go
// through useBoardDoc (which owns the document); nothing here holds a Y.Doc.
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef, watch } from 'vue'
import {
  gammaOf, nearestStandard, returnLossDb, sweep, trace, withDefaultQ, type Complex,
} from '#shared/rf'
import {
  DEFAULT_SETTINGS,
  type BoardContent, type BoardElement, type BoardSettings, type BoardSnapshot, type ElementJson,
  type SnapSeries, type Terminal, type TerminalSide,
} from '#shared/board/schema'
import { bandFrequencies as bandGrid, bandVerdict as verdictOf, withReferenceFrequency } from '#shared/board/band'
import { goalOf, reflectionReference, terminalImpedance, terminalImpedances } from '#shared/board/terminals'
import { readoutOf } from '#shared/board/readout'
import { mainFieldOf, readFieldValue, withFieldValue, type EditField } from '#shared/board/element-values'
import { replyOf, type EntryReply } from '#shared/board/quantity-entry'
import { ELEMENT_ADDITIONS } from '#shared/board/additions'
import { settingsEntry, terminalEntry, type SettingsField, type TerminalField } from '#shared/board/entry'
import { matchSolutions } from '#shared/board/solutions'
import { partRows } from '#shared/board/parts'
import { useBoardDoc } from '~/composables/useBoardDoc'
import { useMonteCarlo } from '~/composables/useMonteCarlo'
import { useMeasuredStore } from '~/stores/measured'
import { useAmplifierStore } from '~/stores/amplifier'
import { measuredCoverage, measuredPartUploadIds, measuredUploadIds, splitByCoverage } from '#shared/board/measured'

import type { BoardRecordInput } from '#shared/types/api'

export type { BoardRecordInput }

export interface DragDraft {
  elementId: string
  value: number
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error)
}

/** The ladder with every lumped part set to its nearest value of `series`. */
export function snapped<E extends ElementJson>(elements: readonly E[], series: Exclude<SnapSeries, 'none'>): E[] {
  return elements.map(e =>
    (e.kind === 'L' || e.kind === 'C' || e.kind === 'R') ? { ...e, value: nearestStandard(e.value, series) } : e)
}

/** Secondary results catch up with a drag once the draft has rested this long (ms); see settledElements. */
const SETTLE_AFTER_REST_MS = 120
/** …and at least this often while the draft keeps moving (ms). */
const SETTLE_AT_LEAST_EVERY_MS = 500

export const useBoardStore = defineStore('board', () => {
  // ---- document snapshot (read from the Y.Doc only) ----
  const boardId = ref<string | null>(null)
  const name = ref('')
  const workspace = ref('')
  const isLoaded = ref(false)
  const readOnly = ref(false)
  const settings = ref<BoardSettings>(structuredClone(DEFAULT_SETTINGS))
  const elements = ref<BoardElement[]>([])
  const problems = ref<string[]>([])
  const canUndo = ref(false)
  const canRedo = ref(false)

  // ---- session ----
  const selectedId = ref<string | null>(null)
  const draft = ref<DragDraft | null>(null)
  const preview = ref<BoardElement[] | null>(null)
  const lastError = ref<string | null>(null)
  /** Monte Carlo end points at the design frequency (impedances, Ω) for the chart; null when none. */
  // A shallow ref: up to a few hundred points replaced as a whole, never edited in place.
  // The Monte Carlo cloud lives with its run (useMonteCarlo); the store shows it to the chart.
  const cloud = useMonteCarlo().cloud
  const loadedQ = ref(3)

  // ---- view toggles (the chart reads these) ----
  const showImpedanceGrid = ref(true)
  const showAdmittanceGrid = ref(false)
  const showQArcs = ref(false)
  const qArcValue = ref(2)
  const plotQuantity = ref<'returnLoss' | 'gammaMagnitude'>('returnLoss')

  // ---- computed RF results ----
  const z0 = computed(() => settings.value.z0)
  const frequencyHz = computed(() => settings.value.frequencyHz)

  /** The ladder as drawn: the document's elements with the drag draft applied. */
  const effectiveElements = computed<BoardElement[]>(() => {
    const d = draft.value
    if (!d) return elements.value
    return elements.value.map(e => e.id === d.elementId ? withFieldValue(e, mainFieldOf(e.kind), d.value) : e)
  })

  /**
   * The ladder the secondary panels read (stress, losses, parts list, snapped band, Monte Carlo inputs).
   * During a drag it catches up with the draft once the pointer rests SETTLE_AFTER_REST_MS, and at
   * least every SETTLE_AT_LEAST_EVERY_MS while it keeps moving: catching up costs a few ms (a band of
   * losses, the snapped band, two tables), which on every seventh frame would push the slowest
   * frames past budget. The chart, the dragged tile, the end-point readout and the band plot's live
   * curve read effectiveElements and follow every move. Outside a drag it is the document's ladder.
   */
  const settledElements = shallowRef<BoardElement[]>(elements.value)
  let settleTimer: ReturnType<typeof setTimeout> | null = null
  let pendingSince: number | null = null
  function settle() {
    settleTimer = null
    pendingSince = null
    settledElements.value = effectiveElements.value
  }
  watch([elements, draft], () => {
    if (settleTimer) clearTimeout(settleTimer)
    settleTimer = null
    if (!draft.value) {
      pendingSince = null
      settledElements.value = elements.value
      return
    }
    const now = Date.now()
    pendingSince ??= now
    settleTimer = setTimeout(settle, Math.max(0, Math.min(SETTLE_AFTER_REST_MS, pendingSince + SETTLE_AT_LEAST_EVERY_MS - now)))
  }, { flush: 'sync' })

  // ---- measured files (uploads): fetched into the measured store, never into the document ----
  const measured = useMeasuredStore()
  /** Terminals and blocks narrow the band to what their files cover; measured parts do not (their file must cover it). */
  const coverageIds = computed(() => measuredUploadIds(settings.value, elements.value))
  const measuredIds = computed(() => [...new Set([...coverageIds.value, ...measuredPartUploadIds(elements.value)])])
  /** True while a measured file the board names is not loaded yet (results then leave it out). */
  const isMeasuredPending = computed(() => measuredIds.value.some(id => !measured.files[id]))
  /** The range all loaded measured files cover, or null without any. */
  const measuredRange = computed(() => measuredCoverage(coverageIds.value, measured.files))
  /** Blocks whose data has not arrived yet are left out until it does (isMeasuredPending says so). */
  function computable<E extends ElementJson>(ladder: readonly E[]): E[] {
    // The board's default Q goes to every L and C without its own, in every computation.
    return withDefaultQ(ladder.filter(e => e.kind === 'block' ? measured.files[e.uploadId] !== undefined
      : !('measured' in e && e.measured) || measured.files[e.measured.uploadId] !== undefined), settings.value.defaultQ)
  }
  /** The ladder as every analysis reads it: draft, default Q and line fRef applied, pending blocks left out. */
  const analysisLadder = computed(() => withReferenceFrequency(computable(settledElements.value), frequencyHz.value))

  const loadZ = computed<Complex>(() => terminalImpedance(settings.value.load, frequencyHz.value, z0.value, measured.files))
  const sourceZ = computed<Complex>(() => terminalImpedance(settings.value.source, frequencyHz.value, z0.value, measured.files))
  const goal = computed<Complex>(() => goalOf(sourceZ.value))
  /** Γ of the end point is taken against this: z0 for a Z0 source, else the source impedance. */
  const reference = computed(() => reflectionReference(sourceZ.value, settings.value))

  function traceOf(ladder: readonly ElementJson[]): Complex[] {
    // A design frequency outside a block's file takes its nearest measured point (flagged in the UI).
    return trace({ z0: z0.value, frequency: frequencyHz.value, load: loadZ.value, elements: computable(ladder), blocks: measured.files, blockRange: 'nearest' })
  }

  /** Impedances (Ω) after 0…n elements at the design frequency, draft applied; [0] is the load. */
  const traceAtDesign = computed<Complex[]>(() => traceOf(effectiveElements.value))
  const endPoint = computed<Complex>(() => traceAtDesign.value[traceAtDesign.value.length - 1]!)
  const endpointReadout = computed(() => readoutOf(endPoint.value, reference.value))
  /** The end point as Γ against z0: its position on the chart. */
  const endpointChartGamma = computed(() => gammaOf(endPoint.value, z0.value))

  /** The band grid split by the measured range: only points inside it are computed (no extrapolation). */
  const bandCoverage = computed(() => splitByCoverage(bandGrid(settings.value), measuredRange.value))
  const bandFrequencies = computed(() => bandCoverage.value.insideHz)
  /** Band points beyond the measured files' range, left out of every band result. */
  const bandOutsideHz = computed(() => bandCoverage.value.outsideHz)
  const bandLoadZ = computed(() => terminalImpedances(settings.value.load, bandFrequencies.value, z0.value, measured.files))
  const bandReferences = computed<(number | Complex)[]>(() => {
    if (settings.value.source.kind === 'z0') return bandFrequencies.value.map(() => z0.value)
    return terminalImpedances(settings.value.source, bandFrequencies.value, z0.value, measured.files)
      .map(zs => reflectionReference(zs, settings.value))
  })

  function sweepOf(ladder: readonly ElementJson[]): Complex[] {
    if (bandFrequencies.value.length === 0) return []
    return sweep({
      blocks: measured.files,
      z0: z0.value,
      frequencies: bandFrequencies.value,
      load: bandLoadZ.value,
      elements: withReferenceFrequency(computable(ladder), frequencyHz.value),
    })
  }
  function gammaAcrossBand(impedances: readonly Complex[]): Complex[] {
    return impedances.map((z, k) => gammaOf(z, bandReferences.value[k]!))
  }
  function returnLossAcrossBand(gammas: readonly Complex[]): number[] {
    return gammas.map(g => returnLossDb(g))
  }

  /** Source-end impedance (Ω) at each band frequency, draft applied. */
  const bandSweep = computed(() => sweepOf(effectiveElements.value))
  /** Γ at each band frequency against the source (power wave) or z0. */
  const bandGamma = computed(() => gammaAcrossBand(bandSweep.value))
  const bandReturnLossDb = computed(() => returnLossAcrossBand(bandGamma.value))
  const bandVerdict = computed(() => verdictOf(bandFrequencies.value, bandReturnLossDb.value, settings.value.spec))

  /** True while a drag draft exists (a boolean, so readers are not woken by every draft move). */
  const isDragging = computed(() => draft.value !== null)
  // The band as the secondary panels read it (frequency markers, the snap-all "now" row): during a
  // drag it follows settledElements (every 120 ms), outside a drag it is the live band itself.
  const settledBandSweep = computed(() => (isDragging.value ? sweepOf(settledElements.value) : bandSweep.value))
  const settledBandReturnLossDb = computed(() => (isDragging.value
    ? returnLossAcrossBand(gammaAcrossBand(settledBandSweep.value))
    : bandReturnLossDb.value))
  const settledBandVerdict = computed(() => (isDragging.value
    ? verdictOf(bandFrequencies.value, settledBandReturnLossDb.value, settings.value.spec)
    : bandVerdict.value))

  /** The series the parts list rounds to: the snap series, or E24 when snapping is off. */
  const partsSeries = computed<Exclude<SnapSeries, 'none'>>(() =>
    settings.value.snapSeries === 'none' ? 'E24' : settings.value.snapSeries)
  const snappedElements = computed(() => snapped(settledElements.value, partsSeries.value))
  const snappedBandGamma = computed(() => gammaAcrossBand(sweepOf(snappedElements.value)))
  const snappedBandReturnLossDb = computed(() => returnLossAcrossBand(snappedBandGamma.value))
  const snappedBandVerdict = computed(() => verdictOf(bandFrequencies.value, snappedBandReturnLossDb.value, settings.value.spec))

  const partsList = computed(() => partRows(settledElements.value, partsSeries.value))

  /** What the band plot draws: return loss (dB) or |Γ| per frequency, as drawn and as snapped. */
  const bandPlot = computed(() => {
    const isReturnLoss = plotQuantity.value === 'returnLoss'
    const magnitude = (g: Complex) => Math.hypot(g.re, g.im)
    const minRl = settings.value.spec.minReturnLossDb
    return {
      quantity: plotQuantity.value,
      frequenciesHz: bandFrequencies.value,
      values: isReturnLoss ? bandReturnLossDb.value : bandGamma.value.map(magnitude),
      snappedValues: isReturnLoss ? snappedBandReturnLossDb.value : snappedBandGamma.value.map(magnitude),
      // The spec line: RL ≥ min, or equivalently |Γ| ≤ 10^(−min/20).
      threshold: isReturnLoss ? minRl : 10 ** (-minRl / 20),
      spec: settings.value.spec,
    }
  })

  const solveResult = computed(() => matchSolutions({
    z0: z0.value, frequencyHz: frequencyHz.value, loadZ: loadZ.value, goal: goal.value, loadedQ: loadedQ.value,
  }))
  /** Each solution with its return loss at the design frequency and its band verdict. */
  const solutions = computed(() => solveResult.value.solutions.map((s) => {
    const points = traceOf(s.elements)
    const gamma = gammaOf(points[points.length - 1]!, reference.value)
    const bandRl = returnLossAcrossBand(gammaAcrossBand(sweepOf(s.elements)))
    return { ...s, returnLossDb: returnLossDb(gamma), verdict: verdictOf(bandFrequencies.value, bandRl, settings.value.spec) }
  }))
  const solveNotes = computed(() => solveResult.value.notes)
  /** The solver preview traced at the design frequency, for the chart's dashed trace. */
  const previewTrace = computed<Complex[] | null>(() => preview.value ? traceOf(preview.value) : null)

  // ---- document lifecycle ----
  const boardDoc = useBoardDoc()

  function applySnapshot(snapshot: BoardSnapshot) {
    useAmplifierStore().applySides(snapshot)
    settings.value = snapshot.settings
    elements.value = snapshot.elements
    problems.value = snapshot.problems
    const ids = new Set(snapshot.elements.map(e => e.id))
    if (selectedId.value && !ids.has(selectedId.value)) selectedId.value = null
    if (draft.value && !ids.has(draft.value.elementId)) draft.value = null
  }
  function setHistory(history: { canUndo: boolean, canRedo: boolean }) {
    canUndo.value = history.canUndo
    canRedo.value = history.canRedo
  }

  /** Opens a board (from GET /api/boards/:id) as the document being edited. */
  function openBoard(record: BoardRecordInput, options: { readOnly?: boolean, live?: boolean } = {}) {
    boardId.value = record.id
    name.value = record.name
    workspace.value = record.workspace ?? ''
    readOnly.value = options.readOnly ?? false
    selectedId.value = null
    draft.value = null
    preview.value = null
    cloud.value = null
    lastError.value = null
    if (options.live) {
      // The live provider fills an empty document by syncing with the server's copy; a document
      // built from this JSON would duplicate every element on merge. Show the JSON meanwhile.
      boardDoc.openState({ applySnapshot, setHistory })
      applySnapshot({ settings: record.settings, elements: record.elements, problems: [] } as BoardSnapshot)
    }
    else boardDoc.open({ settings: record.settings, elements: record.elements }, { applySnapshot, setHistory })
    isLoaded.value = true
  }
  function closeBoard() {
    boardDoc.close()
    isLoaded.value = false
    boardId.value = null
  }

  /** Runs one edit; a refusal is kept in lastError and returned as its message (null when done). */
  function edit(run: () => void): string | null {
    if (readOnly.value) return (lastError.value = 'This board is read-only for you.')
    try {
      run()
      lastError.value = null
      return null
    }
    catch (error) {
      return (lastError.value = messageOf(error))
    }
  }

  // ---- ladder edits ----
  function addElement(element: ElementJson, index?: number): string | null {
    let id: string | null = null
    edit(() => { id = boardDoc.addElement(element, index) })
    if (id) selectedId.value = id
    return id
  }
  function addFromPalette(additionId: string): string | null {
    const addition = ELEMENT_ADDITIONS.find(a => a.id === additionId)
    if (!addition) return null
    return addElement(addition.make(settings.value))
  }
  const removeElement = (id: string) => edit(() => boardDoc.removeElement(id))
  const moveElement = (id: string, toIndex: number) => edit(() => boardDoc.moveElement(id, toIndex))
  const updateElement = (id: string, patch: Record<string, unknown>) => edit(() => boardDoc.updateElement(id, patch))
  const setLocked = (id: string, locked: boolean) => edit(() => boardDoc.setLocked(id, locked))

  /**
   * Sets one field of an element from typed text ("4.7p", "12n", "45°"). Returns null when
   * done, or the message saying why the text was refused (the document is then untouched).
   */
  function setElementField(id: string, field: EditField, text: string): EntryReply {
    const element = elements.value.find(e => e.id === id)
    if (!element) return 'That element is no longer on the board.'
    try {
      const { value, warning } = readFieldValue(element.kind, field, text)
      return replyOf(updateElement(id, { [field]: value }), warning)
    }
    catch (error) {
      return messageOf(error)
    }
  }

  /** Sets or (with empty text) removes the finite Q of an L or C; returns the refusal or null. */
  function setElementQ(id: string, text: string): EntryReply {
    const element = elements.value.find(e => e.id === id)
    if (!element || (element.kind !== 'L' && element.kind !== 'C')) return 'Only inductors and capacitors take a Q.'
    if (!text.trim() || text.trim() === '∞') return updateElement(id, { q: undefined })
    return setElementField(id, 'q', text)
  }

  function select(id: string | null) {
    selectedId.value = id
  }

  // ---- dragging on the chart: a draft in the store, one transaction on release ----
  function beginDrag(elementId: string): boolean {
    const element = elements.value.find(e => e.id === elementId)
    if (!element || element.locked || readOnly.value || element.kind === 'xfmr') return false
    const value = (element as Record<string, unknown>)[mainFieldOf(element.kind)] as number
    draft.value = { elementId, value }
    selectedId.value = elementId
    return true
  }
  /** Moves the draft value (snapped to the snap series for L, C and R). The document is untouched. */
  function dragTo(value: number) {
    const d = draft.value
    if (!d || !Number.isFinite(value) || value < 0) return
    const element = elements.value.find(e => e.id === d.elementId)
    const series = settings.value.snapSeries
    const isLumped = element && (element.kind === 'L' || element.kind === 'C' || element.kind === 'R')
    const next = isLumped && series !== 'none' && value > 0 ? nearestStandard(value, series) : value
    draft.value = { elementId: d.elementId, value: next }
  }
  /** Writes the draft as one transaction (one undo step). Returns a refusal message or null. */
  function commitDrag(): string | null {
    const d = draft.value
    if (!d) return null
    const element = elements.value.find(e => e.id === d.elementId)
    draft.value = null
    if (!element) return null
    const field = mainFieldOf(element.kind)
    if ((element as Record<string, unknown>)[field] === d.value) return null
    return updateElement(d.elementId, { [field]: d.value })
  }
  function cancelDrag() {
    draft.value = null
  }

  // ---- settings and terminals ----
  const updateSettings = (patch: Partial<BoardSettings>) => edit(() => boardDoc.updateSettings(patch))
  const setTerminal = (side: TerminalSide, terminal: Terminal) => edit(() => boardDoc.setTerminal(side, terminal))

  /** Sets one settings field from typed text; returns the refusal message or null. */
  function setSettingsField(field: SettingsField, text: string): EntryReply {
    try {
      const { patch, warning } = settingsEntry(settings.value, field, text)
      return replyOf(updateSettings(patch), warning)
    }
    catch (error) {
      return messageOf(error)
    }
  }
  /** Sets one value of a terminal from typed text; returns the refusal message or null. */
  function setTerminalField(side: TerminalSide, field: TerminalField, text: string): EntryReply {
    try {
      const { terminal, warning } = terminalEntry(settings.value[side], field, text)
      return replyOf(setTerminal(side, terminal), warning)
    }
    catch (error) {
      return messageOf(error)
    }
  }
  /** Switches a terminal's model, starting from its present impedance at the design frequency. */
  function setTerminalKind(side: TerminalSide, kind: Terminal['kind']): string | null {
    const current = settings.value[side]
    if (current.kind === kind) return null
    const z = side === 'load' ? loadZ.value : sourceZ.value
    if (kind === 'z0') return setTerminal(side, { kind: 'z0' })
    if (kind === 'impedance') return setTerminal(side, { kind: 'impedance', z: { re: Math.max(0, z.re), im: z.im } })
    return setTerminal(side, { kind: 'rlc', topology: 'series', r: Math.max(0, z.re) || z0.value })
  }
  function setTerminalTopology(side: TerminalSide, topology: 'series' | 'parallel'): string | null {
    const current = settings.value[side]
    if (current.kind !== 'rlc') return null
    return setTerminal(side, { ...current, topology })
  }

  // ---- solver ----
  function setPreview(ladder: ElementJson[] | null) {
    preview.value = ladder ? ladder.map((e, i) => ({ ...e, id: `preview-${i}` }) as BoardElement) : null
  }
  /** Replaces the ladder with a solution, as one undo step. */
  function applySolution(ladder: ElementJson[]): string | null {
    preview.value = null
    return edit(() => { boardDoc.replaceLadder(ladder) })
  }
  /** The band verdict of any ladder (a what-if), computed as the board's own band is. */
  function bandVerdictOf(ladder: readonly ElementJson[]) {
    return verdictOf(bandFrequencies.value, returnLossAcrossBand(gammaAcrossBand(sweepOf(ladder))), settings.value.spec)
  }
  /** Sets every L, C and R to its nearest value of `series` (default: the parts series), as one undo step. */
  function snapAll(series: Exclude<SnapSeries, 'none'> = partsSeries.value): string | null {
    return edit(() => { boardDoc.replaceLadder(snapped(elements.value, series)) })
  }
  function setCloud(points: Complex[] | null) {
    cloud.value = points
  }
  function setLoadedQ(q: number) {
    if (Number.isFinite(q) && q > 0) loadedQ.value = q
  }

  // ---- history ----
  function undo() {
    if (draft.value) return cancelDrag()
    boardDoc.undo()
  }
  function redo() {
    if (!draft.value) boardDoc.redo()
  }

  return {
    // state
    boardId, name, workspace, isLoaded, readOnly, settings, elements, problems, canUndo, canRedo,
    selectedId, draft, preview, lastError, loadedQ,
    showImpedanceGrid, showAdmittanceGrid, showQArcs, qArcValue, plotQuantity,
    // computed
    z0, frequencyHz, effectiveElements, settledElements, loadZ, sourceZ, goal, reference,
    traceAtDesign, endPoint, endpointReadout, endpointChartGamma,
    measuredIds, isMeasuredPending, measuredRange, bandOutsideHz,
    bandFrequencies, bandLoadZ, bandReferences, bandSweep, bandGamma, bandReturnLossDb, bandVerdict,
    isDragging, settledBandSweep, settledBandReturnLossDb, settledBandVerdict,
    partsSeries, snappedElements, snappedBandGamma, snappedBandReturnLossDb, snappedBandVerdict, partsList, bandPlot,
    solutions, solveNotes, previewTrace, analysisLadder, cloud,
    // actions
    openBoard, closeBoard, applySnapshot, setHistory,
    addElement, addFromPalette, removeElement, moveElement, updateElement, setLocked, setElementField, setElementQ, select,
    beginDrag, dragTo, commitDrag, cancelDrag,
    updateSettings, setTerminal, setSettingsField, setTerminalField, setTerminalKind, setTerminalTopology,
    setPreview, applySolution, setLoadedQ, snapAll, setCloud, bandVerdictOf,
    undo, redo,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useBoardStore, import.meta.hot))
