/**
 * Issue 13, item 7: sign-in tells nothing about which addresses have accounts, slows an attacker
 * per account and per source without locking the owner out, counts concurrent tries atomically,
 * and a new sign-in ends the session the browser had. Reset requests are limited and timed alike.
 */
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { authThrottle, users } from '@/db/schema'
import { lucia } from '@/server/auth/lucia'
import { RESET_MIN_MS, requestPasswordReset } from '@/server/auth/password-reset'
import { SIGN_IN_LIMITS, SIGN_IN_REFUSED, signIn } from '@/server/auth/sign-in'
import { clientAddress, normaliseAddress } from '@/server/auth/client-address'
import type { Caller } from '@/server/access'
import { AppError } from '@/lib/errors'
import { DEMO_PASSWORD } from '@/server/demo/demo-data'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let who: Record<DemoRole, Caller>
beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people: who } = await seededDemo())
})
afterAll(() => env.close())

const outcome = (p: Promise<unknown>) => p.then(() => 'ok', (e: unknown) => (e instanceof AppError ? e : Promise.reject(e)))
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]

async function timed(fn: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now()
  await fn().catch(() => undefined)
  return performance.now() - t0
}

describe('one answer for every refusal', () => {
  it('unknown address, account without a password and wrong password get the same message at the password field', async () => {
    await db.insert(users).values({ id: 'no-password-yet', email: 'pending@feldmark.example', name: 'Pending', passwordHash: null })
    const errors = [
      await outcome(signIn('nobody@feldmark.example', 'whatever-123', { source: '192.0.2.1' })),
      await outcome(signIn('pending@feldmark.example', 'whatever-123', { source: '192.0.2.1' })),
      await outcome(signIn(who.engineer.email, 'not-the-password', { source: '192.0.2.1' })),
    ] as AppError[]
    for (const e of errors) {
      expect(e.code).toBe('invalid')
      expect(e.message).toBe(SIGN_IN_REFUSED)
      expect(e.fieldErrors).toEqual({ password: SIGN_IN_REFUSED })
    }
  })

  it('an unknown address costs as much as a wrong password (one argon2 verification either way)', async () => {
    const unknown: number[] = []
    const known: number[] = []
    for (let i = 0; i < 4; i++) {
      unknown.push(await timed(() => signIn(`ghost${i}@feldmark.example`, 'x-wrong-password', { source: `192.0.2.${20 + i}` })))
      known.push(await timed(() => signIn(who.approver.email, 'x-wrong-password', { source: `192.0.2.${30 + i}` })))
    }
    const ratio = median(unknown) / median(known)
    // Before the fix an unknown address answered without hashing: about 100 times faster.
    expect(ratio).toBeGreaterThan(0.6)
    expect(ratio).toBeLessThan(1.6)
  })
})

describe('limits per account and per source, with back-off', () => {
  it('an attacker is slowed, and the owner still signs in from another source', async () => {
    const attacker = { source: '203.0.113.66' }
    const free = SIGN_IN_LIMITS.accountAndSource.free
    for (let i = 0; i < free; i++) expect(((await outcome(signIn(who.checker.email, `guess-${i}`, attacker))) as AppError).code).toBe('invalid')
    const slowed = (await outcome(signIn(who.checker.email, 'guess-next', attacker))) as AppError
    expect(slowed.code).toBe('rate_limited')
    expect(slowed.fieldErrors?.password).toMatch(/Try again in \d+ second/)
    // Even the right password waits out the back-off from the attacker's source…
    expect(((await outcome(signIn(who.checker.email, DEMO_PASSWORD, attacker))) as AppError).code).toBe('rate_limited')
    // …but the owner, elsewhere, is not locked out.
    const { session } = await signIn(who.checker.email, DEMO_PASSWORD, { source: '198.51.100.23' })
    expect(session.userId).toBe(who.checker.id)
  })

  it('the back-off grows exponentially and a wait lets the next try through', async () => {
    const src = { source: '203.0.113.77' }
    const key = `sign-in:account+source:${who.approver.email}|${src.source}`
    for (let i = 0; i < SIGN_IN_LIMITS.accountAndSource.free; i++) await outcome(signIn(who.approver.email, `g${i}`, src))
    expect(((await outcome(signIn(who.approver.email, 'g', src))) as AppError).code).toBe('rate_limited')
    // Pretend the last failure was 1.1 s ago: one more try is checked (and fails), then 2 s are needed.
    await db.update(authThrottle).set({ lastAt: new Date(Date.now() - 1100) }).where(eq(authThrottle.key, key))
    expect(((await outcome(signIn(who.approver.email, 'g', src))) as AppError).code).toBe('invalid')
    await db.update(authThrottle).set({ lastAt: new Date(Date.now() - 1100) }).where(eq(authThrottle.key, key))
    expect(((await outcome(signIn(who.approver.email, 'g', src))) as AppError).code).toBe('rate_limited')
    await db.update(authThrottle).set({ lastAt: new Date(Date.now() - 2100) }).where(eq(authThrottle.key, key))
    await signIn(who.approver.email, DEMO_PASSWORD, src)
  })

  it('one source trying many addresses is slowed', async () => {
    const src = { source: '203.0.113.88' }
    const results: (string | AppError)[] = []
    for (let i = 0; i < SIGN_IN_LIMITS.source.free + 2; i++) results.push(await outcome(signIn(`spray${i}@feldmark.example`, 'Summer2027!', src)))
    expect(results.slice(0, SIGN_IN_LIMITS.source.free).every((r) => (r as AppError).code === 'invalid')).toBe(true)
    expect((results.at(-1) as AppError).code).toBe('rate_limited')
  })

  it('concurrent tries are counted atomically: of 20 at once, exactly the free 5 are checked', async () => {
    const src = { source: '203.0.113.99' }
    const results = await Promise.all(Array.from({ length: 20 }, (_, i) => outcome(signIn(who.engineer.email, `burst-${i}`, src))))
    const codes = results.map((r) => (r as AppError).code)
    expect(codes.filter((c) => c === 'invalid')).toHaveLength(SIGN_IN_LIMITS.accountAndSource.free)
    expect(codes.filter((c) => c === 'rate_limited')).toHaveLength(20 - SIGN_IN_LIMITS.accountAndSource.free)
  })

  it('an attack spread over many sources slows strangers, but the owner’s own browser (device cookie) still gets in', async () => {
    const owner = await signIn(who.admin.email, DEMO_PASSWORD, { source: '198.51.100.50' })
    const deviceToken = owner.device!.value
    for (let i = 0; i < SIGN_IN_LIMITS.account.free; i++) await outcome(signIn(who.admin.email, `spread-${i}`, { source: `10.9.${i}.1` }))
    // A new source without the device cookie now waits…
    expect(((await outcome(signIn(who.admin.email, DEMO_PASSWORD, { source: '198.51.100.51' }))) as AppError).code).toBe('rate_limited')
    // …the owner's browser does not.
    const again = await signIn(who.admin.email, DEMO_PASSWORD, { source: '198.51.100.52', deviceToken })
    expect(again.session.userId).toBe(who.admin.id)
  })
})

describe('sessions', () => {
  it('a new sign-in ends the session the browser had', async () => {
    const first = await signIn(who.engineer.email, DEMO_PASSWORD, { source: '198.51.100.60' })
    const second = await signIn(who.engineer.email, DEMO_PASSWORD, { source: '198.51.100.60', previousSessionId: first.session.id })
    expect((await lucia.validateSession(first.session.id)).session).toBeNull()
    expect((await lucia.validateSession(second.session.id)).session).not.toBeNull()
  })
})

describe('password-reset requests', () => {
  it('take the same time whether or not an account uses the address', async () => {
    const known: number[] = []
    const unknown: number[] = []
    for (let i = 0; i < 3; i++) {
      known.push(await timed(() => requestPasswordReset(who.engineer.email, { source: `192.0.2.${100 + i}` })))
      unknown.push(await timed(() => requestPasswordReset(`nobody${i}@feldmark.example`, { source: `192.0.2.${110 + i}` })))
    }
    expect(Math.min(...known, ...unknown)).toBeGreaterThanOrEqual(RESET_MIN_MS - 5)
    expect(Math.abs(median(known) - median(unknown))).toBeLessThan(40)
  })

  it('are limited per address, the same for known and unknown addresses', async () => {
    for (const email of [who.approver.email, 'not-an-account@feldmark.example']) {
      const results: (string | AppError)[] = []
      for (let i = 0; i < 4; i++) results.push(await outcome(requestPasswordReset(email, { source: `192.0.2.${150 + i}` })))
      expect(results.slice(0, 3)).toEqual(['ok', 'ok', 'ok'])
      expect((results[3] as AppError).code).toBe('rate_limited')
      expect((results[3] as AppError).fieldErrors?.email).toMatch(/Too many reset requests/)
    }
  })

  it('are limited per source', async () => {
    const results: (string | AppError)[] = []
    for (let i = 0; i < 11; i++) results.push(await outcome(requestPasswordReset(`many${i}@feldmark.example`, { source: '192.0.2.200' })))
    expect(results.slice(0, 10).every((r) => r === 'ok')).toBe(true)
    expect((results[10] as AppError).code).toBe('rate_limited')
  })
})

describe('client address', () => {
  const h = (o: Record<string, string>) => new Headers(o)
  it('ignores X-Forwarded-For unless the app is told it is behind a proxy, then takes the proxy’s entry', () => {
    delete process.env.TRUST_PROXY
    delete process.env.TRUSTED_PROXY_HOPS
    // No stamp from the server hook in a unit test: falls back to what Next filled in.
    expect(clientAddress(h({ 'x-forwarded-for': '192.0.2.5' }))).toBe('192.0.2.5')
    process.env.TRUST_PROXY = 'true'
    expect(clientAddress(h({ 'x-forwarded-for': '6.6.6.6, 192.0.2.9' }))).toBe('192.0.2.9')
    expect(clientAddress(h({ 'x-forwarded-for': '192.0.2.10' }))).toBe('192.0.2.10')
    delete process.env.TRUST_PROXY
  })

  it('groups IPv6 by /64 and unwraps IPv4-mapped addresses', () => {
    expect(normaliseAddress('::ffff:127.0.0.1')).toBe('127.0.0.1')
    expect(normaliseAddress('2001:db8:1:2:3:4:5:6')).toBe(normaliseAddress('2001:db8:1:2::9'))
  })
})
