// Amplifier figures: every circle family (both stability circles, available- and operating-gain
// circles at 3 steps, noise circles at 3 steps) and the figures for 201 frequencies of the invented
// device file (interpolated), and the whole-cascade sweep of a board with 3 elements a side over
// 401 points (what a drag on an amplifier board recomputes for the band plot).
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import {
  amplifierSweep, availableGainCircle, deviceBand, noiseCircle, operatingGainCircle, parseTouchstone,
  stabilityCircle, type Element,
} from '../shared/rf/index'

type Timing = { medianMs: number; p95Ms: number }
export type AmplifierBenchResult = { circles201: Timing; figures201: Timing; cascade401: Timing }

const file = fileURLToPath(new URL('../tests/fixtures/amplifier/invented-phemt.s2p', import.meta.url))
const device = parseTouchstone(readFileSync(file, 'utf8'), 'invented-phemt.s2p')
const band = (n: number, f0: number, f1: number) => Array.from({ length: n }, (_, i) => f0 + ((f1 - f0) * i) / (n - 1))
export const AMP_INPUT: Element[] = [
  { kind: 'C', placement: 'shunt', value: 2.2e-12, q: 200 },
  { kind: 'L', placement: 'series', value: 12e-9, q: 40 },
  { kind: 'C', placement: 'shunt', value: 1e-12, q: 200 },
]
export const AMP_OUTPUT: Element[] = [
  { kind: 'L', placement: 'shunt', value: 27e-9, q: 40 },
  { kind: 'C', placement: 'series', value: 3.3e-12, q: 200 },
  { kind: 'L', placement: 'series', value: 3.9e-9, q: 40 },
]

function time(runs: number, work: () => unknown): Timing {
  for (let i = 0; i < 5; i++) work()
  const t: number[] = []
  for (let r = 0; r < runs; r++) {
    const s = performance.now()
    work()
    t.push(performance.now() - s)
  }
  t.sort((a, b) => a - b)
  return { medianMs: t[Math.floor(t.length / 2)]!, p95Ms: t[Math.floor(t.length * 0.95)]! }
}

export function runAmplifierBench(): AmplifierBenchResult {
  const f201 = band(201, 0.6e9, 5.8e9)
  const points = deviceBand(device, f201)
  const circles = () => {
    for (const p of points) {
      const s = p.s!
      stabilityCircle(s, 'source')
      stabilityCircle(s, 'load')
      for (const step of [1, 2, 3]) {
        availableGainCircle(s, p.figures!.maxGainDb - step)
        operatingGainCircle(s, p.figures!.maxGainDb - step)
        noiseCircle(p.noise!, p.noise!.nfminDb + 0.25 * step)
      }
    }
  }
  const f401 = band(401, 0.7e9, 1.0e9)
  return {
    circles201: time(60, circles),
    figures201: time(60, () => deviceBand(device, f201)),
    cascade401: time(60, () => amplifierSweep({ z0: 50, frequencies: f401, device, inputElements: AMP_INPUT, outputElements: AMP_OUTPUT })),
  }
}

export function printAmplifierBench(r: AmplifierBenchResult): void {
  const row = (name: string, t: Timing) => console.log(`  ${name.padEnd(58)} median ${t.medianMs.toFixed(3)} ms   p95 ${t.p95Ms.toFixed(3)} ms`)
  console.log('amplifier')
  row('every circle family (2 stability, 3+3 gain, 3 noise) × 201 f', r.circles201)
  row('device figures (K, μ, MAG/MSG, match, noise row) × 201 f', r.figures201)
  row('whole cascade, 3 + 3 elements, 401 f (drag band plot)', r.cascade401)
}
