import { randomUUID } from 'node:crypto'
import { and, asc, eq } from 'drizzle-orm'
import { MATERIALS, materialSchema } from '@/lib/checks'
import { AppError } from '@/lib/errors'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { audit } from './audit'
import { db } from './index'
import { projectMaterials } from './schema'

export function listProjectMaterials(projectId: string) {
  return db.select().from(projectMaterials).where(eq(projectMaterials.projectId, projectId)).orderBy(asc(projectMaterials.name))
}

/** A member's own material; the schema requires strengths and a source so every value stays traceable. */
export async function addProjectMaterial(projectId: string, name: string, raw: unknown, userId: string) {
  if (MATERIALS[name]) throw new AppError('invalid', 'Name taken by the library.', { name: `${name} is a library material; choose another name.` })
  const parsed = materialSchema.safeParse(raw)
  if (!parsed.success) throw new AppError('invalid', 'Check the marked fields.', fieldErrorsOf(parsed.error))
  const [clash] = await db.select({ id: projectMaterials.id }).from(projectMaterials).where(and(eq(projectMaterials.projectId, projectId), eq(projectMaterials.name, name)))
  if (clash) throw new AppError('conflict', 'Name taken.', { name: `The project already has a material called ${name}.` })
  await db.insert(projectMaterials).values({ id: randomUUID(), projectId, name, data: parsed.data, source: parsed.data.source, createdBy: userId })
  await audit({ userId, action: 'material.added', projectId, detail: { name } })
}

/**
 * Copies the project materials that the inputs name into the inputs' own `materials`, so a saved
 * revision carries every value it used even if the project's list changes later.
 */
export async function withProjectMaterials(projectId: string, values: unknown): Promise<unknown> {
  if (!values || typeof values !== 'object') return values
  const text = JSON.stringify(values)
  const used = (await listProjectMaterials(projectId)).filter((m) => text.includes(JSON.stringify(m.name)))
  if (used.length === 0) return values
  const own = ((values as { materials?: Record<string, unknown> }).materials ?? {}) as Record<string, unknown>
  return { ...values, materials: { ...Object.fromEntries(used.map((m) => [m.name, m.data])), ...own } }
}
