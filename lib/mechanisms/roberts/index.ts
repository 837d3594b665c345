/** Roberts' linkage: equal rockers, coupler half the frame, an isosceles coupler triangle to the tracer. */
import { defineFourBar } from '../types'
import { fromAssembly, ruleNumber, strokeEnds } from '@/lib/fourbar/linkages'
import { pt } from '@/lib/fourbar/geometry'

export const roberts = defineFourBar<{ rocker: number }>({
  id: 'roberts',
  label: "Roberts' linkage",
  /** Default proportions: rocker length as a multiple of the stroke. */
  rule: { rocker: 0.8 },
  size(S, rule) {
    // Frame A D = d, equal rockers l, coupler B C = d/2 with the triangle B C T, B T = C T = l, T on the
    // far side of B C. Middle: B (−d/4, H), C (d/4, H), T (0, 0) on the frame line, H = √(l² − d²/16).
    // T passes through A and D as well, so the frame is the stroke: d = S.
    const d = S
    const l = rule.rocker * S
    const H = Math.sqrt(l * l - (d * d) / 16)
    const { model, thetaMid } = fromAssembly(pt(-d / 2, 0), pt(-d / 4, H), pt(d / 4, H), pt(d / 2, 0), pt(0, 0))
    return {
      name: 'roberts', label: "Roberts' linkage", model, thetaMid, ...strokeEnds(S),
      rule: `frame d = S (the tracer passes through both pivots and the middle); rockers l = ${rule.rocker}·S = ${ruleNumber(l)} mm (chosen rule), coupler d/2`,
      proportions: 'frame d, rockers l, coupler d/2, coupler triangle with sides l to the tracer',
      source: "Roberts' linkage (equal rockers, coupler half the frame, isosceles coupler triangle with sides equal to the rockers)",
      drive: 'rocker A B driven, oscillating',
      tex: 'a = c = \\overline{BT} = \\overline{CT} = l,\\; b = d/2',
    }
  },
})
