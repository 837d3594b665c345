import { readdirSync, statSync } from 'node:fs'
import path from 'node:path'
import { validate } from '@readme/openapi-parser'
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { db } from '@/db'
import { calcs, projects } from '@/db/schema'
import { analyse } from '@/lib/analyse'
import type { Caller } from '@/server/access'
import { createApiToken, revokeApiToken } from '@/server/auth/api-tokens'
import { DEMO_CALCS } from '@/server/demo/demo-data'
import { OPERATIONS, openApiDocument } from '@/server/openapi'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

// The session cookie is the I/O boundary: without a bearer token the route asks it who is calling.
let sessionUser: Caller | null = null
vi.mock('@/app/_lib/session', () => ({ getCurrentUser: async () => sessionUser }))
vi.mock('server-only', () => ({}))

const calcsRoute = await import('@/app/api/v1/projects/[projectId]/calcs/route')
const calcRoute = await import('@/app/api/v1/projects/[projectId]/calcs/[calcId]/route')
const inputsRoute = await import('@/app/api/v1/projects/[projectId]/calcs/[calcId]/inputs/route')
const projectsRoute = await import('@/app/api/v1/projects/route')
const membersRoute = await import('@/app/api/v1/projects/[projectId]/members/route')
const analyseRoute = await import('@/app/api/v1/analyse/route')

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let people: Record<DemoRole, Caller>
let projectId = ''
let otherProjectId = ''
beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people, projectId } = await seededDemo())
  otherProjectId = 'p-other'
  await db.insert(projects).values({ id: otherProjectId, code: 'XX-01', name: 'Someone else’s project' })
}, 60_000)
afterAll(() => env.close())

type Init = { token?: string; body?: unknown; raw?: string; type?: string; method?: string }
function req(init: Init = {}) {
  const headers: Record<string, string> = {}
  if (init.token) headers.authorization = `Bearer ${init.token}`
  const body = init.raw ?? (init.body === undefined ? undefined : JSON.stringify(init.body))
  if (body !== undefined) headers['content-type'] = init.type ?? 'application/json'
  return new Request('http://localhost/api/v1/x', { method: init.method ?? (body === undefined ? 'GET' : 'POST'), headers, body })
}
const p = <T,>(v: T) => ({ params: Promise.resolve(v) })

describe('authentication', () => {
  it('answers 401 with the one error shape to an anonymous caller', async () => {
    sessionUser = null
    const res = await projectsRoute.GET(req(), p({}))
    expect(res.status).toBe(401)
    expect(await res.json()).toMatchObject({ error: { code: 'unauthenticated', message: expect.any(String) } })
  })

  it('accepts the session cookie', async () => {
    sessionUser = people.checker
    const res = await projectsRoute.GET(req(), p({}))
    expect(res.status).toBe(200)
    expect((await res.json()).items.map((x: { code: string }) => x.code)).toEqual(['FM-CE40'])
  })

  it('accepts a valid bearer token, with no more rights than its owner; refuses it once revoked', async () => {
    sessionUser = null
    const t = await createApiToken(people.checker, 'test script')
    const list = await calcsRoute.GET(req({ token: t.token }), p({ projectId }))
    expect(list.status).toBe(200)
    expect((await list.json()).items.map((c: { number: string }) => c.number)).toEqual(['LC-001', 'LC-002', 'LC-003'])
    // A checker's token cannot create a calc: the same 403 as the checker gets in the app.
    const denied = await calcsRoute.POST(req({ token: t.token, body: { number: 'LC-666', title: 'Sneaky', mechanism: 'hart' } }), p({ projectId }))
    expect(denied.status).toBe(403)
    await revokeApiToken(people.checker, t.id)
    expect((await calcsRoute.GET(req({ token: t.token }), p({ projectId }))).status).toBe(401)
  })

  it('a token of a member of another project sees a 404 for a project that is not theirs (existing or not)', async () => {
    const t = await createApiToken(people.engineer, 'foreign')
    expect((await calcsRoute.GET(req({ token: t.token }), p({ projectId: otherProjectId }))).status).toBe(404)
    expect((await calcsRoute.GET(req({ token: t.token }), p({ projectId: 'no-such-project' }))).status).toBe(404)
    expect((await calcsRoute.GET(req({ token: 'inv_made-up' }), p({ projectId }))).status).toBe(401)
  })
})

describe('calcs', () => {
  it('creates a calc (201, with its id and saved defaults), refuses a duplicate number regardless of case (409)', async () => {
    sessionUser = people.engineer
    const res = await calcsRoute.POST(req({ body: { number: 'LC-004', title: 'Lid-closer guide', mechanism: 'hart' } }), p({ projectId }))
    expect(res.status).toBe(201)
    const body = await res.json()
    expect(body).toMatchObject({ id: expect.any(String), number: 'LC-004', mechanism: 'hart', state: 'draft', summary: { feasible: true } })
    const dup = await calcsRoute.POST(req({ body: { number: 'lc-004', title: 'Again', mechanism: 'hart' } }), p({ projectId }))
    expect(dup.status).toBe(409)
    expect((await dup.json()).error.fields.number).toMatch(/LC-004 already exists/)
  })

  it('names every bad field (422), refuses another content type (415), bad JSON (400) and a huge body (413)', async () => {
    sessionUser = people.engineer
    const bad = await calcsRoute.POST(req({ body: { number: '', title: 'x', mechanism: 'crank-slider' } }), p({ projectId }))
    expect(bad.status).toBe(422)
    expect(Object.keys((await bad.json()).error.fields).sort()).toEqual(['mechanism', 'number', 'title'])
    expect((await calcsRoute.POST(req({ raw: 'number=1', type: 'text/plain' }), p({ projectId }))).status).toBe(415)
    expect((await calcsRoute.POST(req({ raw: '{"number":' }), p({ projectId }))).status).toBe(400)
    expect((await calcsRoute.POST(req({ raw: JSON.stringify({ pad: 'x'.repeat(1_100_000) }) }), p({ projectId }))).status).toBe(413)
  })

  it('PUT inputs answers the summary, or 422 with field paths and nothing saved', async () => {
    sessionUser = people.engineer
    const [calc] = await db.select().from(calcs).where(eq(calcs.number, 'LC-003'))
    const ok = await inputsRoute.PUT(req({ method: 'PUT', body: DEMO_CALCS[2].inputs }), p({ projectId, calcId: calc.id }))
    expect(ok.status).toBe(200)
    expect((await ok.json()).summary).toMatchObject({ feasible: true, pass: expect.any(Boolean) })
    const bad = await inputsRoute.PUT(req({ method: 'PUT', body: { ...DEMO_CALCS[2].inputs, geometry: { arm: 200, side: -1, crank: 75 } } }), p({ projectId, calcId: calc.id }))
    expect(bad.status).toBe(422)
    expect((await bad.json()).error.fields).toHaveProperty(['geometry.side'])
    const detail = await (await calcRoute.GET(req(), p({ projectId, calcId: calc.id }))).json()
    expect(detail.inputs).toEqual(DEMO_CALCS[2].inputs)
  })

  it('lists members with id, name, e-mail and role', async () => {
    sessionUser = people.approver
    const body = await (await membersRoute.GET(req(), p({ projectId }))).json()
    expect(body.items).toContainEqual(expect.objectContaining({ name: 'Ines Vogt', role: 'engineer', email: 'ines.vogt@feldmark.example' }))
  })
})

describe('analyse', () => {
  it('gives exactly what the CLI prints for the same input', async () => {
    sessionUser = people.checker
    const res = await analyseRoute.POST(req({ body: DEMO_CALCS[0].inputs }), p({}))
    expect(res.status).toBe(200)
    const cli = analyse(DEMO_CALCS[0].inputs)
    expect(cli.ok).toBe(true)
    if (cli.ok) expect(await res.json()).toEqual(JSON.parse(JSON.stringify(cli.output)))
  })
})

/** Route files under app/api/v1 as OpenAPI paths: `[projectId]` → `{projectId}`, with the methods each exports. */
function routesOnDisk(dir = path.join(process.cwd(), 'app/api/v1'), prefix = '/api/v1'): { path: string; file: string }[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name)
    if (statSync(full).isDirectory()) return routesOnDisk(full, `${prefix}/${name.replace(/^\[(.+)\]$/, '{$1}')}`)
    return name === 'route.ts' ? [{ path: prefix, file: full }] : []
  })
}

describe('OpenAPI document', () => {
  it('is a valid OpenAPI 3.1 document (validated by @readme/openapi-parser)', async () => {
    const doc = structuredClone(openApiDocument()) as Parameters<typeof validate>[0]
    const result = await validate(doc)
    expect(result.valid, JSON.stringify(result)).toBe(true)
  })

  it('describes every route and method under app/api/v1', async () => {
    const doc = openApiDocument() as { paths: Record<string, Record<string, unknown>> }
    for (const route of routesOnDisk()) {
      const mod = (await import(/* @vite-ignore */ route.file)) as Record<string, unknown>
      for (const method of ['GET', 'POST', 'PUT', 'DELETE', 'PATCH'].filter((m) => typeof mod[m] === 'function')) {
        expect(doc.paths[route.path]?.[method.toLowerCase()], `${method} ${route.path}`).toBeDefined()
      }
    }
    expect(OPERATIONS.length).toBeGreaterThanOrEqual(routesOnDisk().length)
  })
})
