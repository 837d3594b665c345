import { apiRoute, parseWith, readRawJson } from '@/app/_lib/api'
import { sizeMechanism, sizingInputSchema } from '@/lib/sizing'
import { requireCaller } from '@/server/access'

/** The sizing assistant (`npm run size`): requirements in, ranked feasible proposals out. Nothing is stored. */
export const POST = apiRoute(async ({ req, caller }) => {
  requireCaller(caller)
  return sizeMechanism(parseWith(sizingInputSchema, await readRawJson(req)))
})
