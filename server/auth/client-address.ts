import { randomBytes } from 'node:crypto'
import http from 'node:http'
import { isIPv6 } from 'node:net'

/**
 * Where a request comes from, for the per-source sign-in and reset limits.
 *
 * Behind a reverse proxy (TRUSTED_PROXY_HOPS=1, or TRUST_PROXY=true) the address is the entry the
 * nearest trusted proxy wrote into X-Forwarded-For: counted from the right, because a proxy that
 * appends keeps whatever the client sent on the left (a proxy that overwrites leaves one entry,
 * the first). Without a proxy X-Forwarded-For is the client's to write, and Next only fills it in
 * when it is missing, so it cannot be trusted: `installClientAddressHeader` (instrumentation.ts)
 * stamps each incoming request with the socket's address and a per-process secret instead.
 */
export const CLIENT_ADDRESS_HEADER = 'x-inverso-client-address'

const state = globalThis as unknown as { __inversoClientAddress?: { secret: string }; __inversoClientAddressWarned?: boolean }

export function trustedProxyHops(): number {
  const hops = Number(process.env.TRUSTED_PROXY_HOPS ?? '')
  if (Number.isInteger(hops) && hops > 0) return hops
  return /^(1|true|yes|on)$/i.test(process.env.TRUST_PROXY ?? '') ? 1 : 0
}

/** Patches the HTTP server so every request carries its socket address under a header only this process can vouch for. */
export function installClientAddressHeader(): void {
  if (state.__inversoClientAddress) return
  const secret = randomBytes(16).toString('hex')
  state.__inversoClientAddress = { secret }
  const emit = http.Server.prototype.emit
  http.Server.prototype.emit = function patchedEmit(this: http.Server, event: string | symbol, ...args: unknown[]) {
    if (event === 'request') {
      const req = args[0] as http.IncomingMessage
      req.headers[CLIENT_ADDRESS_HEADER] = `${secret} ${req.socket?.remoteAddress ?? ''}`
    }
    return (emit as (this: http.Server, event: string | symbol, ...args: unknown[]) => boolean).call(this, event, ...args)
  } as typeof emit
}

/** Groups IPv6 addresses by /64 (one host usually has a whole /64) and unwraps IPv4-mapped ones. */
export function normaliseAddress(address: string): string {
  const a = address.trim().replace(/^\[|\]$/g, '').replace(/%.*$/, '')
  const mapped = a.match(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/i)
  if (mapped) return mapped[1]
  if (isIPv6(a)) {
    const [head, tail = ''] = a.toLowerCase().split('::')
    const left = head ? head.split(':') : []
    const right = tail ? tail.split(':') : []
    const full = [...left, ...Array(Math.max(0, 8 - left.length - right.length)).fill('0'), ...right]
    return `${full.slice(0, 4).map((g) => g.replace(/^0+(?=.)/, '')).join(':')}::/64`
  }
  return a || 'unknown'
}

/** The client address of a request, from its headers (a `Headers` or Next's `headers()`). */
export function clientAddress(headers: { get(name: string): string | null }): string {
  const hops = trustedProxyHops()
  if (hops > 0) {
    const chain = (headers.get('x-forwarded-for') ?? '').split(',').map((s) => s.trim()).filter(Boolean)
    if (chain.length > 0) return normaliseAddress(chain[Math.max(0, chain.length - hops)])
  }
  const stamped = headers.get(CLIENT_ADDRESS_HEADER)
  const secret = state.__inversoClientAddress?.secret
  if (stamped && secret) {
    const [proof, address] = stamped.split(' ', 2)
    if (proof === secret && address) return normaliseAddress(address)
  }
  // No stamp (e.g. the dev server's worker): what Next filled in from the socket, if the client sent none.
  if (!state.__inversoClientAddressWarned) {
    state.__inversoClientAddressWarned = true
    console.warn('[auth] client address taken from X-Forwarded-For without a trusted proxy; per-source limits can be evaded here')
  }
  return normaliseAddress((headers.get('x-forwarded-for') ?? '').split(',')[0] ?? '')
}
