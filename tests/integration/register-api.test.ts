import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { db } from '@/db'
import { calcs, projects, users } from '@/db/schema'
import { seedDemo } from '@/server/demo/seed'
import { DEMO_USERS } from '@/server/demo/demo-data'
import type { SessionUser } from '@/server/auth/lucia'
import { useTempEnvironment } from '../helpers/temp-env'

// The session cookie is the I/O boundary: the route handler asks it who is calling.
let caller: SessionUser | null = null
vi.mock('@/app/_lib/session', async () => {
  const { AppError } = await import('@/lib/errors')
  return {
    requireUser: async () => {
      if (!caller) throw new AppError('unauthenticated', 'Sign in first.')
      return caller
    },
  }
})
vi.mock('server-only', () => ({}))

const { GET, POST } = await import('@/app/api/projects/[projectId]/calcs/route')

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let projectId = ''
beforeAll(async () => {
  env = await useTempEnvironment()
  await seedDemo(db)
  projectId = (await db.select().from(projects))[0].id
})
afterAll(() => env.close())

async function as(key: (typeof DEMO_USERS)[number]['key']) {
  const email = DEMO_USERS.find((u) => u.key === key)!.email
  const [u] = await db.select().from(users).where(eq(users.email, email))
  caller = { id: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin }
}
const params = () => ({ params: Promise.resolve({ projectId }) })
const post = (body: unknown) => POST(new Request('http://x/api', { method: 'POST', body: JSON.stringify(body) }), params())
const count = async () => (await db.select().from(calcs).where(eq(calcs.projectId, projectId))).length

describe('calc register route', () => {
  it('refuses an anonymous caller with 401', async () => {
    caller = null
    expect((await GET(new Request('http://x'), params())).status).toBe(401)
  })

  it('lists the register for a member', async () => {
    await as('checker')
    const res = await GET(new Request('http://x'), params())
    expect(res.status).toBe(200)
    const body = (await res.json()) as { calcs: { number: string; engineer: string }[] }
    expect(body.calcs.map((c) => c.number)).toEqual(['LC-001', 'LC-002', 'LC-003'])
    expect(body.calcs[0].engineer).toBe('Ines Vogt')
  })

  it('refuses a checker creating a calc with 403 and changes nothing', async () => {
    await as('checker')
    const before = await count()
    const res = await post({ number: 'LC-900', title: 'Not allowed', calcType: 'peaucellier' })
    expect(res.status).toBe(403)
    expect(await count()).toBe(before)
  })

  it('lets the engineer create a draft, and refuses a duplicate number at the number field', async () => {
    await as('engineer')
    const created = await post({ number: 'LC-004', title: 'Lid-closer guide', calcType: 'hart' })
    expect(created.status).toBe(201)
    const dup = await post({ number: 'LC-004', title: 'Again', calcType: 'hart' })
    expect(dup.status).toBe(409)
    expect(((await dup.json()) as { fieldErrors: Record<string, string> }).fieldErrors.number).toMatch(/already exists/)
    const [row] = await db.select().from(calcs).where(eq(calcs.number, 'LC-004'))
    expect(row.title).toBe('Lid-closer guide')
    expect(row.state).toBe('draft')
  })

  it('rejects invalid input with 422 naming the field', async () => {
    await as('engineer')
    const res = await post({ number: '', title: 'x', calcType: 'crank-slider' })
    expect(res.status).toBe(422)
    const { fieldErrors } = (await res.json()) as { fieldErrors: Record<string, string> }
    expect(Object.keys(fieldErrors).sort()).toEqual(['calcType', 'number', 'title'])
  })

  it('answers 404 for a project that does not exist, even to an admin', async () => {
    await as('admin')
    const res = await GET(new Request('http://x'), { params: Promise.resolve({ projectId: 'no-such-project' }) })
    expect(res.status).toBe(404)
  })
})
