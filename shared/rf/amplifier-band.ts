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
import { abcdToS, cascade, ladderSParameters, sToAbcd, type BlockLookup, type TwoPortData } from './twoport'
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

const db20 = (x: Complex) => -20 * Math.log10(Math.hypot(x.re, x.im))
const flip = (s: Complex[][]): Complex[][] => [[s[1]![1]!, s[1]![0]!], [s[0]![1]!, s[0]![0]!]]
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
  const sIn = ladderSParameters({ z0, frequencies: input.frequencies, elements: input.inputElements, blocks: input.blocks })
  const sOut = ladderSParameters({ z0, frequencies: input.frequencies, elements: input.outputElements, blocks: input.blocks })
  return points.map((point, k) => {
    const gammaS = rereference(sIn[k]![0]![0]!, z0, dz0)
    const gammaL = rereference(sOut[k]![0]![0]!, z0, dz0)
    const base = { ...point, gammaS, gammaL }
    if (!point.s) {
      return { ...base, cascade: null, transducerGainDb: null, inputReturnLossDb: null, outputReturnLossDb: null, noiseFigureDb: null, isTerminationStable: null }
    }
    const whole = abcdToS(cascade(cascade(sToAbcd(flip(sIn[k]!), z0), sToAbcd(point.s, dz0)), sToAbcd(sOut[k]!, z0)), z0)
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

