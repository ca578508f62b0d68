import { describe, expect, it } from 'vitest'
import { trace, gammaOf } from '../../../shared/rf'
import { matchSolutions } from '../../../shared/board/solutions'

function endGammaMagnitude(elements: Parameters<typeof trace>[0]['elements'], load: { re: number, im: number }, goal: { re: number, im: number }, f: number) {
  const points = trace({ z0: 50, frequency: f, load, elements })
  const end = points[points.length - 1]!
  // Distance from the goal, as Γ of the end against the conjugate of the goal (a power wave).
  return Math.hypot(...Object.values(gammaOf(end, { re: goal.re, im: -goal.im })))
}

describe('matchSolutions', () => {
  it('lists L, pi, T and stub matches that all reach a Z0 goal from the soil-node antenna', () => {
    const req = { z0: 50, frequencyHz: 915e6, loadZ: { re: 18, im: -32 }, goal: { re: 50, im: 0 }, loadedQ: 3 }
    const { solutions, notes } = matchSolutions(req)
    const families = new Set(solutions.map(s => s.family))
    expect(families).toEqual(new Set(['L', 'pi', 'T', 'stub']))
    expect(notes['quarter-wave']).toMatch(/real load/)
    for (const s of solutions) {
      expect(endGammaMagnitude(s.elements, req.loadZ, req.goal, req.frequencyHz), s.id).toBeLessThan(1e-6)
    }
    const stubs = solutions.filter(s => s.family === 'stub')
    expect(stubs.some(s => s.elements[1]!.kind === 'stub' && s.elements[1]!.end === 'open')).toBe(true)
    expect(stubs.some(s => s.elements[1]!.kind === 'stub' && s.elements[1]!.end === 'short')).toBe(true)
  })

  it('offers a quarter-wave line for a real load and says why stubs are absent for a complex goal', () => {
    const real = matchSolutions({ z0: 50, frequencyHz: 1e9, loadZ: { re: 100, im: 0 }, goal: { re: 50, im: 0 }, loadedQ: 3 })
    const qw = real.solutions.find(s => s.family === 'quarter-wave')!
    // Z = sqrt(100 · 50) = 70.71 Ω (the quarter-wave transformer's textbook result).
    expect(qw.elements[0]).toMatchObject({ kind: 'line', deg: 90 })
    expect((qw.elements[0] as { z0: number }).z0).toBeCloseTo(Math.sqrt(5000), 9)
    const complex = matchSolutions({ z0: 50, frequencyHz: 868e6, loadZ: { re: 24, im: -71.9 }, goal: { re: 42, im: -9 }, loadedQ: 3 })
    expect(complex.solutions.some(s => s.family === 'stub')).toBe(false)
    expect(complex.notes.stub).toMatch(/real goal/)
    for (const s of complex.solutions) {
      expect(endGammaMagnitude(s.elements, { re: 24, im: -71.9 }, { re: 42, im: -9 }, 868e6), s.id).toBeLessThan(1e-6)
    }
  })
})
