import type { RevisionState } from '@/lib/review/workflow'
import { DEFAULT_LINK, DEFAULT_PIN } from '@/lib/calc/defaults'

/**
 * The demo scenario, invented for Inverso: Feldmark Maschinenbau builds a carton erector whose
 * flap pushers and glue heads ride on exact straight-line guides instead of linear rails.
 * Pure data, shared by the seed (server/demo), the demo renders and benches (scripts/) and tests.
 */
export const DEMO_PROJECT = {
  code: 'FM-CE40',
  name: 'Carton erector CE-40 — straight-line guides',
  client: 'Feldmark Maschinenbau (internal)',
}

export const DEMO_CALCS = [
  {
    number: 'LC-001',
    title: 'Top-flap pusher guide, 120 mm stroke',
    calcType: 'peaucellier',
    state: 'issued' as RevisionState,
    inputs: {
      mechanism: 'peaucellier',
      geometry: { arm: 250, side: 100, crank: 100, crankPivotOffset: 100 },
      loads: [
        { name: 'Pushing carton flap', fx: 0, fy: -180 },
        { name: 'Jam at end of stroke', fx: 120, fy: -420 },
      ],
      toggleMarginDeg: 5,
      requiredStroke: 120,
      basis: { kind: 'en1993', gammaM0: 1.0, gammaM1: 1.0, gammaM2: 1.25, gammaM6ser: 1.0 },
      factors: { load: 1.5, dynamic: 1.2 },
      defaults: { joint: DEFAULT_PIN, link: DEFAULT_LINK },
    },
  },
  {
    number: 'LC-002',
    title: 'Glue-head carriage guide, 250 mm stroke',
    calcType: 'hart',
    state: 'in-check' as RevisionState,
    inputs: {
      mechanism: 'hart',
      geometry: { long: 240, short: 100, ratio: 0.3, crank: 40, crankPivotOffset: 40 },
      loads: [{ name: 'Glue head weight and nozzle reaction', fx: 0, fy: -95 }],
      requiredStroke: 250,
      // The glue bead may wander 2 mm across the flap. The links are cut to ISO 2768-1 f; how straight
      // the built guide runs is checked with its pin clearance.
      straightnessTolerance: 2,
      tolerances: { toleranceClass: 'f', samples: 5000, seed: 1 },
      basis: { kind: 'aisc360', method: 'LRFD' },
      factors: { load: 1.6, dynamic: 1.1 },
      defaults: { joint: { ...DEFAULT_PIN, holeDiameter: 10.7 }, link: { ...DEFAULT_LINK, eye: { edgeAlong: 30, width: 40 } } },
    },
  },
  {
    number: 'LC-003',
    title: 'Side-flap folder guide, 150 mm stroke (first sizing)',
    calcType: 'peaucellier',
    state: 'draft' as RevisionState,
    inputs: {
      mechanism: 'peaucellier',
      geometry: { arm: 200, side: 80, crank: 75, crankPivotOffset: 75 },
      loads: [{ name: 'Folding a flap', fx: 0, fy: -140 }],
      requiredStroke: 150,
      // The folder runs at 90 cycles a minute with a 0.8 kg folding shoe on the tracer.
      operatingSpeed: { rpm: 90, toolMass: 0.8 },

      basis: { kind: 'allowable', factorOfSafety: 2.5 },
      factors: { load: 1, dynamic: 1.3 },
      defaults: { joint: { ...DEFAULT_PIN, pinDiameter: 8, holeDiameter: 8.4 }, link: { ...DEFAULT_LINK, section: { shape: 'flat', width: 20, thickness: 6 } } },
    },
  },
] as const
