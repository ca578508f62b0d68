/**
 * Element stress at a source power: the RMS voltage across and current through each element at
 * one frequency, and whether a part is beyond its rating.
 *
 * Drive: the source is an RMS open-circuit voltage Vs behind its impedance Zs, and the power the
 * user gives is its AVAILABLE power, P_avail = |Vs|²/(4·Re Zs) — what it would deliver into a
 * conjugate match. The network then takes P_in = P_avail·(1 − |Γ|²) (power-wave Γ of the input
 * against Zs), so a mismatched ladder is stressed less than a matched one.
 *
 * Method: (V, I) walked from the load (Z_L, 1 A) to the source through each element's ABCD
 * matrix (abcd.ts), then scaled by one complex factor k = Vs/(V_in + Zs·I_in) so that the input
 * obeys V_in = Vs − Zs·I_in. For each element:
 * - series L, C, R or stub: I through = the branch current; V across = V(source side) − V(load side);
 * - shunt L, C, R or stub: V across = the node voltage; I through = I(source side) − I(load side);
 * - a modelled part (models.ts) counts the part alone: the current its pads to ground draw at
 *   the load-side node (jωCpad·V) is taken off (series: added back to the branch current);
 * - line, transformer and measured block: the larger of the two end values of V and of I. On a mismatched line
 *   the standing wave can peak between the ends, above both; a line's figures are therefore a
 *   lower bound of its peak.
 * - a stub also counts its far end: the open end's voltage, the short end's current (the larger
 *   of the terminal and far-end values is reported).
 * All values are RMS (phasors taken as RMS).
 */
import type { Complex, Element } from './types'
import { asComplex } from './complex'
import { RfInputError, requirePositive } from './errors'
import { requireFrequency, validateElements } from './elements'
import { applyAbcd, createVI, elementAbcdFlat } from './abcd'
import { loadVI } from './losses'
import type { BlockLookup } from './twoport'

/** An element with optional ratings (RMS): maximum voltage across (V) and current through (A). */
export type RatedElement = Element & { readonly vRatingV?: number; readonly iRatingA?: number }

/** Arguments of `elementStress`. */
export type StressInput = {
  readonly frequency: number
  readonly load: Complex
  /** The source impedance Zs (Ω), real part above zero. */
  readonly source: Complex
  /** The source's available power (W); see the file comment. */
  readonly powerW: number
  readonly elements: readonly RatedElement[]
  /** Measured two-port data for `block` elements, by upload id. */
  readonly blocks?: BlockLookup
}

/** The stress on one element, `index` as in the ladder (0 next to the load). */
export type ElementStress = {
  readonly index: number
  /** RMS voltage across the part (V). */
  readonly voltageRms: number
  /** RMS current through the part (A). */
  readonly currentRms: number
  /** Peak voltage across the part (V): √2 · RMS for the sine at the design frequency. */
  readonly voltagePeak: number
  /** Peak current through the part (A): √2 · RMS. */
  readonly currentPeak: number
  /** Power turned into heat in the part (W): its ESR or resistance; 0 for lossless kinds. */
  readonly dissipatedW: number
  /** Voltage rating (V), compared with the peak voltage: capacitor makers rate in DC or peak volts. */
  readonly vRatingV: number | null
  /** Current rating (A), compared with the RMS current: inductor current ratings are RMS (heating), common practice. */
  readonly iRatingA: number | null
  readonly isOverVoltage: boolean
  readonly isOverCurrent: boolean
}

export type StressResult = {
  readonly elements: ElementStress[]
  /** RMS open-circuit voltage of the source (V). */
  readonly sourceVoltageRms: number
  /** Power into the network (W) = P_avail·(1 − |Γ|²). */
  readonly inputPowerW: number
  /** Power into the load (W). */
  readonly loadPowerW: number
}

/** W from dBm: P = 10^((dBm − 30)/10). */
export function wattsFromDbm(dbm: number): number {
  return 10 ** ((dbm - 30) / 10)
}

/** dBm from W: 10·log10(P) + 30; −Infinity for 0 W. */
export function dbmFromWatts(watts: number): number {
  return 10 * Math.log10(watts) + 30
}

type Raw = { v: number; i: number; p: number }

function magnitude(re: number, im: number): number {
  return Math.hypot(re, im)
}

/** The far end of a stub: the open end's voltage or the short end's current, unscaled. */
function stubFarEnd(e: Extract<Element, { kind: 'stub' }>, f: number, v: [number, number], i: [number, number]): Raw {
  const m = elementAbcdFlat({ kind: 'line', z0: e.z0, deg: e.deg, fRef: e.fRef }, [f])
  const zc = e.z0
  if (e.end === 'open') {
    // (V_end, 0) → (A·V_end, C·V_end) = (V_in, I_in): divide by the larger of A and C·Zc.
    const a = magnitude(m.aRe[0]!, m.aIm[0]!)
    const c = magnitude(m.cRe[0]!, m.cIm[0]!)
    const vEnd = a >= c * zc ? magnitude(...v) / a : magnitude(...i) / c
    return { v: vEnd, i: 0, p: 0 }
  }
  const b = magnitude(m.bRe[0]!, m.bIm[0]!)
  const d = magnitude(m.dRe[0]!, m.dIm[0]!)
  const iEnd = d * zc >= b ? magnitude(...i) / d : magnitude(...v) / b
  return { v: 0, i: iEnd, p: 0 }
}

/**
 * The stress on every element at `frequency` for a source of available power `powerW` (see the
 * file comment for the definitions). Throws `RfInputError` for bad input, for a source without
 * resistance, and for a part that blocks the signal at this frequency (no current reaches the load).
 */
export function elementStress(input: StressInput): StressResult {
  const f = requireFrequency(input?.frequency, 'frequency')
  const powerW = input.powerW
  if (typeof powerW !== 'number' || !Number.isFinite(powerW) || powerW < 0) {
    throw new RfInputError('powerW', `must be a finite power of 0 W or more, got ${String(powerW)}`)
  }
  const elements = validateElements(input.elements, 'elements') as RatedElement[]
  const zs = asComplex(input.source, 'source')
  requirePositive(zs.re, 'source.re')
  const vi = loadVI([asComplex(input.load, 'load', true)])
  const loadPowerUnscaled = vi.vRe[0]! * vi.iRe[0]! + vi.vIm[0]! * vi.iIm[0]!
  const raw: Raw[] = []
  const before = createVI(1)
  elements.forEach((e, index) => {
    before.vRe[0] = vi.vRe[0]!; before.vIm[0] = vi.vIm[0]!; before.iRe[0] = vi.iRe[0]!; before.iIm[0] = vi.iIm[0]!
    const m = elementAbcdFlat(e, [f], input.blocks, `elements[${index}]`)
    if (m.blocked[0]) throw new RfInputError(`elements[${index}]`, `blocks the signal at ${f} Hz (an open in series or a short across); stress is undefined there`)
    applyAbcd(vi, m)
    const v0: [number, number] = [before.vRe[0]!, before.vIm[0]!]
    const i0: [number, number] = [before.iRe[0]!, before.iIm[0]!]
    const v1: [number, number] = [vi.vRe[0]!, vi.vIm[0]!]
    const i1: [number, number] = [vi.iRe[0]!, vi.iIm[0]!]
    // Power into the element's two ports: what it dissipates (zero for lossless kinds, up to rounding).
    const p = Math.max(0, v1[0] * i1[0] + v1[1] * i1[1] - (v0[0] * i0[0] + v0[1] * i0[1]))
    if (e.kind === 'line' || e.kind === 'xfmr' || e.kind === 'block') {
      raw.push({ v: Math.max(magnitude(...v0), magnitude(...v1)), i: Math.max(magnitude(...i0), magnitude(...i1)), p: 0 })
      return
    }
    const isSeries = e.placement === 'series'
    const across: [number, number] = isSeries ? [v1[0] - v0[0], v1[1] - v0[1]] : v0
    const through: [number, number] = isSeries ? [...i0] : [i1[0] - i0[0], i1[1] - i0[1]]
    // A modelled part's pads (to ground) carry jB·V0 at its load-side node: not the part's current.
    const padB = e.kind !== 'stub' && e.model?.padC ? 2 * Math.PI * f * e.model.padC : 0
    if (padB > 0) {
      const sign = isSeries ? 1 : -1
      through[0] -= sign * padB * v0[1]
      through[1] += sign * padB * v0[0]
    }
    const own: Raw = { v: magnitude(...across), i: magnitude(...through), p: e.kind === 'stub' ? 0 : p }
    if (e.kind === 'stub') {
      const far = stubFarEnd(e, f, across, through)
      own.v = Math.max(own.v, far.v)
      own.i = Math.max(own.i, far.i)
    }
    raw.push(own)
  })
  // Scale so that V_in = Vs − Zs·I_in with the RMS open-circuit voltage Vs = √(4·Rs·P_avail).
  const sourceVoltageRms = Math.sqrt(4 * zs.re * powerW)
  const vIn = [vi.vRe[0]!, vi.vIm[0]!] as const
  const iIn = [vi.iRe[0]!, vi.iIm[0]!] as const
  const driveRe = vIn[0] + zs.re * iIn[0] - zs.im * iIn[1]
  const driveIm = vIn[1] + zs.re * iIn[1] + zs.im * iIn[0]
  const drive = magnitude(driveRe, driveIm)
  if (!(drive > 0)) throw new RfInputError('load', 'with this ladder the input cancels the source impedance; no finite drive exists')
  const k = sourceVoltageRms / drive
  const k2 = k * k
  return {
    sourceVoltageRms,
    inputPowerW: k2 * Math.max(0, vIn[0] * iIn[0] + vIn[1] * iIn[1]),
    loadPowerW: k2 * loadPowerUnscaled,
    elements: raw.map((r, index) => {
      const e = elements[index]!
      const vRatingV = typeof e.vRatingV === 'number' ? e.vRatingV : null
      const iRatingA = typeof e.iRatingA === 'number' ? e.iRatingA : null
      const voltageRms = k * r.v
      const currentRms = k * r.i
      return {
        index,
        voltageRms,
        currentRms,
        voltagePeak: Math.SQRT2 * voltageRms,
        currentPeak: Math.SQRT2 * currentRms,
        dissipatedW: k2 * r.p,
        vRatingV,
        iRatingA,
        isOverVoltage: vRatingV !== null && Math.SQRT2 * voltageRms > vRatingV,
        isOverCurrent: iRatingA !== null && currentRms > iRatingA,
      }
    }),
  }
}
