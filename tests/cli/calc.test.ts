import { spawnSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { DEMO_CALCS } from '@/lib/demo/calcs'

const dir = mkdtempSync(path.join(tmpdir(), 'inverso-cli-'))
function calc(input: unknown) {
  const file = path.join(dir, `${Math.random().toString(36).slice(2)}.json`)
  writeFileSync(file, JSON.stringify(input))
  const r = spawnSync('npx', ['tsx', 'scripts/calc.ts', file], { encoding: 'utf8' })
  return { status: r.status, json: r.status === 0 ? (JSON.parse(r.stdout) as Record<string, unknown>) : null, stderr: r.stderr.trim() }
}

describe('npm run calc', () => {
  it('runs the mechanism and the pin/link checks of a full calc input', () => {
    const r = calc(DEMO_CALCS[0].inputs)
    expect(r.status).toBe(0)
    const checks = r.json!.checks as { component: string; governing: boolean; utilisation: number }[]
    expect(checks.length).toBeGreaterThan(10)
    // One governing check per component (the one with the highest utilisation).
    const components = new Set(checks.map((c) => c.component))
    expect(checks.filter((c) => c.governing)).toHaveLength(components.size)
    expect(r.json!.verdict).toMatchObject({ pass: true })
    for (const key of ['inversionConstant', 'lineOffset', 'feasibility', 'stroke', 'positions', 'envelope', 'steps']) expect(r.json).toHaveProperty(key)
  }, 30_000)

  it('checks one component alone when the input has no mechanism', () => {
    const r = calc({ basis: { kind: 'allowable', factorOfSafety: 2 }, joints: { P: { pinDiameter: 10, holeDiameter: 10.5, middle: { thickness: 8 }, outer: { thickness: 5 } } }, component: { joint: 'P', force: 5000 } })
    expect(r.status).toBe(0)
    expect((r.json!.checks as unknown[]).length).toBeGreaterThan(0)
  }, 30_000)

  it('names the field of a bad pin description in one line', () => {
    const input = { ...DEMO_CALCS[0].inputs, joints: { P: { pinDiameter: 12, holeDiameter: 11 } } }
    const r = calc(input)
    expect(r.status).toBe(1)
    expect(r.stderr).toMatch(/^error: joints\.P\.holeDiameter: /)
  }, 30_000)
})

describe('required stroke', () => {
  it('passes when the usable stroke covers it and fails the verdict when it does not', () => {
    // Demo LC-001 geometry: k = 250² − 100² = 52 500 mm², r = 100 mm, usable half stroke ≈ 211.9 mm (computed by the engine).
    const ok = calc({ ...DEMO_CALCS[0].inputs, requiredStroke: 120 })
    const steps = ok.json!.steps as { id: string; verdict: string }[]
    expect(steps.find((s) => s.id === 'kin.required-stroke')?.verdict).toBe('pass')
    const tooLong = calc({ ...DEMO_CALCS[0].inputs, requiredStroke: 500 })
    expect((tooLong.json!.steps as { id: string; verdict: string }[]).find((s) => s.id === 'kin.required-stroke')?.verdict).toBe('fail')
    expect(tooLong.json!.verdict).toMatchObject({ pass: false })
  }, 30_000)
})

/*
 * Issue 13: the CLI prints what analyse() (the same function as POST /api/v1/analyse) gives —
 * tests/security/input-bounds.test.ts shows over random inputs that it is finite — and refuses a
 * number outside its range with one line naming the field, exit 1, no stack trace.
 */
describe('bounds', () => {
  it('an input at the extremes of every range prints finite JSON identical to analyse()', async () => {
    const { analyse } = await import('@/lib/analyse')
    // Every number at a limit (lib/bench/ranges.ts); l − s = 2r keeps the Peaucellier crank in reach (docs/engine.md).
    const input = {
      mechanism: 'peaucellier',
      geometry: { arm: 5000, side: 2000, crank: 1600, crankPivotOffset: 1600 },
      loads: [{ name: 'A', fx: 1e6, fy: -1e6 }, { name: 'B', fx: -1e6, fy: 1e6 }],
      toggleMarginDeg: 5,
      amplificationLimit: 2,
      minTransmissionAngleDeg: 90,
      straightnessTolerance: 0.001,
      requiredStroke: 5000,
      selfWeight: { density: 25000, area: 1e5, g: 100, directionDeg: 360 },
      basis: { kind: 'en1993', gammaM0: 2, gammaM1: 2, gammaM2: 2, gammaM6ser: 2 },
      factors: { load: 3, dynamic: 5 },
      defaults: { joint: { pinDiameter: 200, holeDiameter: 210, middle: { thickness: 200 }, outer: { thickness: 200 }, gap: 100 }, link: { section: { shape: 'flat', width: 500, thickness: 200 }, eye: { edgeAlong: 500 }, effectiveLengthFactor: 5 } },
    }
    const r = calc(input)
    expect(r.status).toBe(0)
    const direct = analyse(input)
    expect(direct.ok).toBe(true)
    if (direct.ok) expect(r.json).toEqual(JSON.parse(JSON.stringify(direct.output)))
    expect((r.json!.checks as unknown[]).length).toBeGreaterThan(0)
  }, 30_000)

  it('an arm of 1e308 mm is one line at its field', () => {
    const r = calc({ ...DEMO_CALCS[0].inputs, geometry: { arm: 1e308, side: 100, crank: 100 } })
    expect(r.status).toBe(1)
    expect(r.stderr).toBe('error: geometry.arm: must be from 1 mm to 5000 mm: links from 1 mm to 5 m cover bench-top guides to machine frames')
  }, 30_000)

  it('a pin of 8 in in US units is one line with the limits in inches', () => {
    const r = calc({ units: 'US', basis: { kind: 'allowable' }, joints: { P: { pinDiameter: 8, holeDiameter: 8.1, middle: { thickness: 0.3 }, outer: { thickness: 0.2 } } }, component: { joint: 'P', force: 1000 } })
    expect(r.status).toBe(1)
    expect(r.stderr.split('\n')).toHaveLength(1)
    expect(r.stderr).toMatch(/^error: joints\.P\.pinDiameter: must be from 0\.07874 in to 7\.874 in: /)
  }, 30_000)
})
