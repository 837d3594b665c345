import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi'
import { z } from 'zod'
import {
  auditOut,
  calcOut,
  compareOut,
  noticeOut,
  tickBody,
  tickOut,
  verificationOut,
  verifyBody,
  createRevisionBody,
  errorBody,
  inputsSavedOut,
  items,
  memberOut,
  projectOut,
  registerRowOut,
  remarkBody,
  remarkOut,
  replyBody,
  revisionOut,
  revisionRowOut,
  transitionBody,
} from '@/lib/schemas/api'
import { cloneCalcSchema, createCalcSchema, importCalcSchema } from '@/lib/schemas/project'
import { sizingInputSchema } from '@/lib/sizing/schema'

const json = (schema: z.ZodType, description: string) => ({ description, content: { 'application/json': { schema } } })

const ERRORS = {
  400: 'The body is not valid JSON',
  401: 'No session and no valid bearer token',
  403: 'Your role in this project does not allow this',
  404: 'No such project, calc or revision visible to you',
  409: 'The revision is not in a state that allows this',
  413: 'The body is too large',
  415: 'The body is not application/json',
  422: 'A field is invalid; `fields` names it by dotted path',
  429: 'Too many requests',
} as const

type Method = RouteConfig['method']
interface Op {
  method: Method
  path: string
  summary: string
  body?: z.ZodType
  ok: { status: 200 | 201; schema?: z.ZodType; description: string; pdf?: boolean }
  errors: (keyof typeof ERRORS)[]
  query?: z.ZodObject
  open?: boolean
}

const project = z.object({ projectId: z.string() })
const calc = project.extend({ calcId: z.string() })
const revision = calc.extend({ revisionId: z.string() })
const remark = revision.extend({ remarkId: z.string() })
const step = revision.extend({ stepId: z.string() })
const paramsFor = (path: string) =>
  path.includes('{remarkId}') ? remark : path.includes('{stepId}') ? step : path.includes('{revisionId}') ? revision : path.includes('{calcId}') ? calc : path.includes('{projectId}') ? project : undefined

const calcInput = z.record(z.string(), z.unknown()).describe('A calc input in the CLI’s format: `mechanism`, `geometry`, `loads`, … and optionally `basis`, `defaults`, `joints`, `links` (docs/engine.md, docs/checks.md)')
const createCalcBody = createCalcSchema.omit({ calcType: true }).extend({ mechanism: createCalcSchema.shape.calcType })

const base = '/api/v1/projects/{projectId}/calcs/{calcId}/revisions/{revisionId}'

// The bench's routes (clone, export, import, search, sizing) and the register's added columns.
const benchRegisterRow = registerRowOut.extend({
  verdict: z.enum(['pass', 'fail', 'infeasible']).nullable().describe('Verdict of the working inputs'),
  maxUtilisation: z.number().nullable().describe('Governing utilisation of the working inputs'),
  governing: z.string().nullable(),
  openRemarks: z.number().describe('Remarks not closed on the newest revision'),
})
const searchHitOut = z.object({
  calcId: z.string(),
  number: z.string(),
  title: z.string(),
  kind: z.enum(['number', 'title', 'mechanism', 'input', 'step', 'remark']),
  text: z.string(),
  stepId: z.string().optional(),
  revisionId: z.string().optional(),
})
const sizingOut = z.object({
  goal: z.string(),
  goalLabel: z.string(),
  request: z.record(z.string(), z.unknown()),
  proposals: z.array(
    z.object({
      mechanism: z.string(),
      label: z.string(),
      geometry: z.record(z.string(), z.number()),
      metrics: z.record(z.string(), z.unknown()),
      rank: z.number(),
      tradeoff: z.string(),
    }),
  ),
  tried: z.number(),
  feasible: z.number(),
  advice: z.string().optional(),
})

/** Every operation of API v1. A test checks that each route file under app/api/v1 appears here. */
export const OPERATIONS: Op[] = [
  { method: 'get', path: '/api/v1/projects', summary: 'Projects you belong to', ok: { status: 200, schema: items(projectOut), description: 'Projects' }, errors: [401] },
  { method: 'get', path: '/api/v1/projects/{projectId}/members', summary: 'Members of a project', ok: { status: 200, schema: items(memberOut), description: 'Members' }, errors: [401, 404] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs', summary: 'The calc register', ok: { status: 200, schema: items(benchRegisterRow), description: 'Calcs' }, errors: [401, 404] },
  { method: 'post', path: '/api/v1/projects/{projectId}/calcs', summary: 'Create a draft calc (defaults saved and run)', body: createCalcBody, ok: { status: 201, schema: calcOut, description: 'The new calc' }, errors: [400, 401, 403, 404, 409, 413, 415, 422] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs/{calcId}', summary: 'A calc, its working inputs, the working result’s summary and its revisions', ok: { status: 200, schema: calcOut, description: 'The calc' }, errors: [401, 404] },
  { method: 'put', path: '/api/v1/projects/{projectId}/calcs/{calcId}/inputs', summary: 'Replace the working inputs', body: calcInput, ok: { status: 200, schema: inputsSavedOut, description: 'Saved and run' }, errors: [400, 401, 403, 404, 413, 415, 422] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs/{calcId}/revisions', summary: 'Revisions of a calc, newest first', ok: { status: 200, schema: items(revisionRowOut), description: 'Revisions' }, errors: [401, 404] },
  { method: 'post', path: '/api/v1/projects/{projectId}/calcs/{calcId}/revisions', summary: 'Save the working inputs as a revision for check', body: createRevisionBody, ok: { status: 201, schema: revisionOut, description: 'The new revision' }, errors: [400, 401, 403, 404, 413, 415, 422] },
  { method: 'get', path: base, summary: 'A revision: inputs, result, state, signatures and hashes', ok: { status: 200, schema: revisionOut, description: 'The revision' }, errors: [401, 404] },
  { method: 'get', path: `${base}/pdf`, summary: 'The revision’s PDF package', query: z.object({ paper: z.enum(['A4', 'LETTER']).optional() }), ok: { status: 200, description: 'PDF', pdf: true }, errors: [401, 403, 404, 422] },
  { method: 'post', path: `${base}/transitions`, summary: 'Move the revision along the workflow', body: transitionBody, ok: { status: 200, schema: revisionOut, description: 'The revision after the transition' }, errors: [400, 401, 403, 404, 409, 413, 415, 422] },
  { method: 'get', path: `${base}/remarks`, summary: 'Remarks on a revision', ok: { status: 200, schema: items(remarkOut), description: 'Remarks' }, errors: [401, 404] },
  { method: 'post', path: `${base}/remarks`, summary: 'Add a remark on a step', body: remarkBody, ok: { status: 201, schema: remarkOut, description: 'The new remark' }, errors: [400, 401, 403, 404, 409, 413, 415, 422] },
  { method: 'post', path: `${base}/remarks/{remarkId}/replies`, summary: 'Reply to a remark', body: replyBody, ok: { status: 201, schema: remarkOut, description: 'The remark with the reply' }, errors: [400, 401, 403, 404, 409, 413, 415, 422] },
  { method: 'post', path: `${base}/remarks/{remarkId}/close`, summary: 'Close a remark', ok: { status: 200, schema: remarkOut, description: 'The closed remark' }, errors: [401, 403, 404] },
  { method: 'get', path: `${base}/ticks`, summary: 'Steps ticked as verified, by whom and when', ok: { status: 200, schema: items(tickOut), description: 'Ticks' }, errors: [401, 404] },
  { method: 'put', path: `${base}/ticks/{stepId}`, summary: 'Tick a step as verified (`{ ticked: false }` takes it back)', body: tickBody, ok: { status: 200, schema: items(tickOut), description: 'Every tick of the revision' }, errors: [400, 401, 403, 404, 409, 415, 422] },
  { method: 'delete', path: `${base}/ticks/{stepId}`, summary: 'Take a tick back', ok: { status: 200, schema: items(tickOut), description: 'Every tick of the revision' }, errors: [401, 403, 404, 409] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs/{calcId}/compare', summary: 'What changed between two revisions', query: z.object({ from: z.string(), to: z.string() }), ok: { status: 200, schema: compareOut, description: 'Changed inputs, results, verdicts and checks' }, errors: [401, 404, 422] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs/{calcId}/audit', summary: 'The calc’s audit trail (JSON, or CSV with Accept: text/csv or ?format=csv)', ok: { status: 200, schema: items(auditOut), description: 'Events, oldest first' }, errors: [401, 404] },
  { method: 'get', path: '/api/v1/projects/{projectId}/audit', summary: 'The project’s audit trail (JSON, or CSV with Accept: text/csv or ?format=csv)', ok: { status: 200, schema: items(auditOut), description: 'Events, oldest first' }, errors: [401, 404] },
  { method: 'get', path: '/api/v1/notices', summary: 'Your in-app notices, newest first', ok: { status: 200, schema: items(noticeOut), description: 'Notices' }, errors: [401] },
  { method: 'post', path: '/api/v1/verify', summary: 'Public: is this PDF (multipart field `file`) or code (`{ code }`) an issued package of this server?', body: verifyBody, ok: { status: 200, schema: verificationOut, description: 'The verdict' }, errors: [400, 413, 415, 422], open: true },
  { method: 'post', path: '/api/v1/analyse', summary: 'Run a calc without storing it: the CLI’s input in, the CLI’s output out', body: calcInput, ok: { status: 200, schema: z.record(z.string(), z.unknown()), description: 'The CLI’s output JSON' }, errors: [400, 401, 413, 415, 422] },
  { method: 'post', path: '/api/v1/projects/{projectId}/calcs/{calcId}/clone', summary: 'Clone a calc: a new draft with its working inputs, no revisions', body: cloneCalcSchema.omit({ calcId: true }), ok: { status: 201, schema: calcOut, description: 'The new calc' }, errors: [400, 401, 403, 404, 409, 413, 415, 422] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs/{calcId}/export', summary: 'The working inputs as a calc input file (the CLI’s JSON)', ok: { status: 200, schema: calcInput, description: 'The calc input file' }, errors: [401, 404] },
  { method: 'post', path: '/api/v1/projects/{projectId}/calcs/import', summary: 'A new draft calc from a calc input file; 422 names the file’s fields', body: importCalcSchema, ok: { status: 201, schema: calcOut, description: 'The new calc' }, errors: [400, 401, 403, 404, 409, 413, 415, 422] },
  { method: 'get', path: '/api/v1/projects/{projectId}/calcs/search', summary: 'Find calcs by number, title, input names, step titles and remarks', query: z.object({ q: z.string().describe('At least 2 characters, case-insensitive') }), ok: { status: 200, schema: items(searchHitOut), description: 'Hits, in calc number order' }, errors: [401, 404] },
  { method: 'post', path: '/api/v1/size', summary: 'Sizing assistant: ranked feasible Peaucellier and Hart proposals for a stroke, offset, envelope, transmission angle and load', body: sizingInputSchema, ok: { status: 200, schema: sizingOut, description: 'The proposals, best first' }, errors: [400, 401, 413, 415, 422] },
  { method: 'get', path: '/api/v1/openapi.json', summary: 'This document', ok: { status: 200, schema: z.record(z.string(), z.unknown()), description: 'OpenAPI 3.1' }, errors: [], open: true },
]

let cached: object | null = null

export function openApiDocument(): object {
  if (cached) return cached
  const registry = new OpenAPIRegistry()
  const bearer = registry.registerComponent('securitySchemes', 'bearerToken', { type: 'http', scheme: 'bearer', description: 'A personal API token (settings page, or `npm run token`)' })
  const cookie = registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'inverso_session' })
  for (const op of OPERATIONS) {
    const responses: RouteConfig['responses'] = {
      [op.ok.status]: op.ok.pdf ? { description: op.ok.description, content: { 'application/pdf': { schema: { type: 'string', format: 'binary' } } } } : json(op.ok.schema!, op.ok.description),
    }
    for (const code of op.errors) responses[code] = json(errorBody, ERRORS[code])
    registry.registerPath({
      method: op.method,
      path: op.path,
      summary: op.summary,
      security: op.open ? [] : [{ [bearer.name]: [] }, { [cookie.name]: [] }],
      request: {
        params: paramsFor(op.path),
        query: op.query,
        body: op.body ? { required: op.body !== createRevisionBody && op.body !== tickBody, content: op.path.endsWith('/verify') ? { 'application/json': { schema: op.body }, 'multipart/form-data': { schema: z.object({ file: z.string().describe('The PDF (binary)') }) } } : { 'application/json': { schema: op.body } } } : undefined,
      },
      responses,
    })
  }
  cached = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Inverso API',
      version: '1.0.0',
      description: 'Calc packages for exact straight-line linkages. Stable for scripting: paths and keys only grow. Errors: `{ error: { code, message, fields? } }`.',
    },
  })
  return cached
}
