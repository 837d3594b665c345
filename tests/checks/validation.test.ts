/** Bad input must come back as a clear message at the field, and no result may hold NaN or Infinity. */
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { checkComponent, checksInputSchema, ChecksInputError, validateChecksInput } from '@/lib/checks'

const joint = { pinDiameter: 12, holeDiameter: 12.2, middle: { thickness: 8 }, outer: { thickness: 5 } }
const link = { section: { shape: 'flat', width: 30, thickness: 8 }, eye: { pinDiameter: 12, holeDiameter: 12.2 }, length: 150 }
const base = { basis: { kind: 'en1993' }, joints: { P: joint }, links: { OA: link } }
const at = (issues: { path: string; message: string }[], path: string) => issues.find((i) => i.path === path)?.message

describe('messages at the field', () => {
  it('a valid input has no issues', () => {
    expect(validateChecksInput(base)).toEqual([])
  })
  it('hole smaller than the pin', () => {
    const m = at(validateChecksInput({ ...base, joints: { P: { ...joint, holeDiameter: 11.5 } } }), 'joints.P.holeDiameter')
    expect(m).toMatch(/must not be smaller than the pin \(12 mm\)/)
  })
  it('non-positive thickness', () => {
    const m = at(validateChecksInput({ ...base, joints: { P: { ...joint, middle: { thickness: 0 } } } }), 'joints.P.middle.thickness')
    expect(m).toMatch(/thickness must be positive/)
  })
  it('negative gap', () => {
    expect(at(validateChecksInput({ ...base, joints: { P: { ...joint, gap: -1 } } }), 'joints.P.gap')).toMatch(/cannot be negative/)
  })
  it('a material without strength values, and one without a source', () => {
    const issues = validateChecksInput({ ...base, materials: { X: { E: 210000, source: 'shop sheet 12' }, Y: { fy: 300, fu: 400, E: 210000 } } })
    expect(at(issues, 'materials.X.fy')).toMatch(/no strength values/)
    expect(at(issues, 'materials.Y.source')).toMatch(/source is required/)
  })
  it('unknown material and aluminium under a steel code', () => {
    const issues = validateChecksInput({ ...base, joints: { P: { ...joint, pinMaterial: 'Unobtainium' } }, links: { OA: { ...link, material: '6082-T6' } } })
    expect(at(issues, 'joints.P.pinMaterial')).toMatch(/unknown material "Unobtainium"/)
    expect(at(issues, 'links.OA.material')).toMatch(/aluminium alloy; EN 1993 covers steel only/)
  })
  it('a link too short for its holes', () => {
    const issues = validateChecksInput({ ...base, links: { OA: { ...link, length: 10 } } })
    expect(at(issues, 'links.OA.length')).toMatch(/too short for its holes/)
  })
  it('an eye no wider than its hole', () => {
    const issues = validateChecksInput({ ...base, links: { OA: { ...link, eye: { ...link.eye, width: 12 } } } })
    expect(at(issues, 'links.OA.eye.width')).toMatch(/must be larger than the hole/)
  })
  it('a problem inherited from the defaults is reported at the default', () => {
    const issues = validateChecksInput({ basis: { kind: 'allowable' }, defaults: { joint: { ...joint, holeDiameter: 10 } }, joints: { P: {} } })
    expect(at(issues, 'defaults.joint.holeDiameter')).toBeDefined()
  })
  it('a round link without its eye described', () => {
    const issues = validateChecksInput({ ...base, links: { OA: { section: { shape: 'round', diameter: 20 }, length: 100 } } })
    expect(at(issues, 'links.OA.eye')).toMatch(/describe its eye/)
  })
  it('checkComponent throws ChecksInputError with the issues', () => {
    const input = checksInputSchema.parse({ ...base, joints: { P: { ...joint, holeDiameter: 11 } } })
    expect(() => checkComponent(input, 'P', { kind: 'joint', force: 1000 })).toThrow(ChecksInputError)
  })
})

describe('never NaN or Infinity', () => {
  it('holds over random valid geometry, forces and bases', () => {
    const basis = fc.constantFrom({ kind: 'allowable' }, { kind: 'en1993' }, { kind: 'aisc360', method: 'LRFD' }, { kind: 'aisc360', method: 'ASD' })
    fc.assert(
      fc.property(
        basis,
        fc.double({ min: 3, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: 1, max: 40, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.boolean(),
        (b, d, clearance, t, gap, F, single) => {
          const input = checksInputSchema.parse({
            basis: b,
            joints: { J: { pinDiameter: d, holeDiameter: d + clearance, arrangement: single ? 'single' : 'double', middle: { thickness: t }, outer: { thickness: t / 2 }, gap } },
            links: { L: { section: { shape: 'flat', width: d * 2 + 2 * t, thickness: t }, eye: { pinDiameter: d, holeDiameter: d + clearance }, length: d * 3 + 1 } },
          })
          const r1 = checkComponent(input, 'J', { kind: 'joint', force: F })
          const r2 = checkComponent(input, 'L', { kind: 'link', tension: F, compression: F / 2, moment: F })
          for (const c of [...r1.checks, ...r2.checks]) {
            expect(Number.isFinite(c.demand) && Number.isFinite(c.capacity) && Number.isFinite(c.utilisation)).toBe(true)
          }
        },
      ),
      { numRuns: 200 },
    )
  })
})
