/**
 * Issue 13, finding 4 (and the "bound every input" part of finding 3): every number of a calc input
 * has a range, every list and text a size, and anything outside comes back as a message at its own
 * dotted path — never an exception, never NaN or Infinity in a result. Over random inputs with
 * fast-check: extreme-but-valid values (the limits themselves) must run to finite numbers, and one
 * value pushed outside its range must be refused at exactly that field. The limits are judgement
 * (common practice, lib/bench/ranges.ts names the reason of each); the engine's numbers are its own.
 */
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { calculate, parseCalcInput } from '@/lib/calc/run'
import { analyse } from '@/lib/analyse'
import { MAX_POSITIONS, rangeFor, type NumberRange } from '@/lib/bench/ranges'
import { MAX_BANDS, MAX_COMPONENTS, MAX_MATERIALS, MAX_NAME, MAX_TEXT } from '@/lib/checks/validate'
import { MAX_LOAD_CASES, MAX_LOAD_NAME, MAX_SOLVED_POSITIONS } from '@/lib/calc/mechanism'
import { inputToSI } from '@/lib/units'

type Tree = Record<string, unknown>

const DEFAULTS = {
  joint: { pinDiameter: 10, holeDiameter: 10.5, pinMaterial: 'C45+QT', arrangement: 'double', middle: { thickness: 8, material: 'S355' }, outer: { thickness: 5, material: 'S355' }, gap: 1 },
  link: { section: { shape: 'flat', width: 25, thickness: 8 }, material: 'S355', eye: { edgeAlong: 16 } },
}

/** Inputs that between them hold every key a calc input may have (docs/engine.md, docs/checks.md). */
const BASES: Tree[] = [
  {
    mechanism: 'peaucellier',
    geometry: { arm: 250, side: 100, crank: 100, crankPivotOffset: 100 },
    loads: [{ name: 'Push', fx: 10, fy: -150 }],
    selfWeight: { density: 7850, area: 200, g: 9.81, directionDeg: -90 },
    workingRange: { fromDeg: -40, toDeg: 40 },
    toggleMarginDeg: 5,
    requiredStroke: 120,
    minTransmissionAngleDeg: 30,
    straightnessTolerance: 0.1,
    amplificationLimit: 100,
    basis: { kind: 'en1993', gammaM0: 1, gammaM1: 1, gammaM2: 1.25, gammaM6ser: 1 },
    factors: { load: 1.5, dynamic: 1.2 },
    materials: {
      'Shop steel': { name: 'Bright bar from the shop', fy: 300, fu: 450, E: 210000, density: 7850, source: 'mill certificate 4711' },
      Banded: { bands: [{ upTo: 16, fy: 355, fu: 490 }, { upTo: 40, fy: 345, fu: 470 }], E: 210000, source: 'supplier sheet, S355 bands' },
    },
    joints: { P: { pinDiameter: 10, holeDiameter: 10.5, gap: 1, middle: { thickness: 8 }, outer: { thickness: 5 } }, T: { arrangement: 'single', plate1: { thickness: 6 }, plate2: { thickness: 6 } } },
    links: {
      OA: { section: { shape: 'flat', width: 25, thickness: 8 }, eye: { thickness: 8, width: 30, holeDiameter: 10.5, pinDiameter: 10, edgeAlong: 16 }, effectiveLengthFactor: 1, material: 'Shop steel' },
      AP: { section: { shape: 'round', diameter: 20 }, eye: { thickness: 10, width: 30 }, material: 'Banded' },
      BP: { section: { shape: 'tube', outerDiameter: 30, wall: 3 }, eye: { thickness: 10, width: 30 } },
    },
    defaults: DEFAULTS,
  },
  {
    mechanism: 'hart',
    geometry: { long: 240, short: 100, ratio: 0.3, crank: 40, crankPivotOffset: 40 },
    loads: [{ name: 'Head', fx: 0, fy: -95 }],
    sweep: { fromDeg: -30, toDeg: 30, count: 61 },
    basis: { kind: 'allowable', factorOfSafety: 2.5 },
    factors: { load: 1, dynamic: 1.3 },
    defaults: { ...DEFAULTS, link: { ...DEFAULTS.link, length: 100 } },
  },
  {
    mechanism: 'peaucellier',
    geometry: { arm: 200, side: 80, crank: 75 },
    loads: [{ name: 'Flap', fx: 0, fy: -140 }],
    crankAnglesDeg: [-20, 0, 20],
    basis: { kind: 'aisc360', method: 'ASD' },
    defaults: DEFAULTS,
  },
]

function leaves(node: unknown, prefix = '', out: [string, number][] = []): [string, number][] {
  if (typeof node === 'number') out.push([prefix, node])
  else if (Array.isArray(node)) node.forEach((v, i) => leaves(v, prefix ? `${prefix}.${i}` : String(i), out))
  else if (node && typeof node === 'object') for (const [k, v] of Object.entries(node)) leaves(v, prefix ? `${prefix}.${k}` : k, out)
  return out
}

function withValue(base: Tree, path: string, value: unknown): Tree {
  const copy = structuredClone(base)
  const keys = path.split('.')
  let node = copy as Record<string, unknown>
  for (const k of keys.slice(0, -1)) node = node[k] as Record<string, unknown>
  node[keys[keys.length - 1]] = value
  return copy
}

/** Every number anywhere in a result (canonicalJson refuses NaN and Infinity, so a stored result must have none). */
function nonFinite(node: unknown, prefix = ''): string[] {
  return leaves(node, prefix).filter(([, v]) => !Number.isFinite(v)).map(([p, v]) => `${p} = ${v}`)
}

/** A value in [min, max] that is often the limit itself: the extremes are where the engine is tried hardest. */
const within = (min: number, max: number) => fc.oneof({ weight: 1, arbitrary: fc.constantFrom(min, max) }, { weight: 2, arbitrary: fc.double({ min, max, noNaN: true }) })

/** A value outside the range: beyond either limit by a little or by a lot, non-finite, or a fraction where a whole number is due. */
function outside(r: NumberRange): fc.Arbitrary<number> {
  const span = Math.max(1, r.max - r.min)
  const options: fc.Arbitrary<number>[] = [
    fc.double({ min: r.max + span * 1e-6, max: 1e308, noNaN: true }),
    fc.double({ min: -1e308, max: r.min - span * 1e-6, noNaN: true }),
    fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 1e308, -1e308),
  ]
  if (r.integer) options.push(fc.integer({ min: r.min, max: r.max - 1 }).map((n) => n + 0.5))
  return fc.oneof(...options)
}

describe('every number of a calc input has a range (common practice: lib/bench/ranges.ts gives the reason of each)', () => {
  it('covers each number the example inputs hold, and the examples themselves pass', () => {
    for (const base of BASES) {
      for (const [path] of leaves(base)) expect(rangeFor(path), path).toBeDefined()
      const r = calculate(base)
      expect(r.ok ? {} : r.fieldErrors).toEqual({})
    }
  })
})

describe('extreme but valid inputs run to finite numbers (fast-check)', () => {
  // Feasible cells built from the reach conditions of docs/engine.md: Peaucellier l > s and 2r ≥ l − s;
  // Hart a > b and 2r < μ(a + b). Pins, holes and eyes sized so the rules of docs/checks.md hold.
  const peaucellier = fc
    .record({ side: within(1, 2000), f: within(1.05, 2.5), g: within(1.0, 3) })
    .map(({ side, f, g }) => {
      const arm = Math.min(5000, side * f)
      const crank = Math.min(5000, Math.max(1, ((arm - side) / 2) * g))
      return { mechanism: 'peaucellier', geometry: { arm, side, crank, crankPivotOffset: crank }, shortest: Math.min(side, crank) }
    })
    // The smallest pin (2 mm, its range) needs links longer than its hole.
    .filter((c) => c.shortest > 2.2)
  const hart = fc
    .record({ long: within(2, 5000), b: within(0.1, 0.9), ratio: within(0.05, 0.95), c: within(0.05, 0.95) })
    .map(({ long, b, ratio, c }) => {
      const short = Math.max(1, long * b)
      const crank = Math.max(1, ((ratio * (long + short)) / 2) * c)
      return { mechanism: 'hart', geometry: { long, short, ratio, crank, crankPivotOffset: crank }, shortest: Math.min(short, crank) }
    })
    .filter((c) => c.shortest > 2.2)
  const basis = fc.oneof(
    fc.record({ kind: fc.constant('allowable'), factorOfSafety: within(1, 10) }),
    fc.record({ kind: fc.constant('en1993'), gammaM0: within(1, 2), gammaM1: within(1, 2), gammaM2: within(1, 2), gammaM6ser: within(1, 2) }),
    fc.record({ kind: fc.constant('aisc360'), method: fc.constantFrom('LRFD', 'ASD') }),
  )
  const positions = fc.oneof(
    fc.record({ workingRange: fc.tuple(within(-360, 360), within(-360, 360)).filter(([a, b]) => a !== b).map(([fromDeg, toDeg]) => ({ fromDeg, toDeg })) }),
    fc.record({ sweep: fc.record({ fromDeg: within(-360, 360), toDeg: within(-360, 360), count: fc.oneof(fc.constantFrom(1, 2), fc.integer({ min: 1, max: 60 })) }) }),
    fc.record({ crankAnglesDeg: fc.array(within(-360, 360), { minLength: 1, maxLength: 12 }) }),
    fc.constant({}),
  )
  const calcInput = fc
    .record({
      cell: fc.oneof(peaucellier, hart),
      loads: fc.array(fc.record({ fx: within(-1e6, 1e6), fy: within(-1e6, 1e6) }), { minLength: 1, maxLength: 3 }),
      positions,
      selfWeight: fc.option(fc.record({ density: within(100, 25000), area: within(0.1, 1e5), g: within(0.1, 100), directionDeg: within(-360, 360) }), { nil: undefined }),
      toggleMarginDeg: within(0, 45),
      amplificationLimit: within(2, 10000),
      minTransmissionAngleDeg: within(0, 90),
      straightnessTolerance: within(0.001, 100),
      requiredStroke: fc.option(within(1, 5000), { nil: undefined }),
      basis,
      factors: fc.record({ load: within(1, 3), dynamic: within(1, 5) }),
      // Pin and eye sizes as fractions of what the shortest link leaves room for.
      pin: within(0, 1),
      clearance: within(0, 0.05),
      plate: fc.record({ middle: within(0.5, 200), outer: within(0.5, 200), gap: within(0, 100) }),
      eyeMore: within(1, 100),
      section: fc.oneof(
        fc.record({ shape: fc.constant('flat'), thickness: within(0.5, 200) }),
        fc.record({ shape: fc.constant('round'), diameter: within(2, 500) }),
        fc.record({ shape: fc.constant('tube'), outerDiameter: within(4, 500), wallPart: within(0.05, 0.45) }),
      ),
      edge: within(1, 500),
      K: within(0.5, 5),
      material: fc.option(fc.record({ fy: within(10, 3000), fuMore: within(0, 1), E: within(10000, 400000) }), { nil: undefined }),
    })
    .map((i) => {
      const room = Math.max(2, Math.min(200, i.cell.shortest / 2))
      const d = 2 + (room - 2) * i.pin
      const d0 = Math.min(210, d * (1 + i.clearance))
      const width = Math.min(500, d0 + i.eyeMore)
      const section =
        i.section.shape === 'flat'
          ? { shape: 'flat', width, thickness: i.section.thickness }
          : i.section.shape === 'round'
            ? { shape: 'round', diameter: i.section.diameter }
            : { shape: 'tube', outerDiameter: i.section.outerDiameter, wall: Math.max(0.5, Math.min(100, i.section.outerDiameter * i.section.wallPart)) }
      const eye = { thickness: section.shape === 'flat' ? undefined : 10, width, edgeAlong: i.edge }
      const material = i.material && { fy: i.material.fy, fu: Math.min(3000, i.material.fy * (1 + i.material.fuMore)), E: i.material.E, source: 'fuzzed test material' }
      const raw: Tree = {
        mechanism: i.cell.mechanism,
        geometry: i.cell.geometry,
        loads: i.loads.map((l, k) => ({ name: `LC-${k + 1}`, ...l })),
        ...i.positions,
        ...(i.selfWeight ? { selfWeight: i.selfWeight } : {}),
        toggleMarginDeg: i.toggleMarginDeg,
        amplificationLimit: i.amplificationLimit,
        minTransmissionAngleDeg: i.minTransmissionAngleDeg,
        straightnessTolerance: i.straightnessTolerance,
        ...(i.requiredStroke ? { requiredStroke: i.requiredStroke } : {}),
        basis: i.basis,
        factors: i.factors,
        ...(material ? { materials: { Fuzzed: material } } : {}),
        defaults: {
          joint: { pinDiameter: d, holeDiameter: d0, pinMaterial: 'C45+QT', middle: { thickness: i.plate.middle, material: 'S355' }, outer: { thickness: i.plate.outer, material: 'S355' }, gap: i.plate.gap },
          link: { section, material: material ? 'Fuzzed' : 'S355', eye: JSON.parse(JSON.stringify(eye)), effectiveLengthFactor: i.K },
        },
      }
      return raw
    })

  it('calculate() accepts them and every number of the result is finite', () => {
    let feasible = 0
    fc.assert(
      fc.property(calcInput, (raw) => {
        const r = calculate(raw)
        if (!r.ok) throw new Error(`refused a valid input: ${JSON.stringify(r.fieldErrors)}\n${JSON.stringify(raw)}`)
        if (r.result.feasibility.ok) feasible++
        for (const s of r.result.steps) if (typeof s.value === 'number') expect(Number.isFinite(s.value), `${s.id} = ${s.value}`).toBe(true)
        expect(nonFinite(r.result)).toEqual([])
      }),
      { numRuns: 150 },
    )
    // The generator is built to reach the engine's statics and the checks, not to stop at infeasibility.
    expect(feasible).toBeGreaterThan(0)
  }, 120_000)

  it('the CLI path (analyse, behind npm run calc and POST /api/v1/analyse) gives the same finite output', () => {
    fc.assert(
      fc.property(calcInput, (raw) => {
        const r = analyse(raw)
        if (!r.ok) throw new Error(`refused a valid input: ${JSON.stringify(r.fieldErrors)}\n${JSON.stringify(raw)}`)
        if (r.ok) expect(nonFinite(r.output)).toEqual([])
      }),
      { numRuns: 40 },
    )
  }, 120_000)
})

describe('any in-range input: an answer or a message, never an exception (fast-check)', () => {
  // Geometry drawn freely inside its ranges: mostly cells that cannot assemble or whose crank cannot
  // reach, links too short for their holes, eyes narrower than the hole — all of which are answers.
  it('calculate() never throws; results are finite; refusals are messages at field paths', () => {
    const arb = fc.record({
      mechanism: fc.constantFrom('peaucellier', 'hart'),
      arm: within(1, 5000),
      side: within(1, 5000),
      crank: within(1, 5000),
      e: within(0, 5000),
      ratio: within(0.05, 0.95),
      fx: within(-1e6, 1e6),
      fy: within(-1e6, 1e6),
      d: within(2, 200),
      d0: within(2, 210),
      width: within(2, 500),
      thickness: within(0.5, 200),
      edge: within(1, 500),
      basis: fc.constantFrom({ kind: 'allowable' }, { kind: 'en1993' }, { kind: 'aisc360', method: 'LRFD' }),
    })
    fc.assert(
      fc.property(arb, (i) => {
        const raw = {
          mechanism: i.mechanism,
          geometry: i.mechanism === 'hart' ? { long: i.arm, short: i.side, ratio: i.ratio, crank: i.crank, crankPivotOffset: i.e } : { arm: i.arm, side: i.side, crank: i.crank, crankPivotOffset: i.e },
          loads: [{ name: 'L', fx: i.fx, fy: i.fy }],
          basis: i.basis,
          defaults: { joint: { ...DEFAULTS.joint, pinDiameter: i.d, holeDiameter: i.d0 }, link: { section: { shape: 'flat', width: i.width, thickness: i.thickness }, eye: { edgeAlong: i.edge } } },
        }
        const r = calculate(raw)
        if (r.ok) expect(nonFinite(r.result)).toEqual([])
        else {
          expect(Object.keys(r.fieldErrors).length).toBeGreaterThan(0)
          for (const [path, message] of Object.entries(r.fieldErrors)) {
            expect(path).toMatch(/^[A-Za-z]+(\.[A-Za-z0-9]+)*$/)
            // In range: what is refused is a rule between fields, never the range of a number.
            expect(message, path).not.toMatch(/^must be (a whole number )?from /)
          }
        }
      }),
      { numRuns: 300 },
    )
  }, 120_000)
})

describe('one number outside its range is refused at its own field (fast-check)', () => {
  const fields = BASES.flatMap((base, b) => leaves(base).map(([path]) => ({ b, path, range: rangeFor(path)! })))

  it('calculate() names the field, with the range and its reason', () => {
    const arb = fc.constantFrom(...fields).chain((f) => outside(f.range).map((value) => ({ ...f, value })))
    fc.assert(
      fc.property(arb, ({ b, path, value }) => {
        const r = calculate(withValue(BASES[b], path, value))
        expect(r.ok).toBe(false)
        if (r.ok) return
        const message = r.fieldErrors[path]
        expect(message, `${path} = ${value}`).toBeDefined()
        expect(message).toMatch(Number.isFinite(value) ? /^must be (a whole number )?from .+: .+/ : /^must be a number/)
      }),
      { numRuns: 400 },
    )
  }, 120_000)

  it('every field is tried at least once, on both sides', () => {
    for (const { b, path, range } of fields) {
      for (const value of [range.min - Math.max(1, range.max - range.min), range.max + Math.max(1, range.max - range.min)]) {
        const r = calculate(withValue(BASES[b], path, value))
        expect(r.ok ? undefined : r.fieldErrors[path], `${path} = ${value}`).toMatch(/^must be (a whole number )?from /)
      }
    }
  }, 60_000)

  it('the limits themselves are accepted (the ranges are closed)', () => {
    for (const { b, path, range } of fields) {
      // One field at a time at its limit; other rules between fields may still speak, but not the range.
      for (const value of [range.min, range.max]) {
        const r = calculate(withValue(BASES[b], path, value))
        if (!r.ok) expect(r.fieldErrors[path] ?? '', `${path} = ${value}`).not.toMatch(/^must be (a whole number )?from /)
      }
    }
  }, 60_000)

  it('US customary input is compared in SI and the message gives the limits in the units typed (lib/units: 1 in = 25.4 mm exactly)', () => {
    const single = (pinDiameter: number) => analyse({ units: 'US', basis: { kind: 'allowable' }, joints: { P: { pinDiameter, holeDiameter: pinDiameter * 1.01, middle: { thickness: 0.3 }, outer: { thickness: 0.2 } } }, component: { joint: 'P', force: 1000 } })
    // 0.5 in = 12.7 mm: inside 2–200 mm, though 0.5 would be below 2 if it were read as mm.
    expect(single(0.5).ok).toBe(true)
    const big = single(8)
    expect(big.ok ? null : big.fieldErrors['joints.P.pinDiameter']).toBe('must be from 0.07874 in to 7.874 in: pins from 2 mm to 200 mm')
    expect(inputToSI(7.874, 'US', 'length')).toBeCloseTo(200, 1)
  })
})

describe('single-component mode (npm run calc without a mechanism) (fast-check)', () => {
  const base = { basis: { kind: 'en1993' }, joints: { P: { pinDiameter: 12, holeDiameter: 12.2, middle: { thickness: 8 }, outer: { thickness: 5 } } }, links: { OA: { section: { shape: 'flat', width: 30, thickness: 8 }, eye: { pinDiameter: 12, holeDiameter: 12.2 }, length: 150 } } }

  it('extreme forces and moments give finite checks', () => {
    const arb = fc.oneof(
      within(0, 1e6).map((force) => ({ joint: 'P', force })),
      fc.record({ link: fc.constant('OA'), tension: within(0, 1e6), compression: within(0, 1e6), moment: within(0, 1e9), eye: within(0, 1e6) }),
    )
    fc.assert(
      fc.property(arb, (component) => {
        const r = analyse({ ...base, component })
        expect(r.ok).toBe(true)
        if (r.ok) expect(nonFinite(r.output)).toEqual([])
      }),
      { numRuns: 100 },
    )
  })

  it.each([
    ['component.force', { joint: 'P', force: 2e6 }],
    ['component.tension', { link: 'OA', tension: 1e300 }],
    ['component.moment', { link: 'OA', moment: 1e10 }],
    ['component.compression', { link: 'OA', compression: 1.5e6 }],
  ])('refuses %s beyond its range at that path', (path, component) => {
    const r = analyse({ ...base, component })
    expect(r.ok ? null : r.fieldErrors[path]).toMatch(/^must be from 0 N(·mm)? to /)
  })
})

describe('counts and text lengths (common practice: wide enough for any cell, small enough that one request stays bounded)', () => {
  const base = BASES[0]
  const many = <T>(n: number, f: (i: number) => T) => Array.from({ length: n }, (_, i) => f(i))
  const cases: [string, string, Tree, RegExp][] = [
    ['load cases', 'loads', { ...base, loads: many(MAX_LOAD_CASES + 1, (i) => ({ name: `L${i}`, fx: 0, fy: -1 })) }, /^must hold from 1 to 20 load cases: /],
    ['positions of a sweep', 'sweep.count', { ...BASES[1], sweep: { fromDeg: -10, toDeg: 10, count: MAX_POSITIONS + 1 } }, /^must be a whole number from 1 to 2000: /],
    ['crank angles', 'crankAnglesDeg', { ...BASES[2], crankAnglesDeg: many(MAX_POSITIONS + 1, (i) => -10 + i / 100) }, /^must hold at most 2000 angles: /],
    ['load cases × positions', 'sweep.count', { ...BASES[1], loads: many(10, (i) => ({ name: `L${i}`, fx: 0, fy: -1 })), sweep: { fromDeg: -10, toDeg: 10, count: MAX_SOLVED_POSITIONS / 10 + 1 } }, /^must be at most 1000 positions with 10 load cases: /],
    ['load case name', 'loads.0.name', { ...base, loads: [{ name: 'x'.repeat(MAX_LOAD_NAME + 1), fx: 0, fy: -1 }] }, /^must be at most 60 characters: /],
    ['NUL in a load case name', 'loads.0.name', { ...base, loads: [{ name: 'Push\u0000', fx: 0, fy: -1 }] }, /control characters/],
    ['user materials', 'materials', { ...base, materials: Object.fromEntries(many(MAX_MATERIALS + 1, (i) => [`M${i}`, { fy: 300, fu: 400, E: 210000, source: 'sheet 1' }])) }, /^must hold at most 50 materials: /],
    ['material name (key)', `materials.${'k'.repeat(MAX_NAME + 1)}`, { ...base, materials: { ['k'.repeat(MAX_NAME + 1)]: { fy: 300, fu: 400, E: 210000, source: 'sheet 1' } } }, /^name must be at most 60 characters: /],
    ['material description', 'materials.Shop steel.name', withValue(base, 'materials.Shop steel.name', 'n'.repeat(MAX_TEXT + 1)), /^name must be at most 500 characters: /],
    ['material source (10 MB)', 'materials.Shop steel.source', withValue(base, 'materials.Shop steel.source', 's'.repeat(10_000_000)), /^source must be at most 500 characters: /],
    ['strength bands', 'materials.Banded.bands', withValue(base, 'materials.Banded.bands', many(MAX_BANDS + 1, (i) => ({ upTo: 10 + i, fy: 355, fu: 490 }))), /^must hold at most 20 bands: /],
    ['joints described', 'joints', { ...base, joints: Object.fromEntries(many(MAX_COMPONENTS + 1, (i) => [`J${i}`, {}])) }, /^must hold at most 50 joints: /],
    ['links described', 'links', { ...base, links: Object.fromEntries(many(MAX_COMPONENTS + 1, (i) => [`L${i}`, {}])) }, /^must hold at most 50 links: /],
    ['material named by a link', 'links.OA.material', withValue(base, 'links.OA.material', 'm'.repeat(MAX_NAME + 1)), /^material must be at most 60 characters: /],
    ['pin material', 'joints.P.pinMaterial', withValue(base, 'joints.P.pinMaterial', 'm'.repeat(100_000)), /^pin material must be at most 60 characters: /],
  ]
  it.each(cases)('too many or too long: %s, at %s', (_what, path, raw, message) => {
    const r = calculate(raw)
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.fieldErrors[path]).toMatch(message)
  })

  it('inputs a revision already holds still read by the schema alone ({ stored: true })', () => {
    const old = { ...base, loads: many(MAX_LOAD_CASES + 1, (i) => ({ name: `L${i}`, fx: 0, fy: -2e6 })) }
    expect(parseCalcInput(old).ok).toBe(false)
    expect(parseCalcInput(old, { stored: true }).ok).toBe(true)
  })

  it('the limits themselves are accepted', () => {
    const atLimit = { ...base, loads: many(MAX_LOAD_CASES, (i) => ({ name: `${'n'.repeat(MAX_LOAD_NAME - 3)}${String(i).padStart(3, '0')}`, fx: 0, fy: -1 })) }
    const r = calculate(atLimit)
    expect(r.ok ? {} : r.fieldErrors).toEqual({})
    const positions = calculate({ ...BASES[1], loads: many(5, (i) => ({ name: `L${i}`, fx: 0, fy: -1 })), sweep: { fromDeg: -10, toDeg: 10, count: MAX_POSITIONS } })
    expect(positions.ok ? {} : positions.fieldErrors).toEqual({})
  }, 60_000)
})
