/**
 * Each check names the load case and crank angle of the design force it is
 * governed by: tension checks the largest tension, buckling the largest
 * compression, the body check with bending the largest moment (combined with
 * the largest axial force — conservative), the eye geometry the larger axial force.
 * Envelope values made up for the test; no code value involved.
 */
import { describe, expect, it } from 'vitest'
import type { LoadCaseEnvelope } from '@/lib/contract'
import { checksInputSchema, runChecks } from '@/lib/checks'
import { HAND_MATERIALS } from './_hand'

const x = (value: number, crankDeg: number) => ({ value, crankDeg })
// 'push': largest tension (crank 0°) and compression (crank 10°); 'side': largest moment (crank 30°)
const envelopes: LoadCaseEnvelope[] = [
  { loadCase: 'push', links: { L: { length: 500, maxTension: x(40000, 0), maxCompression: x(-20000, 10), maxMoment: x(1000, 5) } }, pins: { J: x(30000, 20) }, driveTorque: x(0, 0) },
  { loadCase: 'side', links: { L: { length: 500, maxTension: x(1000, 40), maxCompression: x(-500, 45), maxMoment: x(150000, 30) } }, pins: { J: x(10000, 50) }, driveTorque: x(0, 0) },
]
// 'jam' has the larger compression than any tension, and no moment anywhere
const axialOnly: LoadCaseEnvelope[] = [
  { loadCase: 'push', links: { L: { length: 500, maxTension: x(10000, 0), maxCompression: x(-2000, 10) } }, pins: {}, driveTorque: x(0, 0) },
  { loadCase: 'jam', links: { L: { length: 500, maxTension: x(-100, 40), maxCompression: x(-30000, 60) } }, pins: {}, driveTorque: x(0, 0) },
]

const link = { section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { pinDiameter: 20, holeDiameter: 20.5, edgeAlong: 30 } }
const input = (basis: object) =>
  checksInputSchema.parse({
    basis,
    materials: HAND_MATERIALS,
    defaults: { joint: { pinDiameter: 20, holeDiameter: 20.5, middle: { thickness: 10 }, outer: { thickness: 6 } } },
    links: { L: link },
  })
const BASES = [{ kind: 'allowable' }, { kind: 'en1993' }, { kind: 'aisc360', method: 'ASD' }]

describe('the load case and crank angle each check is governed by', () => {
  it.each(BASES.map((b) => [b.kind, b] as const))('%s', (_k, basis) => {
    const r = runChecks(input(basis), envelopes)
    const at = (key: string) => {
      const c = r.checks.find((i) => i.stepId === `chk.link.L.${key}`)!
      return `${c.loadCase} ${c.crankDeg}`
    }
    expect(at('axial-bending')).toBe('side 30')
    expect(at('buckling')).toBe('push 10')
    expect(at(basis.kind === 'aisc360' ? 'tensile-rupture' : 'net-tension')).toBe('push 0')
    const pin = r.checks.filter((i) => i.component === 'pin J')
    expect(pin.length).toBeGreaterThan(2)
    for (const c of pin) expect(`${c.loadCase} ${c.crankDeg}`).toBe('push 20')
  })
  it.each(BASES.map((b) => [b.kind, b] as const))('%s, without a moment: the body check follows the larger axial force', (_k, basis) => {
    const r = runChecks(input(basis), axialOnly)
    const body = r.checks.find((i) => i.stepId === 'chk.link.L.axial' || i.stepId === 'chk.link.L.axial-bending')
    if (basis.kind === 'aisc360') expect(body).toBeUndefined()
    else expect(`${body!.loadCase} ${body!.crankDeg}`).toBe('jam 60')
    if (basis.kind === 'en1993') {
      const eye = r.checks.find((i) => i.stepId === 'chk.link.L.eye-end')!
      expect(`${eye.loadCase} ${eye.crankDeg}`).toBe('jam 60')
    }
    if (basis.kind === 'aisc360') {
      const bearing = r.checks.find((i) => i.stepId === 'chk.link.L.bearing')!
      expect(`${bearing.loadCase} ${bearing.crankDeg}`).toBe('jam 60')
    }
  })
})
