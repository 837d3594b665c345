import { describe, expect, it } from 'vitest'
import { deviationOf, fitLine } from '@/lib/tolerance/straightness'

const arr = (xs: number[]) => Float64Array.from(xs)

describe('straightness from the total-least-squares line', () => {
  it('points on a line deviate by nothing, whatever its slope', () => {
    const x = arr([0, 1, 2, 3, 4])
    expect(deviationOf(x, arr([1, 3, 5, 7, 9]), 5)).toBeLessThan(1e-12)
    expect(deviationOf(arr([5, 5, 5, 5]), arr([0, 1, 2, 7]), 4)).toBeLessThan(1e-12)
  })

  it('three points (−1, 0), (0, h), (1, 0): line y = h/3, largest distance 2h/3 (worked by hand)', () => {
    // Centroid (0, h/3); Sxy = 0 and Sxx = 2 > Syy = 2h²/3 for h < √3, so the line is horizontal.
    const h = 0.3
    expect(deviationOf(arr([-1, 0, 1]), arr([0, h, 0]), 3)).toBeCloseTo((2 * h) / 3, 14)
    const f = fitLine(arr([-1, 0, 1]), arr([0, h, 0]), 3)
    expect(f.cy).toBeCloseTo(h / 3, 14)
    expect(Math.abs(f.ny)).toBeCloseTo(1, 14)
  })

  it('does not change when the points are turned and moved (distances are invariant)', () => {
    const h = 0.3
    const a = 0.7
    const pts = [
      [-1, 0],
      [0, h],
      [1, 0],
    ]
    const xs = arr(pts.map(([x, y]) => 10 + x * Math.cos(a) - y * Math.sin(a)))
    const ys = arr(pts.map(([x, y]) => -4 + x * Math.sin(a) + y * Math.cos(a)))
    expect(deviationOf(xs, ys, 3)).toBeCloseTo((2 * h) / 3, 12)
  })
})
