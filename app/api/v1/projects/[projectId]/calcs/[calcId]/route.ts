import { apiRoute } from '@/app/_lib/api'
import { getCalcDetail } from '@/server/calcs'

/** The calc, its working inputs, the working result's summary and its revisions. */
export const GET = apiRoute<{ projectId: string; calcId: string }>(async ({ caller, params }) => getCalcDetail(caller, params.projectId, params.calcId))
