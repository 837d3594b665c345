/**
 * Regression: the counterexample that tests/linkage/properties.test.ts ("random infeasible inputs give an
 * infeasible verdict, never NaN or Infinity") found: a Hart cell with a crank pivot offset of 5e-324 mm, the
 * least subnormal double (IEEE 754 binary64 — common practice). The geometry is valid (an arc, e ≠ r); only
 * its message printed "e = NaN mm", because the number formatter computed 10^−324 = 0 (fixed in
 * lib/units/format.ts). Nothing in a result may be NaN or Infinity.
 */
import { describe, expect, it } from 'vitest'
import { runMechanism } from '@/lib/calc/mechanism'

describe('the smallest positive input', () => {
  it('Hart, crank pivot offset 5e-324 mm: the verdict prints the offset, no NaN anywhere', () => {
    const res = runMechanism({
      mechanism: 'hart',
      geometry: { long: 0.285492057781457, short: 0.19376051364446956, ratio: 0.02086582440289651, crank: 0.01, crankPivotOffset: 5e-324 },
      loads: [{ name: 'f', fx: 1, fy: 2 }],
    })
    expect(JSON.stringify(res)).not.toMatch(/NaN|Infinity/)
    expect(res.feasibility.message).toMatch(/e = 4\.94×10⁻³²⁴ mm/)
  })
})
