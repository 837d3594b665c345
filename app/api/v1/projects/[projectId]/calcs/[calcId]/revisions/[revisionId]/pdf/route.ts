import { z } from 'zod'
import { apiRoute, parseWith } from '@/app/_lib/api'
import { rendererDeps } from '@/app/_lib/renderer'
import { revisionPdf } from '@/server/revisions'

const query = z.object({ paper: z.enum(['A4', 'LETTER'], { error: 'must be A4 or LETTER' }).default('A4') })

/** The revision's PDF: A4 is the stored, hashed record; US Letter is rendered from the same frozen revision. */
export const GET = apiRoute<{ projectId: string; calcId: string; revisionId: string }>(async ({ req, caller, params }) => {
  const { paper } = parseWith(query, Object.fromEntries(new URL(req.url).searchParams))
  const { bytes, filename } = await revisionPdf(caller, params.projectId, params.calcId, params.revisionId, paper, await rendererDeps())
  return new Response(Buffer.from(bytes), {
    headers: { 'Content-Type': 'application/pdf', 'Content-Disposition': `attachment; filename="${filename}"`, 'Cache-Control': 'private, no-store' },
  })
})
