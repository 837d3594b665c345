/**
 * AISC 360-16 §B3.1 / §B3.2: the design strength is φR_n (LRFD) and the allowable strength R_n/Ω (ASD).
 * Every AISC check prints that step as `φR_n = φ · R_n = …` or `R_n/Ω = R_n/Ω = …`; the printed result
 * must be the printed product or quotient (checked here by doing the arithmetic on the printed numbers,
 * to the four figures printed) and must be the capacity the check compared with.
 */
import { describe, expect, it } from 'vitest'
import { checkComponent, checksInputSchema } from '@/lib/checks'
import { HAND_MATERIALS, samePrinted } from './_hand'

const NUM = '(-?\\d+(?:\\.\\d+)?)'
const LRFD_RE = new RegExp(`\\\\phi R_n = ${NUM} \\\\cdot ${NUM} = ${NUM}`)
const ASD_RE = new RegExp(`R_n/\\\\Omega = ${NUM}/${NUM} = ${NUM}`)

/** Agreement to the figures printed: each printed number may be off by half a unit in its 4th figure. */
const agrees = (printed: number, computed: number) => Math.abs(printed - computed) <= 1.5e-3 * Math.abs(computed)

function verify(method: 'LRFD' | 'ASD', r: ReturnType<typeof checkComponent>): number {
  let n = 0
  for (const c of r.checks) {
    const tex = r.steps.find((s) => s.id === c.stepId)!.substituted ?? ''
    const m = (method === 'LRFD' ? LRFD_RE : ASD_RE).exec(tex)
    if (!m) continue
    const [a, b, res] = [Number(m[1]), Number(m[2]), Number(m[3])]
    const computed = method === 'LRFD' ? a * b : a / b
    expect(agrees(res, computed), `${c.stepId}: ${m[0]} (computed ${computed})`).toBe(true)
    // φ or Ω is one of the specification's values
    expect(method === 'LRFD' ? [0.75, 0.9] : [2, 1.67], c.stepId).toContain(method === 'LRFD' ? a : b)
    if (c.stepId.split('.').pop() !== 'axial-bending') expect(samePrinted(res, c.capacity), `${c.stepId}: printed ${res}, capacity ${c.capacity}`).toBe(true)
    n++
  }
  return n
}

describe('φR_n and R_n/Ω as printed', () => {
  for (const method of ['LRFD', 'ASD'] as const) {
    it(`${method}: pins and links`, () => {
      const basis = { kind: 'aisc360', method }
      let n = 0
      for (const J of [
        { pinDiameter: 17, holeDiameter: 17.6, pinMaterial: 'Pin400', middle: { thickness: 11, material: 'Plate250' }, outer: { thickness: 4.5 }, gap: 1.5 },
        { pinDiameter: 23, holeDiameter: 23.4, pinMaterial: 'Bar300', arrangement: 'single', middle: { thickness: 7 }, outer: { thickness: 9 }, gap: 0.7 },
      ]) {
        const input = checksInputSchema.parse({ basis, materials: HAND_MATERIALS, joints: { J } })
        n += verify(method, checkComponent(input, 'J', { kind: 'joint', force: 12345 }))
      }
      for (const L of [
        { section: { shape: 'flat', width: 47, thickness: 9 }, material: 'Bar300', eye: { thickness: 9, width: 47, pinDiameter: 17, holeDiameter: 17.6, edgeAlong: 19.3 }, length: 430 },
        { section: { shape: 'round', diameter: 27 }, material: 'Plate250', eye: { thickness: 11, width: 53, pinDiameter: 21, holeDiameter: 21.7, edgeAlong: 23.1 }, length: 210 },
      ]) {
        const input = checksInputSchema.parse({ basis, materials: HAND_MATERIALS, links: { L } })
        n += verify(method, checkComponent(input, 'L', { kind: 'link', tension: 23456, compression: 12345, moment: 98765, eye: 25000, across: true }))
      }
      // pins: shear, bending (bearing prints R_n separately); links: D5-1, D5-2, J7-1, D2-1, E3, and M_c inside H1.1
      expect(n).toBeGreaterThanOrEqual(2 * 2 + 2 * 5)
    })
  }
})
