import { apiRoute, created, readJson } from '@/app/_lib/api'
import { importCalcSchema } from '@/lib/schemas/project'
import { getCalcDetail, importCalc } from '@/server/calcs'

/** A new draft calc from a calc input file (the CLI's format); 422 names the file's fields that are wrong. */
export const POST = apiRoute<{ projectId: string }>(async ({ req, caller, params }) => {
  const body = await readJson(req, importCalcSchema)
  const calc = await importCalc(caller, params.projectId, { number: body.number, title: body.title }, body.inputs)
  return created(await getCalcDetail(caller, params.projectId, calc.id))
})
