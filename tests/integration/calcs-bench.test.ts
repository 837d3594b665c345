import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { db } from '@/db'
import { calcs, revisions } from '@/db/schema'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import { AppError } from '@/lib/errors'
import type { Caller } from '@/server/access'
import { cloneCalc, createCalc, exportCalcInputs, importCalc, listCalcs, nextCalcNumber, nextNumberOf, saveInputs } from '@/server/calcs'
import { searchProject } from '@/server/search'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

/*
 * The bench's services against a real (temporary) database: infeasible or out-of-range inputs are
 * refused at their fields and save nothing; clone, export and import give back identical inputs;
 * calc numbers are unique regardless of case and the proposed one is free; search finds numbers,
 * titles, load case names, step titles and remarks; the register carries verdict and utilisation.
 */

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let people: Record<DemoRole, Caller>
let projectId = ''
let calcIdOf: (n: string) => Promise<string>

beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people, projectId, calcId: calcIdOf } = await seededDemo())
}, 60_000)
afterAll(() => env.close())

const code = async (p: Promise<unknown>) => {
  try {
    await p
    return 'ok'
  } catch (e) {
    return e instanceof AppError ? e.code : String(e)
  }
}

describe('working inputs', () => {
  it('an infeasible geometry is refused at l, s and r and nothing is saved', async () => {
    const id = await calcIdOf('LC-003')
    const [before] = await db.select().from(calcs).where(eq(calcs.id, id))
    const inputs = structuredClone(before.draftInputs) as { geometry: Record<string, number> }
    inputs.geometry = { ...inputs.geometry, crank: 20, crankPivotOffset: 20 }
    const out = await saveInputs(people.engineer, projectId, id, inputs)
    expect(out.ok).toBe(false)
    if (!out.ok) expect(out.fieldErrors['geometry.crank']).toMatch(/the crank cannot reach the cell: make 2r ≥ l − s/)
    const [after] = await db.select().from(calcs).where(eq(calcs.id, id))
    expect(after.draftInputs).toEqual(before.draftInputs)
    expect(after.updatedAt).toEqual(before.updatedAt)
  })

  it('a number out of its range is refused with the reason', async () => {
    const id = await calcIdOf('LC-003')
    const out = await saveInputs(people.engineer, projectId, id, { ...defaultCalcInputs('peaucellier'), factors: { load: 40, dynamic: 1 } })
    expect(out).toMatchObject({ ok: false, fieldErrors: { 'factors.load': expect.stringMatching(/from 1 to 3: a load factor/) } })
  })

  it('stores exactly what was sent', async () => {
    const id = await calcIdOf('LC-003')
    const inputs = { ...defaultCalcInputs('peaucellier'), geometry: { arm: 250.125, side: 100, crank: 100, crankPivotOffset: 100 }, displayUnits: 'US' }
    expect((await saveInputs(people.engineer, projectId, id, inputs)).ok).toBe(true)
    const { inputs: back } = await exportCalcInputs(people.checker, projectId, id)
    expect(back).toEqual(inputs)
  })
})

describe('numbers', () => {
  it('proposes the next number of the commonest pattern, free in any case', () => {
    expect(nextNumberOf([])).toBe('LC-001')
    expect(nextNumberOf(['LC-001', 'LC-002', 'LC-010'])).toBe('LC-011')
    expect(nextNumberOf(['LC-001', 'lc-002'])).toBe('LC-003')
    expect(nextNumberOf(['A-9', 'LC-001', 'LC-002'])).toBe('LC-003')
    expect(nextNumberOf(['CALC-1'])).toBe('CALC-2')
  })

  it('refuses lc-001 beside LC-001, and the proposed number is free', async () => {
    expect(await code(createCalc(people.engineer, projectId, { number: 'lc-001', title: 'Clash', calcType: 'hart' }))).toBe('conflict')
    const next = await nextCalcNumber(people.engineer, projectId)
    const numbers = (await listCalcs(people.engineer, projectId)).map((r) => r.number.toLowerCase())
    expect(numbers).not.toContain(next.toLowerCase())
    expect(await code(createCalc(people.engineer, projectId, { number: next, title: 'Fresh', calcType: 'hart' }))).toBe('ok')
  })
})

describe('clone, export, import', () => {
  it('clone → export → import gives identical inputs, with no revisions', async () => {
    const id = await calcIdOf('LC-001')
    const original = await exportCalcInputs(people.engineer, projectId, id)
    const clone = await cloneCalc(people.engineer, projectId, id)
    expect(clone.number).not.toBe('LC-001')
    expect(clone.title).toMatch(/^Copy of /)
    expect(await db.select().from(revisions).where(eq(revisions.calcId, clone.id))).toEqual([])
    const exported = await exportCalcInputs(people.engineer, projectId, clone.id)
    expect(exported.inputs).toEqual(original.inputs)
    const imported = await importCalc(people.engineer, projectId, { title: 'Round trip' }, JSON.parse(JSON.stringify(exported.inputs)))
    expect((await exportCalcInputs(people.engineer, projectId, imported.id)).inputs).toEqual(original.inputs)
    expect(imported.draftResult).not.toBeNull()
  })

  it('an import with errors names the file’s fields and makes no calc', async () => {
    const before = (await listCalcs(people.engineer, projectId)).length
    const bad = { ...defaultCalcInputs('hart'), geometry: { long: 240, short: 300, ratio: 1.5, crank: 40 } }
    try {
      await importCalc(people.engineer, projectId, { title: 'Broken file' }, bad)
      expect.unreachable()
    } catch (e) {
      expect(e).toBeInstanceOf(AppError)
      expect((e as AppError).fieldErrors).toMatchObject({ 'geometry.ratio': expect.any(String) })
    }
    expect(await code(importCalc(people.engineer, projectId, { title: 'No mechanism' }, { loads: [] }))).toBe('invalid')
    expect((await listCalcs(people.engineer, projectId)).length).toBe(before)
  })

  it('only roles that create calcs may clone or import', async () => {
    const id = await calcIdOf('LC-001')
    expect(await code(cloneCalc(people.checker, projectId, id))).toBe('forbidden')
    expect(await code(importCalc(people.approver, projectId, { title: 'Nope' }, defaultCalcInputs('hart')))).toBe('forbidden')
  })
})

describe('finding things', () => {
  it('finds numbers, titles, load case names and step titles', async () => {
    const hits = async (q: string) => (await searchProject(people.checker, projectId, q)).map((h) => `${h.number}:${h.kind}`)
    expect(await hits('lc-002')).toContain('LC-002:number')
    expect(await hits('Working load')).toContain('LC-003:input')
    expect((await hits('inversion constant')).some((h) => h.endsWith(':step'))).toBe(true)
    expect(await hits('x')).toEqual([])
  })

  it('the register carries the working verdict, the governing utilisation and open remarks', async () => {
    const rows = await listCalcs(people.checker, projectId)
    const lc1 = rows.find((r) => r.number === 'LC-001')!
    expect(['pass', 'fail']).toContain(lc1.verdict)
    expect(lc1.maxUtilisation).toBeGreaterThan(0)
    expect(lc1.openRemarks).toBe(0)
  })
})
