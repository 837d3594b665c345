import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { saveInputs } from '@/server/calcs'
import { addMaterial } from '@/server/materials'
import { calcs } from '@/db/schema'
import { DEMO_CALCS } from '@/server/demo/demo-data'
import type { Caller } from '@/server/access'
import { seededDemo } from '../helpers/demo'
import { AppError } from '@/lib/errors'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let projectId = ''
let engineer: Caller
beforeAll(async () => {
  env = await useTempEnvironment()
  const demo = await seededDemo()
  projectId = demo.projectId
  engineer = demo.people.engineer
})
afterAll(() => env.close())

// S460 values as a member would copy them from a mill certificate (invented for this test).
const own = { kind: 'steel', fy: 460, fu: 540, E: 210000, density: 7850, source: 'Mill certificate 3.1 no. 4711 (test data)' }

describe('project materials', () => {
  it('needs a source and strength values, reported at the field', async () => {
    const noSource = await addMaterial(engineer, projectId, 'S460 bar', { ...own, source: '' }).catch((e: AppError) => e)
    expect((noSource as AppError).fieldErrors?.source).toMatch(/source is required/)
    const noStrength = await addMaterial(engineer, projectId, 'S460 bar', { kind: 'steel', E: 210000, source: 'x-source' }).catch((e: AppError) => e)
    expect((noStrength as AppError).fieldErrors?.fy).toMatch(/no strength values/)
    const library = await addMaterial(engineer, projectId, 'S355', own).catch((e: AppError) => e)
    expect((library as AppError).fieldErrors?.name).toMatch(/library material/)
  })

  it('is copied into the inputs of a calc that names it, so the revision carries its values', async () => {
    await addMaterial(engineer, projectId, 'S460 bar', own)
    const [calc] = await db.select().from(calcs).where(eq(calcs.number, 'LC-003'))
    const inputs = DEMO_CALCS[2].inputs
    const values = { ...inputs, defaults: { ...inputs.defaults, link: { ...inputs.defaults.link, material: 'S460 bar' } } }
    const outcome = await saveInputs(engineer, projectId, calc.id, values)
    expect(outcome.ok).toBe(true)
    const [saved] = await db.select().from(calcs).where(eq(calcs.id, calc.id))
    expect((saved.draftInputs as { materials: Record<string, { fy: number; source: string }> }).materials['S460 bar']).toMatchObject({ fy: 460, source: own.source })
  })
})
