import { apiRoute } from '@/app/_lib/api'
import { exportCalcInputs } from '@/server/calcs'

/** The working inputs as a file the CLI reads (`npm run calc -- LC-001.json`) and import takes back. */
export const GET = apiRoute<{ projectId: string; calcId: string }>(async ({ caller, params }) => {
  const { number, inputs } = await exportCalcInputs(caller, params.projectId, params.calcId)
  return new Response(`${JSON.stringify(inputs, null, 2)}\n`, {
    headers: {
      'Content-Type': 'application/json; charset=utf-8',
      'Content-Disposition': `attachment; filename="${number.replace(/[^A-Za-z0-9._-]/g, '_')}.json"`,
      'Cache-Control': 'private, no-store',
    },
  })
})
