// Ready-made matches for the board's present terminals, from the RF core's synthesis functions:
// every L-network, a pi and a T for a chosen loaded Q, single-stub matches and a quarter-wave
// transformer where they apply. Each comes back as a ladder the board can preview or use.
import {
  quarterWave, solveL, solvePi, solveStub, solveT, type Complex, type Element,
} from '../rf'
import type { ElementJson } from './schema'

export type SolutionFamily = 'L' | 'pi' | 'T' | 'stub' | 'quarter-wave'

export interface MatchSolution {
  id: string
  family: SolutionFamily
  title: string
  elements: ElementJson[]
}

export interface SolveRequest {
  z0: number
  frequencyHz: number
  /** The load impedance at the design frequency (Ω). */
  loadZ: Complex
  /** Where the ladder must end (Ω). */
  goal: Complex
  /** Loaded Q for the pi and T networks. */
  loadedQ: number
}

export interface SolveResult {
  solutions: MatchSolution[]
  /** Why a family has no entry (no solution, or the terminals do not suit it). */
  notes: Partial<Record<SolutionFamily, string>>
}

// A goal or load counts as real when its reactance is this small against its resistance.
const REAL_TOLERANCE = 1e-6

function isReal(z: Complex): boolean {
  return Math.abs(z.im) <= REAL_TOLERANCE * Math.max(1, Math.abs(z.re))
}

function topologyTitle(elements: readonly Element[]): string {
  return elements.map(e => (e.kind === 'L' || e.kind === 'C' || e.kind === 'R') ? `${e.placement} ${e.kind}` : e.kind).join(' → ')
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error)
}

function lNetworks(req: SolveRequest, out: SolveResult): void {
  try {
    const found = solveL({ z0: req.z0, frequency: req.frequencyHz, from: req.loadZ, to: req.goal })
    if (!found.length) out.notes.L = 'No two-element lossless match reaches the goal from this load.'
    found.forEach((elements, i) => out.solutions.push({
      id: `L-${i}`, family: 'L', title: elements.length ? topologyTitle(elements) : 'already matched', elements: [...elements],
    }))
  }
  catch (error) { out.notes.L = messageOf(error) }
}

function qNetworks(req: SolveRequest, out: SolveResult): void {
  const families = [['pi', solvePi], ['T', solveT]] as const
  for (const [family, solve] of families) {
    try {
      const found = solve({ z0: req.z0, frequency: req.frequencyHz, from: req.loadZ, to: req.goal, q: req.loadedQ })
      if (!found.length) out.notes[family] = `No ${family} network with loaded Q ${req.loadedQ} fits these terminals; try a higher Q.`
      found.forEach((elements, i) => out.solutions.push({
        id: `${family}-${i}`, family, title: `${family} (Q ${req.loadedQ}): ${topologyTitle(elements)}`, elements: [...elements],
      }))
    }
    catch (error) { out.notes[family] = messageOf(error) }
  }
}

function stubMatches(req: SolveRequest, out: SolveResult): void {
  if (!isReal(req.goal)) {
    out.notes.stub = 'A single-stub match needs a real goal impedance.'
    return
  }
  const lineZ0 = req.goal.re
  const fRef = req.frequencyHz
  for (const end of ['open', 'short'] as const) {
    try {
      const found = solveStub({ z0: lineZ0, frequency: fRef, load: req.loadZ, end })
      found.forEach(({ d, l }, i) => out.solutions.push({
        id: `stub-${end}-${i}`,
        family: 'stub',
        title: `line ${(d * 360).toFixed(1)}° + shunt ${end} stub ${(l * 360).toFixed(1)}°`,
        elements: [
          { kind: 'line', z0: lineZ0, deg: d * 360, fRef },
          { kind: 'stub', end, placement: 'shunt', z0: lineZ0, deg: l * 360, fRef },
        ],
      }))
    }
    catch (error) { out.notes.stub = messageOf(error) }
  }
}

function quarterWaveMatch(req: SolveRequest, out: SolveResult): void {
  if (!isReal(req.loadZ) || !isReal(req.goal) || req.loadZ.re <= 0) {
    out.notes['quarter-wave'] = 'A quarter-wave transformer needs a real load and a real goal.'
    return
  }
  try {
    const zq = quarterWave(req.loadZ.re, req.goal.re)
    out.solutions.push({
      id: 'quarter-wave',
      family: 'quarter-wave',
      title: `quarter-wave line of ${zq.toPrecision(4)} Ω`,
      elements: [{ kind: 'line', z0: zq, deg: 90, fRef: req.frequencyHz }],
    })
  }
  catch (error) { out.notes['quarter-wave'] = messageOf(error) }
}

/** Every ready-made match for the request; families that do not apply say why in `notes`. */
export function matchSolutions(req: SolveRequest): SolveResult {
  const out: SolveResult = { solutions: [], notes: {} }
  lNetworks(req, out)
  qNetworks(req, out)
  stubMatches(req, out)
  quarterWaveMatch(req, out)
  return out
}
