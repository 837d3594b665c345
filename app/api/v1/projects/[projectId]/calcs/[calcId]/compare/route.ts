import { z } from 'zod'
import { apiRoute, parseWith } from '@/app/_lib/api'
import { compareRevisions } from '@/server/compare'

const query = z.object({ from: z.string({ error: 'name the revision id to compare from' }).min(1), to: z.string({ error: 'name the revision id to compare to' }).min(1) })

/** What changed between two revisions: inputs, results (absolute and %), verdicts and governing checks. */
export const GET = apiRoute<{ projectId: string; calcId: string }>(async ({ req, caller, params }) => {
  const { from, to } = parseWith(query, Object.fromEntries(new URL(req.url).searchParams))
  return compareRevisions(caller, params.projectId, params.calcId, from, to)
})
