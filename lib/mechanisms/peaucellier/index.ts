/** Peaucellier–Lipkin cell: arms l from the pole to A and B, rhombus APBT of side s (docs/engine.md). */
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { CRANK_FIELDS, withCrank } from '../crank'
import { positive } from '../numbers'
import { defineMechanism } from '../types'
import { LINK_RANGE } from '@/lib/bench/ranges'

export const peaucellier = defineMechanism({
  id: 'peaucellier',
  label: 'Peaucellier–Lipkin cell',
  geometry: withCrank({ arm: positive(), side: positive() }),
  fields: [
    { key: 'arm', label: 'Arm l', description: 'Arm length l (pole to outer rhombus vertices)', unit: 'mm', hint: 'pole O to rhombus vertices A and B', range: LINK_RANGE },
    { key: 'side', label: 'Rhombus side s', description: 'Rhombus side s', unit: 'mm', range: LINK_RANGE },
    ...CRANK_FIELDS,
  ],
  defaultGeometry: { arm: 250, side: 100, crank: 100, crankPivotOffset: 100 },
  // Statics before its verification: the template prints the load steps, then the checks of equilibrium.
  stepSections: ['geometry', 'kinematics', 'statics', 'verification', 'dynamics', 'tolerance', 'comparison', 'checks'],
  model: (g) => ({ cell: peaucellierCell({ arm: g.arm, side: g.side }), crank: g.crank, offset: g.crankPivotOffset }),
})
