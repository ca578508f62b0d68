// The readout of one impedance point: Z, Y, Γ, VSWR, return loss, mismatch loss and node Q.
import {
  gammaOf, mismatchLossDb, nodeQ, reciprocal, returnLossDb, vswr, type Complex,
} from '../rf'

export interface PointReadout {
  z: Complex
  y: Complex
  gamma: Complex
  gammaMagnitude: number
  gammaAngleDeg: number
  vswr: number
  returnLossDb: number
  mismatchLossDb: number
  nodeQ: number
}

/** The readout of `z` (Ω), with Γ against `reference` (a real z0, or a source impedance). */
export function readoutOf(z: Complex, reference: number | Complex): PointReadout {
  const gamma = gammaOf(z, reference)
  const magnitude = Math.hypot(gamma.re, gamma.im)
  // A lossy point can sit a hair outside |Γ| = 1 through rounding only; clamp for the figures.
  const passive = magnitude > 1 ? { re: gamma.re / magnitude, im: gamma.im / magnitude } : gamma
  return {
    z,
    y: reciprocal(z),
    gamma,
    gammaMagnitude: magnitude,
    gammaAngleDeg: (Math.atan2(gamma.im, gamma.re) * 180) / Math.PI,
    vswr: vswr(passive),
    returnLossDb: returnLossDb(gamma),
    mismatchLossDb: mismatchLossDb(passive),
    nodeQ: nodeQ(z),
  }
}
