import 'server-only'
import type { z } from 'zod'
import { AppError, HTTP_STATUS } from '@/lib/errors'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import type { Caller } from '@/server/access'
import { callerForApiToken } from '@/server/auth/api-tokens'
import { getCurrentUser } from './session'

/** Largest JSON body a route reads (a calc input with many load cases is far smaller). */
export const MAX_JSON_BYTES = 1024 * 1024

/** The one error shape of the API: `{ error: { code, message, fields? } }`. */
export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const body = { error: { code: err.code, message: err.message, ...(err.fieldErrors ? { fields: err.fieldErrors } : {}) } }
    return Response.json(body, { status: HTTP_STATUS[err.code], headers: { 'Cache-Control': 'private, no-store' } })
  }
  console.error('[api]', err)
  return Response.json({ error: { code: 'server_error', message: 'Internal error; nothing more is known. Tell an administrator.' } }, { status: 500, headers: { 'Cache-Control': 'private, no-store' } })
}

/** `Authorization: Bearer <token>` (a personal API token), else the session cookie. */
export async function callerOf(req: Request): Promise<Caller | null> {
  const auth = req.headers.get('authorization')
  if (auth) {
    const [scheme, token] = auth.split(/\s+/, 2)
    if (scheme?.toLowerCase() !== 'bearer' || !token) throw new AppError('unauthenticated', 'Use "Authorization: Bearer <token>".')
    const caller = await callerForApiToken(token)
    if (!caller) throw new AppError('unauthenticated', 'The token is unknown or has been revoked.')
    return caller
  }
  return getCurrentUser()
}

/** Reads and validates a JSON body: 415 for another type, 413 when too large, 400 when not JSON, 422 with field paths. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  return parseWith(schema, await readRawJson(req))
}

export async function readRawJson(req: Request): Promise<unknown> {
  const type = req.headers.get('content-type') ?? ''
  if (!/^application\/json\b/i.test(type)) throw new AppError('unsupported_media_type', 'Send the body as application/json.')
  const length = Number(req.headers.get('content-length') ?? 0)
  if (length > MAX_JSON_BYTES) throw new AppError('too_large', `The body is larger than ${MAX_JSON_BYTES / 1024} kB.`)
  const text = await req.text()
  if (Buffer.byteLength(text) > MAX_JSON_BYTES) throw new AppError('too_large', `The body is larger than ${MAX_JSON_BYTES / 1024} kB.`)
  try {
    return JSON.parse(text) as unknown
  } catch {
    throw new AppError('bad_request', 'The body is not valid JSON.')
  }
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const parsed = schema.safeParse(value)
  if (!parsed.success) throw new AppError('invalid', 'Check the fields named in `fields`.', fieldErrorsOf(parsed.error))
  return parsed.data
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

/**
 * A state-changing request that names another origin is refused (403): a page elsewhere can make
 * a browser send a form or a `text/plain` POST with the user's cookie, and only the Origin header
 * tells. Requests without Origin (curl, the CLI, server-to-server with a bearer token) pass; their
 * body must still be JSON (415 otherwise, in `readRawJson`).
 */
export function assertSameOrigin(req: Request): void {
  if (!STATE_CHANGING.has(req.method.toUpperCase())) return
  const origin = req.headers.get('origin')
  if (origin === null) return
  const allowed = new Set<string>()
  if (process.env.APP_URL) allowed.add(new URL(process.env.APP_URL).origin)
  else {
    const url = new URL(req.url)
    allowed.add(url.origin)
    const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host')
    if (host) allowed.add(`${req.headers.get('x-forwarded-proto') ?? url.protocol.replace(':', '')}://${host}`)
  }
  if (!allowed.has(origin)) throw new AppError('forbidden', 'Requests from another site are refused.')
}

type Handler<P> = (ctx: { req: Request; caller: Caller | null; params: P }) => Promise<Response | object>

/**
 * Wraps a v1 route handler: resolves the caller, runs the handler (which calls a service), turns a
 * returned object into JSON (201 when `created` is set by `created()`), and maps every error once.
 */
export function apiRoute<P>(handler: Handler<P>) {
  return async (req: Request, ctx: { params: Promise<P> }): Promise<Response> => {
    try {
      assertSameOrigin(req)
      const caller = await callerOf(req)
      const out = await handler({ req, caller, params: await ctx.params })
      if (out instanceof Response) return out
      return Response.json(out, { headers: { 'Cache-Control': 'private, no-store' } })
    } catch (err) {
      return errorResponse(err)
    }
  }
}

/** A created resource: 201 with its JSON. */
export function created(body: object): Response {
  return Response.json(body, { status: 201, headers: { 'Cache-Control': 'private, no-store' } })
}
