import { apiRoute, readRawJson } from '@/app/_lib/api'
import { AppError } from '@/lib/errors'
import { saveInputs } from '@/server/calcs'

/** Replaces the working inputs (the CLI's input format): 200 with the result summary, or 422 with field paths. */
export const PUT = apiRoute<{ projectId: string; calcId: string }>(async ({ req, caller, params }) => {
  const body = await readRawJson(req)
  const outcome = await saveInputs(caller, params.projectId, params.calcId, body)
  if (!outcome.ok) throw new AppError('invalid', 'The inputs have errors; nothing was saved.', outcome.fieldErrors)
  return { summary: outcome.summary }
})
