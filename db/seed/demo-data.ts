/**
 * The demo scenario, invented for Inverso: Feldmark Maschinenbau builds a carton erector whose
 * flap pushers and glue heads ride on exact straight-line guides instead of linear rails.
 */
export const DEMO_PASSWORD = 'demo-pass-2027'

export const DEMO_USERS = [
  { key: 'admin', email: 'admin@feldmark.example', name: 'Jonas Feld', isAdmin: true },
  { key: 'engineer', email: 'ines.vogt@feldmark.example', name: 'Ines Vogt', isAdmin: false },
  { key: 'checker', email: 'tomas.brandt@feldmark.example', name: 'Tomas Brandt', isAdmin: false },
  { key: 'approver', email: 'mara.lind@feldmark.example', name: 'Mara Lind', isAdmin: false },
] as const

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
    state: 'issued',
    inputs: {
      mechanism: 'peaucellier',
      geometry: { arm: 250, side: 100, crank: 70, crankPivotOffset: 70 },
      loads: [
        { name: 'Pushing carton flap', fx: 0, fy: -180 },
        { name: 'Jam at end of stroke', fx: 120, fy: -420 },
      ],
    },
  },
  {
    number: 'LC-002',
    title: 'Glue-head carriage guide',
    calcType: 'hart',
    state: 'in-check',
    inputs: {
      mechanism: 'hart',
      geometry: { long: 240, short: 100, ratio: 0.3, crank: 40, crankPivotOffset: 40 },
      loads: [{ name: 'Glue head weight and nozzle reaction', fx: 0, fy: -95 }],
    },
  },
  {
    number: 'LC-003',
    title: 'Side-flap folder guide (first sizing)',
    calcType: 'peaucellier',
    state: 'draft',
    inputs: {
      mechanism: 'peaucellier',
      geometry: { arm: 200, side: 80, crank: 60, crankPivotOffset: 60 },
      loads: [{ name: 'Folding a flap', fx: 0, fy: -140 }],
    },
  },
] as const
