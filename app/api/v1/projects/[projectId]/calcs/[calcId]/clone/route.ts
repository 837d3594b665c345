import { apiRoute, created, readJson } from '@/app/_lib/api'
import { cloneCalcSchema } from '@/lib/schemas/project'
import { cloneCalc, getCalcDetail } from '@/server/calcs'

type P = { projectId: string; calcId: string }

/** A new draft calc with this calc's working inputs (no revisions); number and title optional. */
export const POST = apiRoute<P>(async ({ req, caller, params }) => {
  const body = req.headers.get('content-length') === '0' ? {} : await readJson(req, cloneCalcSchema.omit({ calcId: true }).strict())
  const calc = await cloneCalc(caller, params.projectId, params.calcId, body)
  return created(await getCalcDetail(caller, params.projectId, calc.id))
})
