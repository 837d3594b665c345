/**
 * Issue 13, item 10 and the Origin finding: the proxy sets a nonce CSP and the other security
 * headers on every answer; API answers, errors and 500s included, are `private, no-store`; a
 * state-changing API request naming a foreign Origin is refused, and a non-JSON body is a 415.
 */
import { NextRequest } from 'next/server'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { AppError } from '@/lib/errors'

vi.mock('server-only', () => ({}))
vi.mock('@/app/_lib/session', () => ({ getCurrentUser: async () => null }))

const { proxy, config } = await import('@/proxy')
const { apiRoute, readRawJson } = await import('@/app/_lib/api')

const appUrl = process.env.APP_URL
afterEach(() => {
  process.env.APP_URL = appUrl
})

function directives(csp: string): Map<string, string> {
  return new Map(csp.split(';').map((d) => d.trim()).filter(Boolean).map((d) => [d.split(/\s+/)[0], d.slice(d.indexOf(' ') + 1)]))
}

describe('proxy.ts', () => {
  it('sets a fresh nonce CSP on the response and hands the nonce to Next in the request headers', () => {
    process.env.APP_URL = 'http://localhost:3000'
    const a = proxy(new NextRequest('http://localhost:3000/sign-in'))
    const b = proxy(new NextRequest('http://localhost:3000/sign-in'))
    const csp = a.headers.get('content-security-policy')!
    const d = directives(csp)
    const nonce = d.get('script-src')!.match(/'nonce-([^']+)'/)![1]
    expect(nonce.length).toBeGreaterThanOrEqual(16)
    expect(b.headers.get('content-security-policy')).not.toContain(nonce)
    expect(d.get('script-src')).toContain("'strict-dynamic'")
    expect(d.get('script-src')).not.toContain('unsafe-inline')
    expect(d.get('frame-ancestors')).toBe("'none'")
    expect(d.get('object-src')).toBe("'none'")
    expect(d.get('base-uri')).toBe("'self'")
    // Next reads the nonce from the request's CSP header: it is forwarded as x-middleware-request-*.
    expect(a.headers.get('x-middleware-request-x-nonce')).toBe(nonce)
    expect(a.headers.get('x-middleware-request-content-security-policy')).toBe(csp)
    expect(a.headers.get('x-content-type-options')).toBe('nosniff')
    expect(a.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin')
    expect(a.headers.get('x-frame-options')).toBe('DENY')
    expect(a.headers.get('strict-transport-security')).toBeNull()
  })

  it('adds HSTS only when APP_URL is https', () => {
    process.env.APP_URL = 'https://calcs.example.com'
    const res = proxy(new NextRequest('https://calcs.example.com/projects'))
    expect(res.headers.get('strict-transport-security')).toMatch(/max-age=\d{7,}/)
    expect(res.headers.get('content-security-policy')).toContain('upgrade-insecure-requests')
  })

  it('covers pages and the API, not the hashed build assets', () => {
    const re = new RegExp(`^${config.matcher[0]}$`)
    for (const p of ['/sign-in', '/projects/x/calcs/y', '/api/v1/projects', '/reset/abc']) expect(re.test(p), p).toBe(true)
    expect(re.test('/_next/static/chunks/app.js')).toBe(false)
  })
})

describe('apiRoute', () => {
  const ok = apiRoute(async () => ({ fine: true }))
  const boom = apiRoute(async () => {
    throw new Error('kaboom')
  })
  const refused = apiRoute(async () => {
    throw new AppError('invalid', 'no')
  })
  const ctx = { params: Promise.resolve({}) }
  const post = (headers: Record<string, string>) => new Request('http://localhost:3000/api/v1/x', { method: 'POST', headers, body: '{}' })

  it('refuses a state-changing request from a foreign Origin with 403, and lets same-origin and Origin-less ones through', async () => {
    process.env.APP_URL = 'http://localhost:3000'
    const foreign = await ok(post({ origin: 'https://evil.example', 'content-type': 'text/plain' }), ctx)
    expect(foreign.status).toBe(403)
    expect(await foreign.json()).toMatchObject({ error: { code: 'forbidden' } })
    expect((await ok(post({ origin: 'null' }), ctx)).status).toBe(403)
    // Authentication comes after the origin check; no origin or our own origin reaches it.
    expect((await ok(post({ origin: 'http://localhost:3000' }), ctx)).status).toBe(200)
    expect((await ok(post({}), ctx)).status).toBe(200)
    // A foreign-origin GET is harmless and not refused here (CORS keeps its answer from the other site).
    expect((await ok(new Request('http://localhost:3000/api/v1/x', { headers: { origin: 'https://evil.example' } }), ctx)).status).toBe(200)
  })

  it('a body that is not application/json is a 415', async () => {
    const err = await readRawJson(post({ 'content-type': 'text/plain' })).catch((e: AppError) => e)
    expect((err as AppError).code).toBe('unsupported_media_type')
  })

  it('answers, refusals and 500s are all private, no-store', async () => {
    vi.spyOn(console, 'error').mockImplementation(() => undefined)
    for (const [route, status] of [[ok, 200], [refused, 422], [boom, 500]] as const) {
      const res = await route(new Request('http://localhost:3000/api/v1/x'), ctx)
      expect(res.status).toBe(status)
      expect(res.headers.get('cache-control')).toBe('private, no-store')
    }
  })
})

describe('body size', () => {
  it('the proxy answers 413 to a body declared larger than the upload limit, before anything reads it', async () => {
    const { MAX_BODY_BYTES } = await import('@/proxy')
    const res = proxy(new NextRequest('http://localhost:3000/projects/p/calcs/c', { method: 'POST', headers: { 'content-length': String(50 * 1024 * 1024) } }))
    expect(res.status).toBe(413)
    expect(await res.text()).toMatch(/at most 10 MB/)
    const fine = proxy(new NextRequest('http://localhost:3000/projects/p/calcs/c', { method: 'POST', headers: { 'content-length': String(MAX_BODY_BYTES - 1) } }))
    expect(fine.status).toBe(200)
  })
})
