/** Watt's linkage: equal rockers on opposite sides, the tracer at the coupler's middle. */
import { defineFourBar } from '../types'
import { fromAssembly, ruleNumber, strokeEnds } from '@/lib/fourbar/linkages'
import { pt } from '@/lib/fourbar/geometry'

export const watt = defineFourBar<{ rocker: number; coupler: number }>({
  id: 'watt',
  label: "Watt's linkage",
  /** Default proportions: rocker and coupler lengths as multiples of the stroke. */
  rule: { rocker: 1, coupler: 0.5 },
  size(S, rule) {
    // Equal rockers r on opposite sides, coupler c, tracer at the coupler's middle. Middle position:
    // rockers square to the line, coupler across it: A (c/2, r), B (c/2, 0), C (−c/2, 0), D (−c/2, −r).
    const r = rule.rocker * S
    const c = rule.coupler * S
    const { model, thetaMid } = fromAssembly(pt(c / 2, r), pt(c / 2, 0), pt(-c / 2, 0), pt(-c / 2, -r), pt(0, 0))
    // Rocker AB points down (−90°) at the middle; turning it counter-clockwise moves B, and T, towards +x.
    return {
      name: 'watt', label: "Watt's linkage", model, thetaMid, ...strokeEnds(S),
      rule: `rockers r = ${rule.rocker}·S = ${ruleNumber(r)} mm, coupler c = ${rule.coupler}·S = ${ruleNumber(c)} mm (chosen rule; the tracer's deviation grows as y⁵/(4 c r³))`,
      proportions: 'equal rockers, tracer at the middle of the coupler',
      source: "Watt's linkage (equal rockers, tracer at the coupler's middle)",
      drive: 'rocker A B driven, oscillating',
      tex: 'a = c = r,\\; b = c_{\\mathrm{coupler}}',
    }
  },
})
