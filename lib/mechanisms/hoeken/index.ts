/** Hoeken's linkage: crank 1, coupler 2.5, rocker 2.5, frame 2, the tracer on the coupler extended at 5. */
import { defineFourBar } from '../types'
import { fromAssembly, ruleNumber, strokeEnds } from '@/lib/fourbar/linkages'
import { pt } from '@/lib/fourbar/geometry'

export const hoeken = defineFourBar<Record<string, never>>({
  id: 'hoeken',
  label: "Hoeken's linkage",
  // The proportions are fixed: no rule to choose.
  rule: {},
  size(S) {
    // Crank A B = 1, coupler B C = 2.5, rocker D C = 2.5, frame A D = 2, tracer on B C extended, B T = 5.
    // Middle position: crank at 180°, B (−1, 0), C (0.5, 2), T (2, 4); exact points T = (0, 4), (2, 4), (4, 4)
    // at crank 270°, 180°, 90°: the straight part is twice the frame, so u = S/4.
    const u = S / 4
    const { model, thetaMid } = fromAssembly(pt(0, 0), pt(-u, 0), pt(0.5 * u, 2 * u), pt(2 * u, 0), pt(2 * u, 4 * u))
    return {
      name: 'hoeken', label: "Hoeken's linkage", model, thetaMid, ...strokeEnds(S),
      rule: `straight part between the exact points (0, 4u) and (4u, 4u) = stroke: u = S/4 = ${ruleNumber(u)} mm, frame = S/2`,
      proportions: 'crank 1 : coupler 2.5 : rocker 2.5 : frame 2, tracer on the coupler extended at 5 from the crank pin',
      source: "Hoeken's linkage, proportions 1 : 2.5 : 2.5 : 2 with the tracer at 5 on the extended coupler (the cognate of Chebyshev's linkage by the Roberts–Chebyshev theorem)",
      drive: 'crank A B driven, turning (half a turn over the stroke)',
      tex: 'a:b:c:d:\\overline{BT} = 1:2.5:2.5:2:5',
    }
  },
})
