import { describe, expect, it } from 'vitest'
import { circleCircle, fitLine, offsetFrom } from '@/lib/fourbar/geometry'

const maxOffset = (pts: { x: number; y: number }[]) => {
  const l = fitLine(pts)
  return Math.max(...pts.map((p) => Math.abs(offsetFrom(l, p))))
}

describe('total-least-squares line (2×2 eigenvector)', () => {
  it('points on a line, at any slope (vertical included), lie on the fitted line (geometry)', () => {
    for (const a of [0, 0.3, Math.PI / 2, 2.5]) {
      const pts = [-2, -1, 0, 0.5, 3].map((t) => ({ x: 4 + t * Math.cos(a), y: -1 + t * Math.sin(a) }))
      expect(maxOffset(pts)).toBeLessThan(1e-12)
      const d = fitLine(pts).direction
      expect(Math.abs(d.x * Math.sin(a) - d.y * Math.cos(a))).toBeLessThan(1e-12)
    }
  })

  it('(−1, 0), (0, h), (1, 0): line y = h/3, largest distance 2h/3 (worked by hand: centroid (0, h/3), Sxy = 0, Sxx = 2 > Syy = 2h²/3)', () => {
    const h = 0.3
    const l = fitLine([{ x: -1, y: 0 }, { x: 0, y: h }, { x: 1, y: 0 }])
    expect(l.point.y).toBeCloseTo(h / 3, 14)
    expect(Math.abs(l.direction.x)).toBeCloseTo(1, 14)
    expect(maxOffset([{ x: -1, y: 0 }, { x: 0, y: h }, { x: 1, y: 0 }])).toBeCloseTo((2 * h) / 3, 14)
  })

  it('minimises the sum of squared distances: turning the line a little either way only adds (definition of the fit)', () => {
    const pts = Array.from({ length: 40 }, (_, i) => ({ x: i, y: 0.5 * i + Math.sin(i) }))
    const l = fitLine(pts)
    const ss = (a: number) =>
      pts.reduce((s, p) => {
        const d = { x: Math.cos(a), y: Math.sin(a) }
        const o = d.x * (p.y - l.point.y) - d.y * (p.x - l.point.x)
        return s + o * o
      }, 0)
    const a0 = Math.atan2(l.direction.y, l.direction.x)
    expect(ss(a0)).toBeLessThan(ss(a0 + 1e-3))
    expect(ss(a0)).toBeLessThan(ss(a0 - 1e-3))
  })
})

describe('circle–circle intersection', () => {
  it('3-4-5 triangle: circles r 3 about (0, 0) and r 4 about (5, 0) meet at (1.8, ±2.4) (worked by hand)', () => {
    const up = circleCircle({ x: 0, y: 0 }, 3, { x: 5, y: 0 }, 4, 1)!
    const down = circleCircle({ x: 0, y: 0 }, 3, { x: 5, y: 0 }, 4, -1)!
    expect(up.point.x).toBeCloseTo(1.8, 14)
    expect(up.point.y).toBeCloseTo(2.4, 14)
    expect(down.point.y).toBeCloseTo(-2.4, 14)
    expect(circleCircle({ x: 0, y: 0 }, 1, { x: 5, y: 0 }, 1, 1)).toBeNull()
  })
})
