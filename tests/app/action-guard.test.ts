import { describe, expect, it, vi } from 'vitest'
import { z } from 'zod'
import { AppError } from '@/lib/errors'
import type { Caller } from '@/server/access'

// The session is the I/O boundary of the guard.
let user: Caller | null = null
vi.mock('server-only', () => ({}))
vi.mock('@/app/_lib/session', async () => {
  const { AppError } = await import('@/lib/errors')
  return {
    requireUser: async () => {
      if (!user) throw new AppError('unauthenticated', 'Sign in first.')
      return user
    },
  }
})
const { dataAction, formAction } = await import('@/app/_lib/action')

const ines: Caller = { id: 'u1', email: 'ines@example.test', name: 'Ines', isAdmin: false }
const form = (fields: Record<string, string>) => {
  const fd = new FormData()
  for (const [k, v] of Object.entries(fields)) fd.set(k, v)
  return fd
}
const schema = z.object({ title: z.string().min(3, 'Give a title of at least 3 characters.') })

describe('formAction', () => {
  it('refuses an anonymous caller without running the work, and keeps what was typed', async () => {
    user = null
    const work = vi.fn()
    const out = await formAction(schema, work)({}, form({ title: 'Guide', projectId: 'p1' }))
    expect(work).not.toHaveBeenCalled()
    expect(out).toMatchObject({ message: 'Sign in first.', values: { title: 'Guide', projectId: 'p1' } })
  })

  it('reports a bad field beside it and keeps what was typed', async () => {
    user = ines
    const work = vi.fn()
    const out = await formAction(schema, work)({}, form({ title: 'x' }))
    expect(work).not.toHaveBeenCalled()
    expect(out.fieldErrors).toEqual({ title: 'Give a title of at least 3 characters.' })
    expect(out.values).toEqual({ title: 'x' })
  })

  it('passes the caller and the form’s project to the work', async () => {
    user = ines
    const work = vi.fn(async () => ({ ok: true, message: 'done' }))
    const out = await formAction(schema, work)({}, form({ title: 'Guide', projectId: 'p1' }))
    expect(out).toEqual({ ok: true, message: 'done' })
    expect(work).toHaveBeenCalledWith({ title: 'Guide' }, expect.objectContaining({ caller: ines, projectId: 'p1' }))
  })

  it('turns a typed error into its message and field errors', async () => {
    user = ines
    const out = await formAction(schema, async () => {
      throw new AppError('conflict', 'Number taken.', { number: 'Calc LC-001 already exists.' })
    })({}, form({ title: 'Guide' }))
    expect(out).toMatchObject({ message: 'Number taken.', fieldErrors: { number: 'Calc LC-001 already exists.' } })
  })

  it('logs an unexpected error and does not claim that nothing changed', async () => {
    user = ines
    const log = vi.spyOn(console, 'error').mockImplementation(() => {})
    const out = await formAction(schema, async () => {
      throw new Error('disk full')
    })({}, form({ title: 'Guide' }))
    expect(log).toHaveBeenCalled()
    expect(out.message).toMatch(/Reload the page to see what was saved/)
    expect(out.message).not.toMatch(/nothing was changed/)
    log.mockRestore()
  })
})

describe('dataAction', () => {
  it('runs the work with the caller and its arguments; refuses nobody', async () => {
    user = ines
    const work = vi.fn(async (_c: Caller, a: string, b: number) => ({ ok: true, message: `${a}${b}` }))
    expect(await dataAction(work)('x', 1)).toEqual({ ok: true, message: 'x1' })
    expect(work).toHaveBeenCalledWith(ines, 'x', 1)
    user = null
    expect(await dataAction(work)('x', 1)).toMatchObject({ message: 'Sign in first.' })
  })
})
