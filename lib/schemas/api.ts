import { z } from 'zod'
import { PROJECT_ROLES } from '@/lib/review/roles'
import { REVISION_STATES, TRANSITION_ACTIONS } from '@/lib/review/workflow'

/*
 * Bodies and answers of the REST API v1 (app/api/v1). Request schemas are the ones the route
 * handlers validate with; answer schemas type the handlers' output. The OpenAPI document
 * (server/openapi.ts) is generated from both, so it cannot drift from the code.
 */

export const errorBody = z.object({
  error: z.object({
    code: z.string().describe('bad_request, unauthenticated, forbidden, not_found, invalid, conflict, too_large, unsupported_media_type, rate_limited'),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional().describe('Field path (e.g. geometry.arm) → message'),
  }),
})

export const projectOut = z.object({
  id: z.string(),
  code: z.string(),
  name: z.string(),
  client: z.string(),
  role: z.enum(PROJECT_ROLES).nullable().describe('The caller’s role; null for a site admin who is not a member'),
  calcCount: z.number().int(),
})

export const memberOut = z.object({ id: z.string(), name: z.string(), email: z.string(), role: z.enum(PROJECT_ROLES), active: z.boolean() })

export const registerRowOut = z.object({
  id: z.string(),
  number: z.string(),
  title: z.string(),
  mechanism: z.string(),
  state: z.enum(REVISION_STATES),
  currentRevision: z.string().nullable(),
  engineer: z.string().nullable(),
  checker: z.string().nullable(),
  approver: z.string().nullable(),
  updatedAt: z.string(),
})

export const summaryOut = z.object({
  feasible: z.boolean(),
  feasibility: z.string(),
  pass: z.boolean(),
  maxUtilisation: z.number(),
  governing: z.string(),
  inversionConstant: z.number().describe('k = |OP|·|OT|, mm²'),
  lineOffset: z.number().describe('mm'),
  usableStroke: z.number().describe('mm'),
  straightness: z.number().describe('mm'),
  checks: z.number().int(),
  steps: z.number().int(),
})

export const revisionRowOut = z.object({
  id: z.string(),
  label: z.string(),
  state: z.enum(REVISION_STATES),
  createdAt: z.string(),
  contentHash: z.string().nullable(),
  pdfHash: z.string().nullable(),
})

export const calcOut = z.object({
  id: z.string(),
  number: z.string(),
  title: z.string(),
  mechanism: z.string(),
  state: z.enum(REVISION_STATES),
  updatedAt: z.string(),
  inputs: z.unknown().describe('The working inputs, in the CLI’s input format'),
  summary: summaryOut.nullable(),
  revisions: z.array(revisionRowOut),
})

export const signatureOut = z.object({ name: z.string().nullable(), at: z.string().nullable() })

export const revisionOut = revisionRowOut.extend({
  calcId: z.string(),
  inputs: z.unknown(),
  result: z.unknown().describe('The full result: steps, tables, checks, verdict'),
  engineVersion: z.string(),
  templateVersion: z.string().nullable(),
  frozenAt: z.string().nullable(),
  signatures: z.object({ engineer: signatureOut, checker: signatureOut, approver: signatureOut, issuedAt: z.string().nullable() }),
})

export const remarkOut = z.object({
  id: z.string(),
  stepId: z.string(),
  text: z.string(),
  status: z.enum(['open', 'answered', 'closed']),
  response: z.string().nullable(),
  author: z.string(),
  createdAt: z.string(),
})

export const inputsSavedOut = z.object({ summary: summaryOut })

export const createRevisionBody = z
  .object({
    reason: z.string().trim().max(500).optional(),
    checkerId: z.string().optional(),
    approverId: z.string().optional(),
  })
  .strict()

export const transitionBody = z
  .object({
    action: z.enum(TRANSITION_ACTIONS, { error: `must be one of ${TRANSITION_ACTIONS.join(', ')}` }),
    password: z.string().max(200).optional(),
    reason: z.string().trim().max(500).optional(),
  })
  .strict()

export const remarkBody = z
  .object({
    stepId: z.string().min(1, 'name the step the remark is about'),
    text: z.string().trim().min(3, 'write the remark (at least 3 characters)').max(4000),
  })
  .strict()

export const replyBody = z.object({ text: z.string().trim().min(2, 'write the reply').max(4000) }).strict()

export const idOut = z.object({ id: z.string() })

export function items<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item) })
}
