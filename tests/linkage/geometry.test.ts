import { describe, expect, it } from 'vitest'
import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import { inRing, sqrt0 } from '@/lib/linkage/cells/cell'
import { assessGeometry, isStraight, tracerPath } from '@/lib/linkage/geometry'
import { runSweep } from '@/lib/linkage/sweep'
import { expectNumbers } from '../checks/_hand'

/*
 * Feasibility and stroke of the crank-driven cells, worked out by hand from the
 * geometry of inversion (Coxeter, Introduction to Geometry, §6.1; Kempe, How to
 * Draw a Straight Line, 1877) and the crank circle: with the crank pivot C = (e, 0)
 * and crank r, |OP|² = e² + r² + 2er cos θ, from e + r at θ = 0 to |e − r| at 180°.
 *
 * Peaucellier l = 150, s = 60: k = 150² − 60² = 18 900, ring l − s = 90 ≤ |OP| ≤ √k = 137.48.
 * Hart a = 240, b = 100, μ = 0.4: k = 0.24·(57 600 − 10 000) = 11 424, ring μ(a − b) = 56 ≤ |OP| ≤ μ(a + b) = 136.
 */
// Built inside each test (not while collecting), so mutation testing sees which tests cover the cells.
const PEAU = () => peaucellierCell({ arm: 150, side: 60 })
const HART = () => hartCell({ long: 240, short: 100, ratio: 0.4 })
const DEG = Math.PI / 180

describe('crank reach verdicts', () => {
  it('beyond reach: |e − r| larger than the ring’s outer radius', () => {
    // e = 200, r = 20: |e − r| = 180 > √k = 137.5 — P never comes close enough to O
    const v = assessGeometry(PEAU(), 200, 20, 5)
    expect(v.reach).toBe('beyond-reach')
    expect(v.feasibility.ok).toBe(false)
    expect(v.feasibility.kind).toBe('crank-cannot-reach')
    expectNumbers(v.feasibility.message, [180, 137.5])
    expect(v.path).toBeNull()
    expect(v.stroke).toEqual({ half: 0, crankMinDeg: 0, crankMaxDeg: 0 })
    expect(v.k).toBe(18900)
    expect(v.lineOffset).toBeCloseTo(18900 / 40, 12)
    // Hart: e = 250, r = 20: 230 > μ(a + b) = 136
    expect(assessGeometry(HART(), 250, 20, 5).reach).toBe('beyond-reach')
  })
  it('cannot reach: e + r short of the ring’s inner radius', () => {
    // e = r = 40: 2r = 80 < l − s = 90
    const v = assessGeometry(PEAU(), 40, 40, 5)
    expect(v.reach).toBe('cannot-reach')
    expectNumbers(v.feasibility.message, [2, 80, 90])
    // off-centre: e = 50, r = 30: e + r = 80 < 90
    expectNumbers(assessGeometry(PEAU(), 50, 30, 5).feasibility.message, [80, 90])
  })
  it('split: e + r at or past the outer radius', () => {
    // e = r = 70: 2r = 140 ≥ 137.5
    const v = assessGeometry(PEAU(), 70, 70, 5)
    expect(v.reach).toBe('split')
    expect(v.feasibility.kind).toBe('split-segment')
    expectNumbers(v.feasibility.message, [2, 140, 137.5])
  })
  it('an invalid cell: nothing reported but the reason', () => {
    const v = assessGeometry(peaucellierCell({ arm: 60, side: 80 }), 30, 30, 5)
    expect(v.reach).toBe('invalid')
    expect(v.feasibility).toMatchObject({ ok: false, kind: 'arm-not-longer-than-side' })
    expect(v.lineOffset).toBe(0) // k = 60² − 80² < 0: no line
    expect(v.path).toBeNull()
    expect(assessGeometry(peaucellierCell({ arm: 60, side: 60 }), 30, 30, 5).lineOffset).toBe(0) // k = 0
  })
})

describe('stroke and usable stroke', () => {
  // Straight line, e = r = 60: the toggle is where |OP| = l − s: 120 cos(θ/2) = 90 → θ_lim = 2 acos(0.75) = 82.819°.
  // The tracer runs on x = k/(2r) = 157.5 with T_y = 157.5 tan(θ/2) (inscribed angle).
  const lim = (2 * Math.acos(0.75)) / DEG
  it('usable half stroke: T_y at the crank limit less the toggle margin', () => {
    const v = assessGeometry(PEAU(), 60, 60, 5)
    expect(v.reach).toBe('limited')
    expect(v.limitDeg).toBeCloseTo(lim, 12)
    expect(v.usable.crankMinDeg).toBeCloseTo(-(lim - 5), 12)
    expect(v.usable.crankMaxDeg).toBeCloseTo(lim - 5, 12)
    // 157.5·tan((82.819° − 5°)/2) = 157.5·tan(38.910°) = 127.17 mm
    expect(v.usable.half).toBeCloseTo(157.5 * Math.tan(((lim - 5) / 2) * DEG), 9)
    expect(v.stroke.half).toBeCloseTo(157.5 * Math.tan((lim / 2) * DEG), 9)
    expect(v.stroke.crankMinDeg).toBeCloseTo(-lim, 12)
    expect(v.feasibility).toMatchObject({ ok: true, kind: 'ok' })
    expectNumbers(v.feasibility.message, [2, 157.5, 82.82, 5])
    expect(v.path).toEqual({ kind: 'line', point: { x: 157.5, y: 0 }, direction: { x: 0, y: 1 } })
  })
  it('no usable stroke when the toggle margin reaches the crank limit (margin = limit included)', () => {
    const limitDeg = assessGeometry(PEAU(), 60, 60, 5).limitDeg
    const v = assessGeometry(PEAU(), 60, 60, limitDeg)
    expect(v.feasibility).toMatchObject({ ok: false, kind: 'no-usable-stroke' })
    expect(v.usable).toEqual({ half: 0, crankMinDeg: 0, crankMaxDeg: 0 })
    expect(v.stroke.half).toBeGreaterThan(0) // the stroke between toggles is still reported
    expect(v.limitDeg).toBeCloseTo(lim, 12)
    expect(assessGeometry(PEAU(), 60, 60, 90).feasibility.kind).toBe('no-usable-stroke')
    expect(assessGeometry(PEAU(), 60, 60, lim - 1e-6).feasibility.kind).toBe('ok')
  })
  it('a full turn: no toggle, so no margin is taken off', () => {
    // e = 110, r = 15: |OP| from 95 to 125, inside [90, 137.5] → the crank turns fully.
    // The tracer runs on the whole image circle, radius kr/(e² − r²) = 18 900·15/11 875 = 23.874 mm.
    const v = assessGeometry(PEAU(), 110, 15, 5)
    expect(v.reach).toBe('full')
    expect(v.limitDeg).toBe(180)
    expect(v.usable).toEqual(v.stroke)
    expect(v.usable.crankMaxDeg).toBe(180)
    expect(v.feasibility.kind).toBe('circle-arc')
    expect(v.stroke.half).toBeCloseTo((18900 * 15) / 11875, 2) // 1° samples: within 0.1 %
    expect(v.stroke.half).toBeLessThanOrEqual((18900 * 15) / 11875)
  })
  it('an arc: centre ke/(e² − r²), radius kr/|e² − r²|, named in the verdict', () => {
    // e = 52, r = 60: e² − r² = −896 → centre 18 900·52/(−896) = −1096.9, radius 18 900·60/896 = 1265.6
    const v = assessGeometry(PEAU(), 52, 60, 5)
    expect(v.feasibility.kind).toBe('circle-arc')
    expect(v.path).toEqual({ kind: 'arc', centre: { x: (18900 * 52) / -896, y: 0 }, radius: (18900 * 60) / 896 })
    expectNumbers(v.feasibility.message, [52, 60, -1097, 0, 1266])
  })
  it('Hart, straight line: usable half stroke from the tracer at the reduced crank limit', () => {
    // e = r = 40: toggle at |OP| = 56 = 80 cos(θ/2) → θ_lim = 2 acos(0.7) = 91.146°; line x = k/(2r) = 142.8
    const hl = (2 * Math.acos(0.7)) / DEG
    const v = assessGeometry(HART(), 40, 40, 10)
    expect(v.limitDeg).toBeCloseTo(hl, 12)
    expect(v.lineOffset).toBeCloseTo(142.8, 12)
    expect(v.usable.half).toBeCloseTo(142.8 * Math.tan(((hl - 10) / 2) * DEG), 9)
  })
})

describe('tracer path', () => {
  it('is a line only when the crank circle passes through O (to rounding)', () => {
    expect(isStraight(60, 60)).toBe(true)
    expect(isStraight(60 * (1 + 1e-10), 60)).toBe(true)
    expect(isStraight(60, 60 * (1 + 1e-10))).toBe(true)
    expect(isStraight(60 * (1 + 1e-8), 60)).toBe(false)
    expect(isStraight(60, 60 * (1 + 1e-8))).toBe(false)
    expect(tracerPath(18900, 60, 60)).toEqual({ kind: 'line', point: { x: 157.5, y: 0 }, direction: { x: 0, y: 1 } })
    // e > r: e² − r² = 3600 − 2500 > 0 → centre 18 900·60/1100, radius 18 900·50/1100
    expect(tracerPath(18900, 60, 50)).toEqual({ kind: 'arc', centre: { x: (18900 * 60) / 1100, y: 0 }, radius: (18900 * 50) / 1100 })
  })
})

describe('cells place nothing outside their working ring', () => {
  it("Hart's inversor: null below μ(a − b) = 56 and above μ(a + b) = 136, joints inside", () => {
    expect(HART().rhoMin).toBeCloseTo(56, 12)
    expect(HART().rhoMax).toBeCloseTo(136, 12)
    expect(HART().place({ x: 55.9, y: 0 })).toBeNull()
    expect(HART().place({ x: 0, y: 136.1 })).toBeNull()
    expect(HART().place({ x: 56, y: 0 })).not.toBeNull()
    expect(HART().place({ x: 0, y: -136 })).not.toBeNull()
    const j = HART().place({ x: 60, y: 80 })! // |OP| = 100
    expect(Math.hypot(j.T.x, j.T.y)).toBeCloseTo(11424 / 100, 9)
    // links keep their lengths: AD = BE = 100, AE = BD = 240
    const d = (a: string, b: string) => Math.hypot(j[a].x - j[b].x, j[a].y - j[b].y)
    expect(d('A', 'D')).toBeCloseTo(100, 9)
    expect(d('B', 'E')).toBeCloseTo(100, 9)
    expect(d('A', 'E')).toBeCloseTo(240, 9)
    expect(d('B', 'D')).toBeCloseTo(240, 9)
    expect(d('A', 'O')).toBeCloseTo(40, 9)
    expect(d('A', 'P')).toBeCloseTo(96, 9)
    expect(d('B', 'T')).toBeCloseTo(96, 9)
  })
  it("an invalid Hart cell (a ≤ b) places nothing and says why", () => {
    const bad = hartCell({ long: 100, short: 120, ratio: 0.5 })
    expect(bad.invalid?.kind).toBe('long-not-longer-than-short')
    expect(bad.place({ x: 10, y: 0 })).toBeNull()
    expect(hartCell({ long: 100, short: 100, ratio: 0.5 }).invalid).not.toBeNull()
    expect(HART().invalid).toBeNull()
  })
  it('Peaucellier: null below l − s = 90 and above √k = 137.48', () => {
    expect(PEAU().place({ x: 89.9, y: 0 })).toBeNull()
    expect(PEAU().place({ x: 137.5, y: 0 })).toBeNull()
    expect(PEAU().place({ x: 90, y: 0 })).not.toBeNull()
    expect(peaucellierCell({ arm: 60, side: 60 }).place({ x: 1e-9, y: 0 })).toBeNull()
  })
  it('the ring test allows rounding only', () => {
    expect(inRing(90 * (1 - 1e-12), 90, 100)).toBe(true) // the tolerance itself is inside
    expect(inRing(100 * (1 + 1e-12), 90, 100)).toBe(true)
    expect(inRing(90 * (1 - 1e-13), 90, 100)).toBe(true)
    expect(inRing(90 * (1 - 1e-11), 90, 100)).toBe(false)
    expect(inRing(100 * (1 + 1e-13), 90, 100)).toBe(true)
    expect(inRing(100 * (1 + 1e-11), 90, 100)).toBe(false)
    expect(sqrt0(-1e-18)).toBe(0)
    expect(sqrt0(4)).toBe(2)
  })
})

describe('closed forms printed as worked', () => {
  it('Peaucellier: k = l² − s², ρ_min = l − s, ρ_max = √k', () => {
    expectNumbers(PEAU().tex.k.substituted, [150, 2, 60, 2, 18900])
    expectNumbers(PEAU().tex.rhoMin.substituted, [150, 60, 90])
    expectNumbers(PEAU().tex.rhoMax.substituted, [18900, 137.477])
    expect(PEAU().rhoMinName).toBe('l − s')
    expect(PEAU().rhoMaxName).toBe('√k')
  })
  it("Hart: k = μ(1 − μ)(a² − b²), ρ = μ(a ∓ b)", () => {
    expectNumbers(HART().tex.k.substituted, [0.4, 1, 0.4, 240, 2, 100, 2, 11424])
    expectNumbers(HART().tex.rhoMin.substituted, [0.4, 240, 100, 56])
    expectNumbers(HART().tex.rhoMax.substituted, [0.4, 240, 100, 136])
    expect(HART().k).toBeCloseTo(11424, 9)
  })
  it('link stations put O, P and T at fraction μ (Hart) and the pins at the link ends', () => {
    expect(HART().links.map((l) => [l.name, l.points.join(''), l.stations, l.kind])).toEqual([
      ['AD', 'AOD', [0, 40, 100], 'beam'],
      ['AE', 'APE', [0, 96, 240], 'beam'],
      ['BD', 'BTD', [0, 96, 240], 'beam'],
      ['BE', 'BE', [0, 100], 'bar'],
    ])
    expect(PEAU().links.map((l) => [l.name, l.points.join(''), l.stations, l.kind])).toEqual([
      ['OA', 'OA', [0, 150], 'bar'],
      ['OB', 'OB', [0, 150], 'bar'],
      ['AP', 'AP', [0, 60], 'bar'],
      ['BP', 'BP', [0, 60], 'bar'],
      ['AT', 'AT', [0, 60], 'bar'],
      ['BT', 'BT', [0, 60], 'bar'],
    ])
  })
})

describe('cell descriptions', () => {
  it('name their mechanism and their sources', () => {
    expect(PEAU().mechanism).toBe('peaucellier')
    expect(HART().mechanism).toBe('hart')
    for (const c of [PEAU(), HART()]) {
      expect(c.source).toMatch(/Coxeter, Introduction to Geometry, §6\.1/)
      expect(c.source).toMatch(/Kempe, How to Draw a Straight Line, 1877/)
    }
  })
  it('watch the angles that close at the toggles: near the crank limit the least one goes to 0°', () => {
    // Peaucellier e = r = 60: at the limit the rhombus lies flat (A, O, P in line);
    // Hart e = r = 40: at the limit the antiparallelogram lies flat.
    for (const [cell, r, limDeg, vertices] of [
      [PEAU(), 60, (2 * Math.acos(0.75)) / DEG, ['A', 'B', 'T']],
      [HART(), 40, (2 * Math.acos(0.7)) / DEG, ['A', 'B', 'D', 'E']],
    ] as const) {
      const out = runSweep({ cell, crank: r, offset: r, anglesDeg: [0, limDeg - 0.001], loads: [{ name: 'y', fx: 0, fy: 1 }], weightPerMm: null, amplificationLimit: 1e9 })
      const [mid, edge] = out.cases[0].samples.map((s) => s.position.transmissionAngleDeg)
      expect(mid).toBeGreaterThan(10)
      expect(edge).toBeLessThan(0.5)
      expect(Object.keys(out.cases[0].samples[0].position.transmissionAngles!).sort()).toEqual(vertices)
    }
  })
})
