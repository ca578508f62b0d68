// An amplifier board's view: the device file (fetched like any measured upload), its two side
// ladders as plain snapshots, and the computed figures at the design frequency and across the band.
// Edits go through useBoardDoc; nothing here holds a Y.Doc.
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef, watch } from 'vue'
import {
  amplifierSweep, impedanceOf, solveL, twoPortFigures, withDefaultQ,
  type Complex, type DeviceData, type Element,
} from '#shared/rf'
import { bandFrequencies as bandGrid, withReferenceFrequency } from '#shared/board/band'
import type { AmplifierSide, BoardElement, BoardSettings, BoardSnapshot, DeviceRef } from '#shared/board/schema'
import { useBoardDoc } from '~/composables/useBoardDoc'
import { useMeasuredStore } from '~/stores/measured'

export const useAmplifierStore = defineStore('amplifier', () => {
  const device = ref<DeviceRef | null>(null)
  const inputSide = shallowRef<BoardElement[]>([])
  const outputSide = shallowRef<BoardElement[]>([])
  const settings = shallowRef<BoardSettings | null>(null)
  /** The side being edited (session only). */
  const editing = ref<AmplifierSide>('inputSide')
  const lastError = ref<string | null>(null)
  const measured = useMeasuredStore()

  function applySides(snapshot: BoardSnapshot) {
    settings.value = snapshot.settings
    device.value = snapshot.settings.device ?? null
    inputSide.value = snapshot.inputSide ?? []
    outputSide.value = snapshot.outputSide ?? []
  }
  watch(device, (d) => { if (d) void measured.ensure([d.uploadId]) }, { immediate: true })

  const deviceData = computed<DeviceData | null>(() => {
    const d = device.value
    return d ? (measured.files[d.uploadId] as DeviceData | undefined) ?? null : null
  })
  const isAmplifier = computed(() => device.value !== null)

  function ladderOf(side: readonly BoardElement[], f: number): Element[] {
    return withReferenceFrequency(withDefaultQ(side, settings.value?.defaultQ), f) as Element[]
  }

  /** The amplifier at the design frequency (the nearest measured point when it is outside the file). */
  const atDesign = computed(() => {
    const data = deviceData.value, s = settings.value
    if (!data || !s) return null
    try {
      const f = s.frequencyHz
      const [point] = amplifierSweep({
        z0: s.z0, frequencies: [f], device: data,
        inputElements: ladderOf(inputSide.value, f), outputElements: ladderOf(outputSide.value, f),
      })
      lastError.value = null
      return point!.s ? { ...point!, figures: point!.figures ?? twoPortFigures(point!.s) } : null
    }
    catch (error) {
      lastError.value = error instanceof Error ? error.message : String(error)
      return null
    }
  })

  /** The band results: gain, noise figure, both return losses, and where the terminations are unstable. */
  const band = computed(() => {
    const data = deviceData.value, s = settings.value
    if (!data || !s) return []
    try {
      const frequencies = bandGrid(s)
      return amplifierSweep({
        z0: s.z0, frequencies, device: data,
        inputElements: ladderOf(inputSide.value, s.frequencyHz), outputElements: ladderOf(outputSide.value, s.frequencyHz),
      })
    }
    catch {
      return []
    }
  })

  /** Every frequency of the device file (in the band or not) where the device or its terminations may oscillate. */
  const unstableHz = computed(() => {
    const data = deviceData.value, s = settings.value
    if (!data || !s) return []
    try {
      return amplifierSweep({
        z0: s.z0, frequencies: data.frequencies, device: data,
        inputElements: ladderOf(inputSide.value, s.frequencyHz), outputElements: ladderOf(outputSide.value, s.frequencyHz),
      }).filter(p => !p.figures?.unconditionallyStable || p.isTerminationStable === false).map(p => p.frequencyHz)
    }
    catch {
      return []
    }
  })

  /** Targets a side can be solved towards, as the Γ the side must present to the device. */
  const targets = computed(() => {
    const p = atDesign.value
    if (!p) return { inputSide: [], outputSide: [] } as Record<AmplifierSide, { label: string, gamma: Complex }[]>
    const input: { label: string, gamma: Complex }[] = []
    const output: { label: string, gamma: Complex }[] = []
    if (p.noise) input.push({ label: 'Γopt (least noise)', gamma: p.noise.gammaOpt })
    if (p.figures.gammaMS) input.push({ label: 'ΓMS (conjugate match)', gamma: p.figures.gammaMS })
    if (p.figures.gammaML) output.push({ label: 'ΓML (conjugate match)', gamma: p.figures.gammaML })
    return { inputSide: input, outputSide: output }
  })

  /** Replaces a side with the first L-network that takes its Z0 terminal to the target Γ. */
  function solveSide(side: AmplifierSide, gamma: Complex): boolean {
    const s = settings.value, data = deviceData.value
    if (!s || !data) return false
    try {
      const to = impedanceOf(gamma, data.z0)
      const [first] = solveL({ z0: s.z0, frequency: s.frequencyHz, from: { re: s.z0, im: 0 }, to })
      if (!first) {
        lastError.value = 'No two-element network reaches that point from the Z0 terminal.'
        return false
      }
      useBoardDoc().replaceSide(side, first as never)
      return true
    }
    catch (error) {
      lastError.value = error instanceof Error ? error.message : String(error)
      return false
    }
  }

  function setDevice(ref: DeviceRef | null) {
    useBoardDoc().setDevice(ref)
  }

  function updateSideValue(side: AmplifierSide, id: string, value: number) {
    try {
      useBoardDoc().updateSideElement(side, id, { value })
    }
    catch (error) {
      lastError.value = error instanceof Error ? error.message : String(error)
    }
  }

  return {
    device, inputSide, outputSide, settings, editing, lastError, deviceData, isAmplifier, atDesign, band,
    unstableHz, targets, applySides, solveSide, setDevice, updateSideValue,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useAmplifierStore, import.meta.hot))
