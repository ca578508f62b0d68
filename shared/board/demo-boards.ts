// Demo boards of our invented scenario: Brackwater Sensor Works build soil-moisture nodes with a
// 915 MHz chip antenna and a gateway with a 2.4 GHz radio module. All values are invented for the
// demo; they are plausible for such parts, not measurements of a real product.
import type { BoardElement, BoardSettings } from './schema'
import { SCHEMA_VERSION } from './schema'

export interface DemoBoard {
  id: string
  name: string
  workspace: 'brackwater'
  settings: BoardSettings
  elements: BoardElement[]
}

export const DEMO_BOARDS: DemoBoard[] = [
  {
    // The soil node's chip antenna as measured on the carrier board at 915 MHz, matched to the
    // 50 Ω radio with a series L and a shunt C. The C is still short of its final value.
    id: 'brackwater-915-antenna',
    name: 'Soil node: 915 MHz chip antenna',
    workspace: 'brackwater',
    settings: {
      schemaVersion: SCHEMA_VERSION,
      z0: 50,
      frequencyHz: 915e6,
      bandStartHz: 880e6,
      bandStopHz: 950e6,
      bandPoints: 141,
      load: { kind: 'impedance', z: { re: 18, im: -32 } },
      source: { kind: 'z0' },
      spec: { minReturnLossDb: 10, f1Hz: 902e6, f2Hz: 928e6 },
      snapSeries: 'E12',
    },
    elements: [
      { id: 'ant-l1', kind: 'L', placement: 'series', value: 10e-9, q: 45, tolerance: 0.02 },
      { id: 'ant-c1', kind: 'C', placement: 'shunt', value: 3.9e-12, tolerance: 0.03 },
    ],
  },
  {
    // The gateway's 2.4 GHz module: its output (modelled as 25 Ω in series with 1.1 nH) delivered
    // into the 50 Ω antenna feed, through a short 50 Ω trace, a shunt L and a DC-blocking series C.
    id: 'brackwater-gateway-2g4',
    name: 'Gateway: 2.4 GHz module output',
    workspace: 'brackwater',
    settings: {
      schemaVersion: SCHEMA_VERSION,
      z0: 50,
      frequencyHz: 2.44e9,
      bandStartHz: 2.35e9,
      bandStopHz: 2.55e9,
      bandPoints: 201,
      load: { kind: 'impedance', z: { re: 50, im: 0 } },
      source: { kind: 'rlc', topology: 'series', r: 25, l: 1.1e-9 },
      spec: { minReturnLossDb: 12, f1Hz: 2.4e9, f2Hz: 2.4835e9 },
      snapSeries: 'E24',
    },
    elements: [
      { id: 'gw-line1', kind: 'line', z0: 50, deg: 14, fRef: 2.44e9 },
      { id: 'gw-l1', kind: 'L', placement: 'shunt', value: 3.3e-9, q: 30, tolerance: 0.05 },
      { id: 'gw-c1', kind: 'C', placement: 'series', value: 1.5e-12, tolerance: 0.05 },
    ],
  },
  {
    // The 868 MHz variant's LNA input (modelled as 24 Ω in series with 2.55 pF) matched to the
    // output of the SAW filter ahead of it, about 42 + j9 Ω.
    id: 'brackwater-868-lna',
    name: 'EU node: 868 MHz LNA input',
    workspace: 'brackwater',
    settings: {
      schemaVersion: SCHEMA_VERSION,
      z0: 50,
      frequencyHz: 868e6,
      bandStartHz: 850e6,
      bandStopHz: 886e6,
      bandPoints: 121,
      load: { kind: 'rlc', topology: 'series', r: 24, c: 2.55e-12 },
      source: { kind: 'impedance', z: { re: 42, im: 9 } },
      spec: { minReturnLossDb: 10, f1Hz: 863e6, f2Hz: 870e6 },
      snapSeries: 'E24',
    },
    elements: [
      { id: 'lna-l1', kind: 'L', placement: 'series', value: 18e-9, q: 35, tolerance: 0.05 },
      { id: 'lna-c1', kind: 'C', placement: 'shunt', value: 4.7e-12, tolerance: 0.05 },
    ],
  },
]

export function demoBoardById(id: string): DemoBoard | undefined {
  return DEMO_BOARDS.find(b => b.id === id)
}
