/** Chebyshev's linkage: crossed links 2.5, coupler 1, frame 2, the tracer at the coupler's middle. */
import { defineFourBar } from '../types'
import { fromAssembly, ruleNumber, strokeEnds } from '@/lib/fourbar/linkages'
import { pt } from '@/lib/fourbar/geometry'

export const chebyshev = defineFourBar<{ usable: number }>({
  id: 'chebyshev',
  label: "Chebyshev's linkage",
  /** Default proportions: the part of the straight part the stroke uses. */
  rule: { usable: 0.8 },
  size(S, rule) {
    // Crossed: frame A D = 2, links A B = D C = 2.5, coupler B C = 1, tracer at the middle of B C.
    // Middle position: B (1.5, 2), C (0.5, 2), T (1, 2). Exact points T = (0, 2), (1, 2), (2, 2):
    // the straight part spans the frame's length. The stroke is its middle `usable` part: u = S/(2·usable).
    const usable = rule.usable
    const u = S / (2 * usable)
    const { model, thetaMid } = fromAssembly(pt(0, 0), pt(1.5 * u, 2 * u), pt(0.5 * u, 2 * u), pt(2 * u, 0), pt(u, 2 * u))
    return {
      name: 'chebyshev', label: "Chebyshev's linkage", model, thetaMid, ...strokeEnds(S),
      rule: `straight part between the exact points (0, 2u) and (2u, 2u), its middle ${ruleNumber(usable)} the stroke: u = S/(2·${ruleNumber(usable)}) = ${ruleNumber(u)} mm, frame 2u = ${ruleNumber(2 * u)} mm (one outer exact point is the driven link's dead point)`,
      proportions: 'links 2.5 : coupler 1 : frame 2, tracer at the middle of the coupler',
      source: "Chebyshev's straight-line linkage, proportions 1 : 2.5 : 2 (coupler : links : frame), tracer at the coupler's middle",
      drive: 'link A B driven, oscillating',
      tex: 'a:b:c:d = 2.5:1:2.5:2',
    }
  },
})
