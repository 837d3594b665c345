/** Hart's inversor: long links a, short links b, pole, driven point and tracer at fraction μ (docs/engine.md). */
import { hartCell } from '@/lib/linkage/cells/hart'
import { CRANK_FIELDS, withCrank } from '../crank'
import { fraction, positive } from '../numbers'
import { defineMechanism } from '../types'
import { LINK_RANGE, RATIO_RANGE } from '@/lib/bench/ranges'

export const hart = defineMechanism({
  id: 'hart',
  label: "Hart's inversor",
  geometry: withCrank({ long: positive(), short: positive(), ratio: fraction() }),
  fields: [
    { key: 'long', label: 'Long links a', description: 'Long links a', unit: 'mm', range: LINK_RANGE },
    { key: 'short', label: 'Short links b', description: 'Short links b', unit: 'mm', range: LINK_RANGE },
    { key: 'ratio', label: 'Ratio μ', description: 'Ratio μ placing pole, driven point and tracer', unit: '—', step: '0.01', hint: 'places pole, driven point and tracer', range: RATIO_RANGE },
    ...CRANK_FIELDS,
  ],
  defaultGeometry: { long: 240, short: 100, ratio: 0.3, crank: 40, crankPivotOffset: 40 },
  // Statics before its verification: the template prints the load steps, then the checks of equilibrium.
  stepSections: ['geometry', 'kinematics', 'statics', 'verification', 'dynamics', 'tolerance', 'comparison', 'checks'],
  model: (g) => ({ cell: hartCell({ long: g.long, short: g.short, ratio: g.ratio }), crank: g.crank, offset: g.crankPivotOffset }),
})
