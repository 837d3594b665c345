import { apiRoute, created, readJson } from '@/app/_lib/api'
import { createCalcSchema } from '@/lib/schemas/project'
import { createCalc, getCalcDetail, listCalcs } from '@/server/calcs'

type P = { projectId: string }

/** The calc register of a project. */
export const GET = apiRoute<P>(async ({ caller, params }) => {
  const rows = await listCalcs(caller, params.projectId)
  return { items: rows.map(({ calcType, updatedAt, ...r }) => ({ ...r, mechanism: calcType, updatedAt: updatedAt.toISOString() })) }
})

/** Creates a draft calc with the mechanism's defaults saved; same rules as the form. */
export const POST = apiRoute<P>(async ({ req, caller, params }) => {
  const body = await readJson(req, createCalcSchema.omit({ calcType: true }).extend({ mechanism: createCalcSchema.shape.calcType }).strict())
  const calc = await createCalc(caller, params.projectId, { number: body.number, title: body.title, calcType: body.mechanism })
  return created(await getCalcDetail(caller, params.projectId, calc.id))
})
