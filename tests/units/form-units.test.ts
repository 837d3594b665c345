import { describe, expect, it } from 'vitest'
import { geometryFields, PIN_FIELDS } from '@/app/(app)/projects/[projectId]/calcs/[calcId]/input-fields'
import { convertInputs } from '@/app/(app)/projects/[projectId]/calcs/[calcId]/units'

// 1 in = 25.4 mm and 1 lbf = 4.4482216152605 N exactly (NIST SP 811, Appendix B).
const defs = [...geometryFields('peaucellier'), ...PIN_FIELDS(['S355'])]
const si = {
  geometry: { arm: 254, side: 101.6, crank: 127, crankPivotOffset: 127 },
  loads: [{ name: 'a', fx: 4.4482216152605, fy: -444.82216152605 }],
  basis: { kind: 'en1993' },
  defaults: { joint: { pinDiameter: 12.7, pinMaterial: 'C45+QT' } },
}

describe('inputs editor units', () => {
  it('shows SI inputs in inches and pounds-force', () => {
    const us = convertInputs(si, defs, 'US', 'toDisplay')
    expect(us.geometry).toEqual({ arm: 10, side: 4, crank: 5, crankPivotOffset: 5 })
    expect(us.loads[0]).toMatchObject({ fx: 1, fy: -100 })
    expect(us.defaults.joint).toEqual({ pinDiameter: 0.5, pinMaterial: 'C45+QT' })
  })

  it('stores what a person typed in US units as SI', () => {
    const back = convertInputs({ ...si, geometry: { arm: 10, side: 4, crank: 5, crankPivotOffset: 5 } }, defs, 'US', 'toSI')
    expect(back.geometry.arm).toBeCloseTo(254, 12)
    expect(back.geometry.side).toBeCloseTo(101.6, 12)
  })

  it('leaves SI untouched', () => {
    expect(convertInputs(si, defs, 'SI', 'toDisplay')).toBe(si)
  })
})
