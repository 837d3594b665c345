/** runChecks over engine envelopes: design-force selection, governing flags, ids, table, cautions. */
import { describe, expect, it } from 'vitest'
import type { LoadCaseEnvelope } from '@/lib/contract'
import { ChecksInputError, checksInputSchema, GENERAL_CAUTION, runChecks, runChecksCli } from '@/lib/checks'
import allowable from '@/examples/checks-allowable.json'
import en from '@/examples/checks-en1993.json'
import aisc from '@/examples/checks-aisc360.json'

const LINKS = ['OA', 'OB', 'AP', 'BP', 'AT', 'BT', 'CP']
const JOINTS = ['O', 'C', 'A', 'B', 'P', 'T']
const x = (value: number, crankDeg: number) => ({ value, crankDeg })

function envelope(loadCase: string, scale: number): LoadCaseEnvelope {
  return {
    loadCase,
    links: Object.fromEntries(
      LINKS.map((n, i) => [n, { length: n === 'CP' ? 60 : n.startsWith('O') ? 250 : 100, maxTension: x(1000 * scale * (i + 1), 10 * i), maxCompression: x(-800 * scale * (i + 1), 5 * i) }]),
    ),
    pins: Object.fromEntries(JOINTS.map((n, i) => [n, x(1500 * scale * (i + 1), 3 * i)])),
    driveTorque: x(1000, 0),
  }
}

const input = checksInputSchema.parse({
  basis: { kind: 'en1993' },
  factors: { load: 1.5, dynamic: 1.2 },
  defaults: {
    joint: { pinDiameter: 12, holeDiameter: 12.1, middle: { thickness: 8 }, outer: { thickness: 5 }, gap: 0.5 },
    link: { section: { shape: 'flat', width: 32, thickness: 8 }, eye: { edgeAlong: 16 } },
  },
  joints: { P: { pinDiameter: 16, holeDiameter: 16.1 } },
})

describe('runChecks on a Peaucellier envelope', () => {
  const envs = [envelope('working', 1), envelope('jam', 2)]
  // Solved inside each test (not while collecting), so mutation testing sees which tests cover the checks.
  const solved = () => runChecks(input, envs)
  it('checks every joint and link, with stable step ids', () => {
    const r = solved()
    const comps = new Set(r.checks.map((c) => c.component))
    expect(comps.size).toBe(JOINTS.length + LINKS.length)
    expect(r.steps.map((s) => s.id)).toContain('chk.pin.P.shear')
    expect(r.steps.map((s) => s.id)).toContain('chk.link.OA.buckling')
    expect(r.steps.map((s) => s.id)).toContain('chk.pin.P.force')
    for (const c of r.checks) expect(r.steps.find((s) => s.id === c.stepId)?.verdict).toBe(c.pass ? 'pass' : 'fail')
    expect(r.steps.every((s) => s.section === 'checks')).toBe(true)
  })
  it('takes the governing load case times load and dynamic factors', () => {
    const r = solved()
    // joint P is index 4: jam case 1500·2·5 = 15 000 N × 1.5 × 1.2 = 27 000 N at crank 12°
    const shear = r.checks.find((c) => c.stepId === 'chk.pin.P.shear')!
    expect(shear.demand).toBeCloseTo(27000, 6)
    expect(shear.loadCase).toBe('jam')
    expect(shear.crankDeg).toBe(12)
    // link OB (index 1) compression: |−800·2·2| × 1.8 = 5760 N at 5°
    const b = r.checks.find((c) => c.stepId === 'chk.link.OB.buckling')!
    expect(b.demand).toBeCloseTo(5760, 6)
    expect(b.crankDeg).toBe(5)
  })
  it('marks exactly one governing check per component, the highest utilisation', () => {
    const r = solved()
    const by = new Map<string, typeof r.checks>()
    for (const c of r.checks) by.set(c.component, [...(by.get(c.component) ?? []), c])
    for (const list of by.values()) {
      const g = list.filter((c) => c.governing)
      expect(g).toHaveLength(1)
      expect(g[0].utilisation).toBe(Math.max(...list.map((c) => c.utilisation)))
    }
  })
  it('summary table and cautions', () => {
    const r = solved()
    expect(r.tables[0].id).toBe('checks-summary')
    expect(r.tables[0].rows).toHaveLength(r.checks.length)
    expect(r.cautions[0]).toBe(GENERAL_CAUTION)
    expect(r.cautions.some((c) => /National Annex/.test(c))).toBe(true)
  })
  it('a described joint that is not in the mechanism is an error at its path', () => {
    const bad = checksInputSchema.parse({ ...input, joints: { Q: { pinDiameter: 10 } } })
    try {
      runChecks(bad, envs)
      expect.unreachable()
    } catch (e) {
      expect(e).toBeInstanceOf(ChecksInputError)
      expect((e as ChecksInputError).issues[0]).toEqual({ path: 'joints.Q', message: expect.stringMatching(/not in the mechanism \(its joints: O, C, A, B, P, T\)/) })
    }
  })
  it('accepts any names (a Hart inversor envelope)', () => {
    const hart: LoadCaseEnvelope = {
      loadCase: 'LC1',
      links: { AB: { length: 300, maxTension: x(500, 0), maxCompression: x(-400, 20), maxMoment: x(20000, 30) } },
      pins: { E: x(700, 0) },
      driveTorque: x(0, 0),
    }
    const h = runChecks({ ...input, joints: {} }, [hart])
    expect(h.checks.find((c) => c.stepId === 'chk.link.AB.axial-bending')).toBeDefined()
    expect(h.checks.some((c) => c.component === 'pin E')).toBe(true)
  })
  it('with every basis', () => {
    for (const basis of [{ kind: 'allowable' as const, factorOfSafety: 2 }, { kind: 'aisc360' as const, method: 'ASD' as const }]) {
      const out = runChecks({ ...input, basis }, envs)
      expect(out.checks.length).toBeGreaterThan(0)
    }
  })
})

describe('example inputs run as documented', () => {
  it.each([
    ['checks-allowable.json', allowable],
    ['checks-en1993.json', en],
    ['checks-aisc360.json', aisc],
  ])('%s', (_name, json) => {
    const r = runChecksCli(json)
    expect(r.ok).toBe(true)
  })
})

describe('TeX of every step renders in KaTeX', () => {
  const bases = [
    { kind: 'allowable' as const, factorOfSafety: 2 },
    { kind: 'en1993' as const, gammaM0: 1.1, gammaM1: 1.15, gammaM2: 1.25, gammaM6ser: 1.05 },
    { kind: 'aisc360' as const, method: 'LRFD' as const },
    { kind: 'aisc360' as const, method: 'ASD' as const },
  ]
  it.each(bases.map((b) => [`${b.kind} ${'method' in b ? b.method : ''}`, b] as const))('%s', async (_name, basis) => {
    const katex = (await import('katex')).default
    const beam = envelope('working', 1)
    beam.links.OA = { ...beam.links.OA, maxMoment: x(50000, 15) }
    const steps = runChecks({ ...input, basis }, [beam]).steps
    expect(steps.length).toBeGreaterThan(50)
    for (const s of steps) {
      for (const tex of [s.formula, s.substituted]) if (tex) expect(() => katex.renderToString(tex, { throwOnError: true }), `${s.id}: ${tex}`).not.toThrow()
    }
  })
})
