import { describe, it, expect } from 'vitest'
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { ZodError } from 'zod'
import { mechanismInputSchema, runMechanism } from '@/lib/calc/mechanism'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import example from '@/examples/peaucellier.json'
import hartExample from '@/examples/hart.json'

describe('mechanism input schema and error line', () => {
  const bad = (x: unknown) => {
    const r = mechanismInputSchema.safeParse(x)
    if (r.success) throw new Error('expected a schema error')
    const [path, message] = Object.entries(fieldErrorsOf(r.error))[0]
    return `error: ${path}: ${message}`
  }
  const base = { mechanism: 'peaucellier', geometry: { arm: 150, side: 60, crank: 60 }, loads: [{ name: 'a', fx: 0, fy: 1 }] }
  it('names the field in one line', () => {
    expect(bad({ ...base, geometry: { arm: 150, side: -60, crank: 60 } })).toBe('error: geometry.side: must be positive')
    expect(bad({ ...base, geometry: { arm: 150, crank: 60 } })).toBe('error: geometry.side: is required')
    expect(bad({ ...base, loads: [{ name: 'a', fx: 'x', fy: 1 }] })).toBe('error: loads.0.fx: must be a number')
    expect(bad({ ...base, mechanism: 'other' })).toBe('error: mechanism: must be "peaucellier" or "hart"')
    expect(bad({ ...base, loads: [base.loads[0], base.loads[0]] })).toMatch(/^error: loads\.1\.name: repeats/)
  })
  it('accepts the example files', () => {
    expect(mechanismInputSchema.safeParse(example).success).toBe(true)
    expect(mechanismInputSchema.safeParse(hartExample).success).toBe(true)
  })
  it('throws a ZodError from runMechanism on a malformed input, never on a geometric one', () => {
    expect(() => runMechanism({ ...base, geometry: { arm: 0, side: 60, crank: 60 } } as never)).toThrow(ZodError)
    expect(runMechanism({ mechanism: 'peaucellier', geometry: { arm: 50, side: 60, crank: 60 }, loads: base.loads }).feasibility.ok).toBe(false)
  })
})

describe('mechanism result', () => {
  const ids = (geometry: { arm: number; side: number; crank: number }) =>
    runMechanism({ mechanism: 'peaucellier', geometry, loads: [{ name: 'Carton push', fx: 3, fy: 80 }] }).steps.map((s) => s.id)

  it('keeps step ids when the numbers change', () => {
    expect(ids({ arm: 150, side: 60, crank: 60 })).toEqual(ids({ arm: 160, side: 70, crank: 58 }))
    expect(ids({ arm: 150, side: 60, crank: 60 })).toContain('stat.envelope.carton-push.OA')
    expect(ids({ arm: 150, side: 60, crank: 60 })).toContain('ver.virtual-work.carton-push')
  })

  it('shows every check of the example as passing, and one sweep table per load case', () => {
    const res = runMechanism(example as never)
    const checks = res.steps.filter((s) => s.section === 'verification')
    expect(checks.length).toBeGreaterThan(4)
    for (const s of checks) expect(s.verdict).toBe('pass')
    expect(res.tables.map((t) => t.id)).toEqual(['tab.sweep.carton-push', 'tab.sweep.side-load'])
    expect(res.loadCases[1].positions).toHaveLength(res.positions.length)
  })

  it('flags positions at or beyond the toggle instead of returning huge numbers', () => {
    const limit = (2 * Math.acos(90 / 120) * 180) / Math.PI
    const res = runMechanism({ mechanism: 'peaucellier', geometry: { arm: 150, side: 60, crank: 60 }, loads: [{ name: 'a', fx: 0, fy: 1 }], crankAnglesDeg: [0, limit - 1e-9, limit + 1] })
    expect(res.positions.map((p) => p.crankDeg)).toEqual([0])
    expect(res.toggles.map((t) => t.reason)).toEqual([expect.stringMatching(/singular|force-amplification/), 'unreachable'])
  })
})

describe('CLI', () => {
  it('prints JSON for a good file and one error line for a bad one', () => {
    const out = JSON.parse(execFileSync('npx', ['tsx', 'scripts/calc.ts', 'examples/hart.json'], { encoding: 'utf8' }))
    expect(out.mechanism).toBe('hart')
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'calc-')), 'bad.json')
    writeFileSync(file, JSON.stringify({ mechanism: 'slider', geometry: {}, loads: [] }))
    const bad = spawnSync('npx', ['tsx', 'scripts/calc.ts', file], { encoding: 'utf8' })
    expect(bad.status).toBe(1)
    expect(bad.stderr.trim()).toBe('error: mechanism: must be "peaucellier" or "hart"')
  })
})
