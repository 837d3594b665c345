/**
 * The printed working must show the numbers that were checked: for every check
 * of every basis, over random components, the step's substituted text prints the
 * capacity (and the demand, or the demand is the design force printed in the
 * component's force step), the step's value is the utilisation (rounded up, as
 * lib/units/format prints it) or "met"/"not met" for a dimensional rule, and its
 * source is the clause's reference — and the clause is never empty and names its standard.
 * A calc package whose working disagrees with its verdict cannot be checked by hand.
 */
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { checkComponent, checksInputSchema } from '@/lib/checks'
import { utilisationShown } from '@/lib/units/format'
import { HAND_MATERIALS, printedNumbers, samePrinted, type Item, type StepLike } from './_hand'

const CLAUSE: Record<string, RegExp> = {
  en1993: /^EN 1993-1-[18]:2005 §\d/,
  aisc360: /^(AISC 360-16 §[DEFHJ]\d|not a D5\/J7 provision: shear by analogy with §J3\.6)/,
  allowable: /^(Shigley's Mechanical Engineering Design: |plain mechanics: |two shear planes of length a; |EN 1993-1-8:2005 Fig\. 3\.11 |single shear: couple)/,
}

/** The reference the package prints beside the working: a code, a book, or a rule named as common practice. */
const REF: Record<string, RegExp> = {
  en1993: /^EN 1993-1-[18]:2005 §\d/,
  aisc360: /^(AISC 360-16 §[DEFHJ]\d|by analogy with AISC 360-16 §J3\.6)/,
  allowable: /^(Shigley's Mechanical Engineering Design, ch\. \d|plain mechanics|EN 1993-1-8:2005 Fig\. 3\.11|couple between the bearing resultants)/,
}

/** The unit of each check: forces in N, moments in N·mm, stresses in MPa, dimensions in mm, interactions '—'. */
const UNIT: Record<string, Record<string, string>> = {
  en1993: {
    shear: 'N', bearing: 'N', bending: 'N·mm', 'shear-bending': '—', 'bearing-ser': 'N', 'contact-ser': 'MPa', 'bending-ser': 'N·mm',
    'eye-end': 'mm', 'eye-side': 'mm', 'eye-thickness': 'mm', 'eye-hole': 'mm', 'net-tension': 'N', axial: '—', 'axial-bending': '—', buckling: 'N',
  },
  aisc360: {
    shear: 'N', bearing: 'N', bending: 'N·mm', 'tensile-rupture': 'N', 'shear-rupture': 'N', 'gross-yielding': 'N',
    'd52-extension': 'mm', 'd52-width': 'mm', 'd52-hole': 'mm', buckling: 'N', 'axial-bending': '—',
  },
  allowable: { shear: 'MPa', bearing: 'MPa', bending: 'MPa', 'net-tension': 'MPa', 'tear-out': 'MPa', buckling: 'N', axial: 'MPa', 'axial-bending': 'MPa' },
}

const prints = (tex: string | undefined, v: number) => printedNumbers(tex ?? '').some((p) => samePrinted(p, v))

function verify(kind: string, r: { checks: Item[]; steps: StepLike[]; cautions: string[] }): void {
  const force = r.steps.find((s) => s.id.endsWith('.force'))
  expect(force).toBeDefined()
  // every caution, basis label, title and formula says something
  expect(r.cautions.length).toBeGreaterThanOrEqual(2)
  for (const c of r.cautions) expect(c.length).toBeGreaterThan(40)
  for (const s of r.steps) {
    expect(s.title!.length, s.id).toBeGreaterThan(12)
    expect(s.formula!.length, s.id).toBeGreaterThan(4)
  }
  for (const c of r.checks) {
    const step = r.steps.find((s) => s.id === c.stepId)
    expect(step, c.stepId).toBeDefined()
    const tex = step!.substituted
    const where = `${c.stepId}: ${tex}`
    expect(c.check.length, c.stepId).toBeGreaterThan(8)
    expect(step!.title).toBe(`${c.component}: ${c.check}`)
    expect(c.basis, c.stepId).toMatch(kind === 'en1993' ? /^EN 1993 \(γM0 [\d.]+, γM1 [\d.]+, γM2 [\d.]+, γM6,ser [\d.]+\)$/ : kind === 'aisc360' ? /^AISC 360-16 (LRFD|ASD)$/ : /^allowable stress, FoS [\d.]+$/)
    expect(c.clause.trim().length, c.stepId).toBeGreaterThan(10)
    expect(c.clause, c.stepId).toMatch(CLAUSE[kind])
    // The package prints the reference alone (the rule itself is typeset in the formula line).
    expect(step!.source, c.stepId).toMatch(REF[kind])
    expect(c.clause.length).toBeGreaterThan((step!.source as string).length - 30)
    expect(c.unit, c.stepId).toBe(UNIT[kind][c.stepId.split('.').pop()!])
    // a printed comparison agrees with the verdict: '>' exactly when the check fails
    if (/\\le|\s>\s/.test(tex ?? '')) expect(/\s>\s/.test(tex ?? ''), `comparison sign vs verdict (pass ${c.pass}) in ${c.stepId}: ${tex}`).toBe(!c.pass)
    if (!(c.unit === '—' && c.capacity === 1)) expect(prints(tex, c.capacity), `capacity ${c.capacity} not printed in ${where}`).toBe(true)
    expect(prints(tex, c.demand) || prints(force!.substituted, c.demand), `demand ${c.demand} not printed in ${where}`).toBe(true)
    expect(c.utilisation).toBeCloseTo(c.demand / c.capacity, 12)
    expect(step!.value).toBe(c.kind === 'detailing' ? (c.pass ? 'met' : 'not met') : utilisationShown(c.utilisation))
    expect(step!.verdict).toBe(c.pass ? 'pass' : 'fail')
    expect(c.pass).toBe(c.utilisation <= 1 + 1e-9)
  }
}

const basis = fc.oneof(
  fc.record({ kind: fc.constant('allowable'), factorOfSafety: fc.double({ min: 1.2, max: 4, noNaN: true }) }),
  fc.record({
    kind: fc.constant('en1993'),
    gammaM0: fc.double({ min: 1, max: 1.3, noNaN: true }),
    gammaM1: fc.double({ min: 1, max: 1.3, noNaN: true }),
    gammaM2: fc.double({ min: 1.1, max: 1.4, noNaN: true }),
    gammaM6ser: fc.double({ min: 1, max: 1.3, noNaN: true }),
  }),
  fc.record({ kind: fc.constant('aisc360'), method: fc.constantFrom('LRFD', 'ASD') }),
)
const size = (min: number, max: number) => fc.double({ min, max, noNaN: true }).map((x) => Math.round(x * 100) / 100)
const mat = fc.constantFrom('Pin400', 'Plate250', 'Bar300', 'S355', 'C45+QT')

describe('printed working equals the checked values', () => {
  it('pins: every basis, fork and lap, replaceable or not', () => {
    fc.assert(
      fc.property(basis, size(5, 60), size(0, 2), size(2, 30), size(2, 30), size(0, 5), size(100, 5e5), fc.boolean(), fc.boolean(), mat, mat, (b, d, cl, t1, t2, gap, F, single, repl, pm, qm) => {
        const input = checksInputSchema.parse({
          basis: b,
          factors: { load: 1.35, dynamic: 1.1 },
          materials: HAND_MATERIALS,
          joints: { J: { pinDiameter: d, holeDiameter: d + cl, pinMaterial: pm, arrangement: single ? 'single' : 'double', middle: { thickness: t1, material: qm }, outer: { thickness: t2 }, gap, replaceable: repl } },
        })
        verify(b.kind, checkComponent(input, 'J', { kind: 'joint', force: F }) as never)
      }),
      { numRuns: 150 },
    )
  })
  it('links: every basis, flat, round and tube, with and without a moment, Table 3.9 A and B', () => {
    const section = fc.oneof(
      fc.record({ shape: fc.constant('flat'), width: size(20, 120), thickness: size(3, 30) }),
      fc.record({ shape: fc.constant('round'), diameter: size(8, 80) }),
      size(20, 120).chain((D) => fc.record({ shape: fc.constant('tube'), outerDiameter: fc.constant(D), wall: size(1, D / 2 - 1) })),
    )
    fc.assert(
      fc.property(
        basis,
        section,
        size(5, 40),
        size(0.1, 2),
        size(1, 40),
        size(2, 40),
        size(0.5, 2),
        fc.constantFrom('A', 'B'),
        size(0, 3e5),
        size(0, 3e5),
        fc.option(size(1, 5e6), { nil: undefined }),
        mat,
        (b, sec, d, cl, extraW, t, K, type, T, C, M, m) => {
          const w = d + cl + extraW
          const input = checksInputSchema.parse({
            basis: b,
            materials: HAND_MATERIALS,
            links: { L: { section: sec, material: m, eye: { thickness: t, width: w, pinDiameter: d, holeDiameter: d + cl, edgeAlong: extraW, table39Type: type }, length: 20 * d, effectiveLengthFactor: K } },
          })
          verify(b.kind, checkComponent(input, 'L', { kind: 'link', tension: T, compression: C, moment: M }) as never)
        },
      ),
      { numRuns: 150 },
    )
  })
})
