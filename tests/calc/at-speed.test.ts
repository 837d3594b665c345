import { describe, expect, it } from 'vitest'
import { calculate } from '@/lib/calc/run'
import { DEMO_CALCS } from '@/lib/demo/calcs'

// The calc wiring of the forces at operating speed (lib/calc/at-speed.ts); the kinetostatics
// themselves are checked against hand-worked cases and virtual power in tests/dynamics.
const lc3 = structuredClone(DEMO_CALCS[2].inputs) as unknown as Record<string, unknown> & { operatingSpeed?: { rpm: number; toolMass?: number } }
const run = (patch: Record<string, unknown>) => calculate({ ...lc3, ...patch })
const ok = (patch: Record<string, unknown>) => {
  const out = run(patch)
  if (!out.ok) throw new Error(JSON.stringify(out.fieldErrors))
  return out.result
}
const step = (r: ReturnType<typeof ok>, id: string) => r.steps.find((s) => s.id === id)

describe('forces at operating speed in the calc', () => {
  it('adds a case at speed beside each static case, and the checks take the larger design force', () => {
    const statics = ok({ operatingSpeed: undefined })
    const fast = ok({})
    expect(fast.loadCases.map((c) => c.name)).toEqual(['Folding a flap', 'Folding a flap at speed'])
    expect(fast.envelope).toHaveLength(2)
    // Design force of a pin = load factor × dynamic factor × the largest pin force over every case (EN 1990 format, common practice).
    const f = lc3.factors as { load: number; dynamic: number }
    for (const pin of ['O', 'P', 'C']) {
      const largest = Math.max(...fast.envelope.map((e) => e.pins[pin].value))
      expect(step(fast, `chk.pin.${pin}.force`)!.value).toBeCloseTo(f.load * f.dynamic * largest, 6)
      expect(step(fast, `chk.pin.${pin}.force`)!.value as number).toBeGreaterThanOrEqual(step(statics, `chk.pin.${pin}.force`)!.value as number)
    }
  })

  it('weighs each link as ρ A L from its section and material', () => {
    const r = ok({})
    // 20 × 6 mm flat of S355 at 7850 kg/m³ (EN 1991-1-1 Table A.4, steel — from memory), OA = l = 200 mm.
    expect(step(r, 'dyn.mass.OA')!.value).toBeCloseTo((7850 * 20 * 6 * 200) / 1e9, 9)
    // Its moment of inertia about the centroid, m L²/12 (slender bar, common practice), kg·mm².
    expect(step(r, 'dyn.inertia.OA')!.value).toBeCloseTo((((7850 * 20 * 6 * 200) / 1e9) * 200 ** 2) / 12, 6)
    // OB is the same bar: its steps go to the appendix.
    expect(step(r, 'dyn.mass.OB')!.appendix).toBe(true)
  })

  it('at a crawl the case at speed carries the static forces (ω → 0)', () => {
    const r = ok({ operatingSpeed: { rpm: 0.001 } })
    const [slow, crawl] = r.envelope
    for (const pin of Object.keys(slow.pins)) expect(crawl.pins[pin].value).toBeCloseTo(slow.pins[pin].value, 4)
  })

  it('bad speed inputs are refused at their field', () => {
    expect(run({ operatingSpeed: { rpm: 5000 } })).toMatchObject({ ok: false, fieldErrors: { 'operatingSpeed.rpm': expect.stringMatching(/at most 1200/) } })
    expect(run({ operatingSpeed: { rpm: -1 } })).toMatchObject({ ok: false, fieldErrors: { 'operatingSpeed.rpm': expect.any(String) } })
    expect(run({ operatingSpeed: { rpm: 60, toolMass: -2 } })).toMatchObject({ ok: false, fieldErrors: { 'operatingSpeed.toolMass': expect.any(String) } })
    // Without checks and without a self-weight the links have no mass.
    const { basis: _b, factors: _f, defaults: _d, ...bare } = lc3
    expect(calculate(bare)).toMatchObject({ ok: false, fieldErrors: { 'operatingSpeed.rpm': expect.stringMatching(/no mass/) } })
  })
})
