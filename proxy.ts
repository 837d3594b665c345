import { NextResponse, type NextRequest } from 'next/server'

/**
 * Security headers for every page and API answer (Next 16's proxy, formerly middleware).
 *
 * Scripts: only Next's own, which carry this request's nonce ('strict-dynamic' lets them load the
 * chunks they need); no inline script without the nonce runs, so injected markup cannot execute.
 * Next reads the nonce from the Content-Security-Policy request header set here and puts it on
 * its scripts; pages are rendered per request (the root layout calls `connection()`), so every
 * page gets a fresh nonce.
 *
 * Styles: 'unsafe-inline' is needed. The calc package's web view is KaTeX HTML, which positions
 * every glyph with inline `style` attributes, and React `style` props render as attributes too;
 * neither can carry a nonce. (A nonce in style-src would also switch 'unsafe-inline' off.) Styles
 * cannot run code, so scripts stay locked down.
 */
export function securityHeaders(nonce: string, opts: { https?: boolean; dev?: boolean } = {}): Record<string, string> {
  const csp = [
    `default-src 'self'`,
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.dev ? ` 'unsafe-eval'` : ''}`,
    `style-src 'self' 'unsafe-inline'`,
    `img-src 'self' data: blob:`,
    `font-src 'self' data:`,
    `connect-src 'self'${opts.dev ? ' ws: wss:' : ''}`,
    // The bench's calc runs in a Web Worker loaded from the app's own build assets.
    `worker-src 'self'`,
    `object-src 'none'`,
    `base-uri 'self'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
    ...(opts.https ? ['upgrade-insecure-requests'] : []),
  ].join('; ')
  return {
    'Content-Security-Policy': csp,
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'strict-origin-when-cross-origin',
    'X-Frame-Options': 'DENY',
    'Cross-Origin-Opener-Policy': 'same-origin',
    'Permissions-Policy': 'camera=(), microphone=(), geolocation=(), payment=()',
    // Only over https: HSTS on plain http would be ignored at best and lock a misconfigured host out at worst.
    ...(opts.https ? { 'Strict-Transport-Security': 'max-age=31536000; includeSubDomains' } : {}),
  }
}

/** No request body may be larger (the largest is an appendix upload of 10 MB, plus the form around it). */
export const MAX_BODY_BYTES = 11 * 1024 * 1024

export function proxy(request: NextRequest) {
  const length = Number(request.headers.get('content-length') ?? 0)
  if (length > MAX_BODY_BYTES) {
    // Refused before anything reads it: a clear 413, not a truncated body that fails later with a 500.
    return new NextResponse(`The request is larger than ${MAX_BODY_BYTES / 1048576} MB. Appendices may be at most 10 MB.`, {
      status: 413,
      headers: { 'Content-Type': 'text/plain; charset=utf-8', 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' },
    })
  }
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64')
  const headers = securityHeaders(nonce, { https: (process.env.APP_URL ?? '').startsWith('https://'), dev: process.env.NODE_ENV === 'development' })
  const requestHeaders = new Headers(request.headers)
  requestHeaders.set('x-nonce', nonce)
  requestHeaders.set('Content-Security-Policy', headers['Content-Security-Policy'])
  const response = NextResponse.next({ request: { headers: requestHeaders } })
  for (const [name, value] of Object.entries(headers)) response.headers.set(name, value)
  return response
}

export const config = {
  // Everything but the hashed build assets (next.config.mjs gives those nosniff).
  matcher: ['/((?!_next/static|_next/image|favicon.ico).*)'],
}
