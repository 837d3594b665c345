import { randomUUID } from 'node:crypto'
import { and, asc, eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { projectMaterials } from '@/db/schema'
import { MATERIALS, materialSchema, type MaterialInput } from '@/lib/checks'
import { materialNamesIn } from '@/lib/checks/memory-values'
import { AppError } from '@/lib/errors'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { authorise, type Caller } from './access'

async function rowsOf(projectId: string) {
  const rows = await db.select().from(projectMaterials).where(eq(projectMaterials.projectId, projectId)).orderBy(asc(projectMaterials.name))
  // Written only through materialSchema (addMaterial), so the stored JSON has its shape.
  return rows.map((r) => ({ ...r, data: r.data as MaterialInput }))
}

export async function listMaterials(caller: Caller | null, projectId: string) {
  await authorise(caller, projectId, 'project.view')
  return rowsOf(projectId)
}

/** A member's own material; the schema requires strengths and a source so every value stays traceable. */
export async function addMaterial(caller: Caller | null, projectId: string, name: string, raw: unknown) {
  const { caller: who } = await authorise(caller, projectId, 'material.create')
  if (MATERIALS[name]) throw new AppError('invalid', 'Name taken by the library.', { name: `${name} is a library material; choose another name.` })
  const parsed = materialSchema.safeParse(raw)
  if (!parsed.success) throw new AppError('invalid', 'Check the marked fields.', fieldErrorsOf(parsed.error))
  const [clash] = await db.select({ id: projectMaterials.id }).from(projectMaterials).where(and(eq(projectMaterials.projectId, projectId), eq(projectMaterials.name, name)))
  if (clash) throw new AppError('conflict', 'Name taken.', { name: `The project already has a material called ${name}.` })
  const id = randomUUID()
  await db.insert(projectMaterials).values({ id, projectId, name, data: parsed.data, source: parsed.data.source, createdBy: who.id })
  await audit({ userId: who.id, action: 'material.added', projectId, detail: { name } })
  return id
}

/**
 * Copies the project materials that the inputs name into the inputs' own `materials`, so a saved
 * revision carries every value it used even if the project's list changes later.
 */
export async function withProjectMaterials(projectId: string, values: unknown): Promise<unknown> {
  if (!values || typeof values !== 'object') return values
  const names = materialNamesIn(values)
  const used = (await rowsOf(projectId)).filter((m) => names.has(m.name))
  if (used.length === 0) return values
  const own = ((values as { materials?: Record<string, unknown> }).materials ?? {}) as Record<string, unknown>
  return { ...values, materials: { ...Object.fromEntries(used.map((m) => [m.name, m.data])), ...own } }
}
