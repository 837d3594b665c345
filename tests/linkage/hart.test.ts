import { describe, it, expect } from 'vitest'
import { hartCell } from '@/lib/linkage/cells/hart'
import { assessGeometry } from '@/lib/linkage/geometry'
import { runSweep } from '@/lib/linkage/sweep'
import { runMechanism } from '@/lib/calc/mechanism'

/*
 * Hart's inversor: O on the short link AD, P on the long link AE, T on the long
 * link BD, each at fraction μ from the base AB. Inversion property (Kempe, How
 * to Draw a Straight Line, 1877; Coxeter, Introduction to Geometry, §6.1):
 * |OP|·|OT| = k, here k = μ(1 − μ)(a² − b²) from the trapezoid relation
 * pq = (a² − b²)/4 worked out in lib/linkage/cells/hart.ts.
 */
describe("Hart's inversor", () => {
  const g = { long: 240, short: 100, ratio: 0.4 }
  const k = 0.4 * 0.6 * (240 ** 2 - 100 ** 2)
  // Built inside each test (not while collecting), so mutation testing sees which tests cover the cell.
  const build = () => {
    const cell = hartCell(g)
    return { cell, out: runSweep({ cell, crank: 40, offset: 40, anglesDeg: [-80, -45, 0, 30, 85], loads: [{ name: 'c', fx: 20, fy: -70 }], weightPerMm: { x: 0, y: -0.003 }, amplificationLimit: 1000 }) }
  }

  it('has k = μ(1 − μ)(a² − b²) and keeps it at every position, tracer on x = k/(2r)', () => {
    const { cell, out } = build()
    expect(cell.k).toBeCloseTo(k, 9)
    expect(out.cases[0].samples).toHaveLength(5)
    for (const { position: p } of out.cases[0].samples) {
      expect(Math.hypot(p.joints.P.x, p.joints.P.y) * Math.hypot(p.tracer.x, p.tracer.y)).toBeCloseTo(k, 7)
      expect(p.tracer.x).toBeCloseTo(k / 80, 9)
    }
  })

  it('keeps O, P and T at fraction μ along their links', () => {
    const { out } = build()
    for (const { position: p } of out.cases[0].samples) {
      const j = p.joints
      const at = (a: string, b: string) => ({ x: j[a].x + 0.4 * (j[b].x - j[a].x), y: j[a].y + 0.4 * (j[b].y - j[a].y) })
      expect(at('A', 'D').x).toBeCloseTo(0, 9)
      expect(at('A', 'E').x).toBeCloseTo(j.P.x, 9)
      expect(at('B', 'D').y).toBeCloseTo(j.T.y, 9)
    }
  })

  it('reports bending moments on the three-pin links and balances every body', () => {
    const { out } = build()
    for (const s of out.cases[0].samples) {
      for (const beam of ['AD', 'AE', 'BD']) expect(s.position.linkMoments![beam]).toBeGreaterThan(0)
      expect(s.residual).toBeLessThan(1e-9)
      expect(s.vwError).toBeLessThan(1e-6)
    }
  })

  it('names its feasibility cases', () => {
    const v = (a: number, b: number, mu: number, r: number, e = r) => assessGeometry(hartCell({ long: a, short: b, ratio: mu }), e, r, 5).feasibility.kind
    expect(v(100, 100, 0.4, 30)).toBe('long-not-longer-than-short')
    expect(v(240, 100, 0.4, 20)).toBe('crank-cannot-reach') // 2r = 40 < μ(a − b) = 56
    expect(v(240, 100, 0.4, 70)).toBe('split-segment') // 2r = 140 > μ(a + b) = 136
    expect(v(240, 100, 0.4, 40, 35)).toBe('circle-arc')
  })

  it('lists beams with their three pins and a named set of joints in the result', () => {
    const res = runMechanism({ mechanism: 'hart', geometry: { ...g, crank: 40 }, loads: [{ name: 'push', fx: 0, fy: 80 }] })
    expect(res.links.map((l) => `${l.name}:${l.kind}:${l.joints.join('')}`)).toEqual(['AD:beam:AOD', 'AE:beam:APE', 'BD:beam:BTD', 'BE:bar:BE', 'CP:crank:CP'])
    expect(Object.keys(res.positions[0].joints).sort()).toEqual(['A', 'B', 'C', 'D', 'E', 'O', 'P', 'T'])
    expect(res.envelope[0].links.AE.maxMoment).toBeDefined()
  })
})
