/**
 * An amplifier across frequency: the device's figures at every frequency of a band (its S and noise
 * block interpolated as measured loads are: re/im linear in f, never extrapolated), and the whole
 * cascade — source terminal, input network, device, output network, load terminal.
 *
 * Orientation: each side's ladder is traced from its terminal (a real z0) towards the device, so
 * the input side's trace ends at the impedance the source side presents to the device's port 1
 * (ΓS) and the output side's at the one presented to port 2 (ΓL). `ladderSParameters` puts port 1
 * at the end a trace reaches last (here the device), port 2 at the terminal.
 */
import type { Complex, Element } from './types'
import { RfInputError, requirePositive } from './errors'
import { abcdToS, cascade, hasMeasuredData, ladderSParameters, sToAbcd, type Abcd, type BlockLookup, type TwoPortData } from './twoport'
import { applyElementToPoints, asFloat64, createPoints, setPoint } from './points'
import { validateElements } from './elements'
import { isUniformGrid } from './angles'
import { OPEN, SHORT } from './complex'
import { interpolateMatrices } from './interpolate'
import type { NoiseParameters } from './touchstone-records'
import { gammaOf, impedanceOf } from './gamma'
import { twoPortFigures, gammaIn, gammaOut, type TwoPortFigures } from './amplifier'
import { interpolateNoise, noiseFigureDb, type NoiseRow } from './noise'

/** A device file as parseTouchstone gives it; `noise` may be empty or absent. */
export type DeviceData = TwoPortData & { readonly noise?: readonly NoiseParameters[] }

/** The device at one frequency: null members outside the file's S (or noise) range. */
export type DevicePoint = {
  readonly frequencyHz: number
  readonly s: Complex[][] | null
  readonly figures: TwoPortFigures | null
  readonly noise: NoiseRow | null
}

function checkDevice(device: DeviceData): void {
  if (!device || !Array.isArray(device.s) || device.s[0]?.length !== 2) throw new RfInputError('device', 'must be a two-port (.s2p) file')
  requirePositive(device.z0, 'device.z0')
}

/** The device's S, figures and noise row at each frequency (Hz). */
export function deviceBand(device: DeviceData, frequenciesHz: ArrayLike<number>): DevicePoint[] {
  checkDevice(device)
  const { values } = interpolateMatrices(device.frequencies, device.s, frequenciesHz)
  const noise = interpolateNoise(device.noise ?? [], frequenciesHz)
  return values.map((s, i) => ({
    frequencyHz: frequenciesHz[i]!,
    s,
    figures: s ? twoPortFigures(s) : null,
    noise: noise[i]!,
  }))
}

/** Arguments of `amplifierSweep`. */
export type AmplifierInput = {
  /** The terminals' (and the ladders') real reference impedance, Ω. */
  readonly z0: number
  readonly frequencies: ArrayLike<number>
  readonly device: DeviceData
  /** Input side, from the source terminal towards the device. */
  readonly inputElements: readonly Element[]
  /** Output side, from the load terminal towards the device. */
  readonly outputElements: readonly Element[]
  readonly blocks?: BlockLookup
}

/** The amplifier at one frequency. Reflections at the device are against the device file's reference. */
export type AmplifierPoint = DevicePoint & {
  /** What the input network presents to port 1, and the output network to port 2. */
  readonly gammaS: Complex
  readonly gammaL: Complex
  /** The whole cascade's S against z0 (port 1 the source terminal, port 2 the load terminal); null outside the device's range. */
  readonly cascade: Complex[][] | null
  /** |S21|² of the cascade (network losses included), dB. */
  readonly transducerGainDb: number | null
  readonly inputReturnLossDb: number | null
  readonly outputReturnLossDb: number | null
  /** The device's noise figure at ΓS (the input network's own loss not included); null without noise data. */
  readonly noiseFigureDb: number | null
  /** |Γout(ΓS)| < 1 and |Γin(ΓL)| < 1: neither network presents a reflection in its plane's unstable region. */
  readonly isTerminationStable: boolean | null
}

/**
 * Each side's chain matrix at every frequency, port 1 at the device end. The kernel (points.ts) maps
 * (V, I) at the terminal to (V, I) at the device, so running it on (1, 0) and (0, 1) without
 * rescaling gives the columns (A, C) and (B, D). A side with measured parts takes the slower
 * element-by-element product instead (their matrices come from files).
 */
function sideAbcd(elements: readonly Element[], frequenciesHz: ArrayLike<number>, z0: number, blocks: BlockLookup | undefined, path: string): Abcd[] {
  const checked = validateElements(elements, path, { requireFRef: true })
  if (checked.some(hasMeasuredData)) {
    return ladderSParameters({ z0, frequencies: frequenciesHz, elements: checked, blocks }).map(s => sToAbcd(s, z0))
  }
  const f = asFloat64(frequenciesHz)
  const n = f.length
  const first = createPoints(n), second = createPoints(n)
  for (let i = 0; i < n; i++) { setPoint(first, i, OPEN); setPoint(second, i, SHORT) }
  const uniformGrid = isUniformGrid(f)
  for (const e of checked) {
    applyElementToPoints(first, e, f, { uniformGrid, rescale: false })
    applyElementToPoints(second, e, f, { uniformGrid, rescale: false })
  }
  const out: Abcd[] = new Array(n)
  for (let i = 0; i < n; i++) {
    out[i] = {
      a: { re: first.aRe[i]!, im: first.aIm[i]! }, c: { re: first.bRe[i]!, im: first.bIm[i]! },
      b: { re: second.aRe[i]!, im: second.aIm[i]! }, d: { re: second.bRe[i]!, im: second.bIm[i]! },
    }
  }
  return out
}

/** Γ against z0 of the impedance a side presents with z0 on its terminal: Z = (A·z0 + B)/(C·z0 + D). */
function presented(m: Abcd, z0: number): Complex {
  const nr = m.a.re * z0 + m.b.re, ni = m.a.im * z0 + m.b.im
  const dr = m.c.re * z0 + m.d.re, di = m.c.im * z0 + m.d.im
  // Γ = (Z − z0)/(Z + z0) = (N − z0·D')/(N + z0·D') with Z = N/D'.
  const ar = nr - z0 * dr, ai = ni - z0 * di, br = nr + z0 * dr, bi = ni + z0 * di
  const d = br * br + bi * bi
  return { re: (ar * br + ai * bi) / d, im: (ai * br - ar * bi) / d }
}

/** The same reciprocal network seen from its other end: A and D swap. */
const reversed = (m: Abcd): Abcd => ({ a: m.d, b: m.b, c: m.c, d: m.a })

const db20 = (x: Complex) => -20 * Math.log10(Math.hypot(x.re, x.im))
const mag = (x: Complex) => Math.hypot(x.re, x.im)

/** Γ against `from` (Ω, real) re-expressed against `to`. */
function rereference(gamma: Complex, from: number, to: number): Complex {
  return from === to ? gamma : gammaOf(impedanceOf(gamma, from), to)
}

/**
 * The amplifier across `frequencies`: ΓS, ΓL, the cascade's S, gain, both return losses, the
 * device's noise figure and the stability of the terminations at each frequency. Frequencies
 * outside the device file's range keep the networks' reflections and null figures.
 */
export function amplifierSweep(input: AmplifierInput): AmplifierPoint[] {
  const z0 = requirePositive(input?.z0, 'z0')
  const device = input.device
  const dz0 = device?.z0
  const points = deviceBand(device, input.frequencies)
  const mIn = sideAbcd(input.inputElements, input.frequencies, z0, input.blocks, 'inputElements')
  const mOut = sideAbcd(input.outputElements, input.frequencies, z0, input.blocks, 'outputElements')
  return points.map((point, k) => {
    const gammaS = rereference(presented(mIn[k]!, z0), z0, dz0)
    const gammaL = rereference(presented(mOut[k]!, z0), z0, dz0)
    const base = { ...point, gammaS, gammaL }
    if (!point.s) {
      return { ...base, cascade: null, transducerGainDb: null, inputReturnLossDb: null, outputReturnLossDb: null, noiseFigureDb: null, isTerminationStable: null }
    }
    const whole = abcdToS(cascade(cascade(reversed(mIn[k]!), sToAbcd(point.s, dz0)), mOut[k]!), z0)
    const stable = mag(gammaOut(point.s, gammaS)) < 1 && mag(gammaIn(point.s, gammaL)) < 1
    return {
      ...base,
      cascade: whole,
      transducerGainDb: -db20(whole[1]![0]!),
      inputReturnLossDb: db20(whole[0]![0]!),
      outputReturnLossDb: db20(whole[1]![1]!),
      noiseFigureDb: point.noise && mag(gammaS) <= 1 ? noiseFigureDb(point.noise, gammaS) : null,
      isTerminationStable: stable,
    }
  })
}

