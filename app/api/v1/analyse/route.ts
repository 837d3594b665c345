import { apiRoute, readRawJson } from '@/app/_lib/api'
import { analyse } from '@/lib/analyse'
import { AppError } from '@/lib/errors'
import { requireCaller } from '@/server/access'

/** Stateless: the CLI's input in, exactly the CLI's output JSON out. Nothing is stored. */
export const POST = apiRoute(async ({ req, caller }) => {
  requireCaller(caller)
  const out = analyse(await readRawJson(req))
  if (!out.ok) throw new AppError('invalid', 'The input has errors.', out.fieldErrors)
  return out.output
})
