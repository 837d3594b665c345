import { z } from 'zod'
import { stripControl } from './clean-text'
import { PROJECT_ROLES } from '@/lib/review/roles'
import { REMARK_SEVERITIES, REVISION_STATES, TRANSITION_ACTIONS } from '@/lib/review/workflow'

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

export const replyOut = z.object({ id: z.string(), text: z.string(), author: z.string(), createdAt: z.string() })

export const remarkOut = z.object({
  id: z.string(),
  stepId: z.string().nullable().describe('The step, table or figure id; null for the whole calc'),
  severity: z.enum(REMARK_SEVERITIES),
  text: z.string(),
  status: z.enum(['open', 'answered', 'closed']),
  author: z.string(),
  createdAt: z.string(),
  closedAt: z.string().nullable(),
  carriedFromId: z.string().nullable().describe('The remark on an earlier revision this one continues'),
  replies: z.array(replyOut),
})

export const inputsSavedOut = z.object({ summary: summaryOut })

export const createRevisionBody = z
  .object({
    reason: z.string().trim().max(500).transform((v) => stripControl(v)).optional(),
    checkerId: z.string().optional(),
    approverId: z.string().optional(),
    confirmFailing: z.boolean().optional().describe('Submit although a check fails (recorded on the revision)'),
  })
  .strict()

export const transitionBody = z
  .object({
    action: z.enum(TRANSITION_ACTIONS, { error: `must be one of ${TRANSITION_ACTIONS.join(', ')}` }),
    password: z.string().max(200).optional().describe('Needed by check, approve, issue and void'),
    reason: z.string().trim().max(500).transform((v) => stripControl(v)).optional().describe('Needed by return, withdraw and void'),
    confirmMaterials: z.literal(true).optional().describe('issue: the approver confirms every "from memory" material value the revision uses'),
  })
  .strict()

export const remarkBody = z
  .object({
    stepId: z.string().min(1).max(200).nullish().describe('A step, table or figure id; leave out for the whole calc'),
    severity: z.enum(REMARK_SEVERITIES, { error: `must be one of ${REMARK_SEVERITIES.join(', ')}` }),
    text: z.string().trim().min(3, 'write the remark (at least 3 characters)').max(4000).transform((v) => stripControl(v, { multiline: true })),
  })
  .strict()

export const replyBody = z.object({ text: z.string().trim().min(2, 'write the reply').max(4000).transform((v) => stripControl(v, { multiline: true })) }).strict()

export const idOut = z.object({ id: z.string() })

export function items<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item) })
}

export const tickBody = z.object({ ticked: z.boolean().default(true) }).strict()

export const verifyBody = z.object({ code: z.string().trim().min(1, 'type the code printed on the package').max(40) }).strict()

export const verificationOut = z.object({
  issued: z.boolean(),
  signatureValid: z.boolean(),
  superseded: z.boolean(),
  voided: z.boolean(),
  project: z.string().nullable(),
  calc: z.string().nullable(),
  revision: z.string().nullable(),
  issuedAt: z.string().nullable(),
  message: z.string(),
})

export const tickOut = z.object({ stepId: z.string(), by: z.string(), at: z.string() })

export const noticeOut = z.object({ id: z.string(), kind: z.string(), text: z.string(), link: z.string(), createdAt: z.string(), read: z.boolean() })

export const auditOut = z.object({ at: z.string(), who: z.string(), action: z.string(), what: z.string(), calc: z.string().nullable(), detail: z.record(z.string(), z.unknown()) })

const valueChange = z.object({ id: z.string(), title: z.string(), unit: z.string(), from: z.number().nullable(), to: z.number().nullable(), change: z.number().nullable(), percent: z.number().nullable() })

export const compareOut = z.object({
  from: z.object({ id: z.string(), label: z.string() }),
  to: z.object({ id: z.string(), label: z.string() }),
  inputs: z.array(z.object({ path: z.string(), from: z.unknown(), to: z.unknown() })),
  /** The same changes as the package's inputs table prints them: group · label, unit. */
  inputRows: z.array(z.object({ input: z.string(), unit: z.string(), from: z.union([z.number(), z.string()]).nullable(), to: z.union([z.number(), z.string()]).nullable() })),
  verdict: z.object({ from: z.unknown(), to: z.unknown(), changed: z.boolean() }),
  values: z.array(valueChange),
  checks: z.array(valueChange.extend({ fromPass: z.boolean().nullable(), toPass: z.boolean().nullable() })),
})
