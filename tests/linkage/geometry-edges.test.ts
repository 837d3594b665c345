/**
 * Edges of the geometry verdict that the hand-worked cases in geometry.test.ts do not reach.
 * - Straight means e = r "to rounding" (Coxeter, Introduction to Geometry, §6.1: the inverse of a circle
 *   through the centre of inversion is a line); the allowance is inclusive, so e = r exactly is straight in
 *   every case, the degenerate e = r = 0 included.
 * - An invalid cell reports a line offset of 0, never NaN, whatever the crank: k/(2r) only for k > 0
 *   (with k = 0 and r = 0 it would be 0/0).
 */
import { describe, expect, it } from 'vitest'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { assessGeometry, isStraight } from '@/lib/linkage/geometry'

describe('geometry verdict edges', () => {
  it('e = r is straight, the boundary of the rounding allowance included', () => {
    expect(isStraight(0, 0)).toBe(true)
    expect(isStraight(75, 75)).toBe(true)
    // 1e-9 relative is rounding; 1e-6 relative is an offset crank pivot
    expect(isStraight(75, 75 * (1 + 5e-10))).toBe(true)
    expect(isStraight(75, 75 * (1 + 1e-6))).toBe(false)
    expect(isStraight(75 * (1 + 1e-6), 75)).toBe(false)
  })
  it('an invalid cell (Peaucellier l = s: k = l² − s² = 0) with a zero crank: line offset 0, not NaN', () => {
    const v = assessGeometry(peaucellierCell({ arm: 60, side: 60 }), 0, 0, 5)
    expect(v.reach).toBe('invalid')
    expect(v.lineOffset).toBe(0)
  })
})
