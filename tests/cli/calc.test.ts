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
