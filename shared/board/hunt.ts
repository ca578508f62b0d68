// What a match search on a board looks at: the band spec's frequencies, the load the searched
// ladder sees (the board's load, or what a measured two-port block presents: the block and the
// elements before it stay in place), the parts' Q, and Fano's limit for that load: exact for an
// R-C or R-L model load, else an estimate from the model fitted at band centre.
import {
  bodeFanoLimitDb, fittedFanoModel, sweep, withDefaultQ,
  type BlockLookup, type Complex, type FanoInput, type SearchQ,
} from '../rf/index'
import { withReferenceFrequency } from './band'
import type { BoardElement, BoardSettings } from './schema'

export type HuntFano = { readonly model: FanoInput['model'], readonly limitDb: number, readonly isEstimate: boolean }

export type HuntPlan = {
  /** Band points inside the spec's f1…f2 (the whole band when fewer than two fall inside). */
  readonly frequencies: number[]
  /** The impedance the searched ladder starts from, per frequency (Ω). */
  readonly load: Complex[]
  /** Elements that stay: everything up to and including the last measured block. */
  readonly fixed: BoardElement[]
  readonly q: SearchQ | undefined
  readonly fano: HuntFano | null
}

export type HuntPlanInput = {
  readonly settings: BoardSettings
  readonly elements: readonly BoardElement[]
  readonly bandFrequencies: readonly number[]
  readonly bandLoadZ: readonly Complex[]
  readonly blocks?: BlockLookup
}

/** The model of an R-C or R-L load terminal (resistance with one reactive part), or null. */
function exactModel(settings: BoardSettings, band: { fStart: number, fStop: number }): HuntFano | null {
  const t = settings.load
  if (t.kind !== 'rlc' || !(t.r !== undefined && t.r > 0) || (t.c === undefined) === (t.l === undefined)) return null
  const model = `${t.topology}-${t.c !== undefined ? 'RC' : 'RL'}` as FanoInput['model']
  return { model, limitDb: bodeFanoLimitDb({ model, r: t.r, c: t.c, l: t.l, ...band }), isEstimate: false }
}

export function huntPlan(input: HuntPlanInput): HuntPlan {
  const { settings, elements } = input
  const inSpec = input.bandFrequencies.map((f, i) => ({ f, i })).filter(p => p.f >= settings.spec.f1Hz && p.f <= settings.spec.f2Hz)
  const picked = inSpec.length >= 2 ? inSpec : input.bandFrequencies.map((f, i) => ({ f, i }))
  const frequencies = picked.map(p => p.f)
  const lastBlock = elements.map(e => e.kind).lastIndexOf('block')
  const fixed = elements.slice(0, lastBlock + 1)
  const terminalLoad = picked.map(p => input.bandLoadZ[p.i]!)
  const load = fixed.length === 0 || frequencies.length === 0
    ? terminalLoad
    : sweep({
        z0: settings.z0, frequencies, load: terminalLoad, blocks: input.blocks,
        elements: withReferenceFrequency(withDefaultQ(fixed, settings.defaultQ), settings.frequencyHz),
      })
  let fano: HuntFano | null = null
  if (frequencies.length >= 2) {
    const band = { fStart: frequencies[0]!, fStop: frequencies[frequencies.length - 1]! }
    fano = fixed.length === 0 ? exactModel(settings, band) : null
    if (!fano) {
      const fit = fittedFanoModel(frequencies, load, band)
      fano = fit ? { model: fit.model, limitDb: fit.limitDb, isEstimate: true } : null
    }
  }
  return { frequencies, load, fixed, q: settings.defaultQ, fano }
}
