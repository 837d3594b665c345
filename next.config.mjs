/**
 * Uploads are refused above 10 MB (server/attachments.ts); the action body may be a little larger
 * (form fields, multipart framing). The proxy sees bodies first and would cut them at its own
 * default of 10 MB, so its limit sits just above the actions' one; proxy.ts answers 413 at once to
 * a request that declares a larger body. Keep the three in step with MAX_BODY_BYTES in proxy.ts.
 */
const ACTION_BODY_LIMIT = '11mb'
const PROXY_BODY_LIMIT = '12mb'

/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // The PDF pipeline runs outside the Next bundle (see DEVELOPERS.md, "Calc packages").
  serverExternalPackages: ['@react-pdf/renderer', 'mathjax-full', 'mdx-bundler', 'esbuild', 'piscina'],
  experimental: { serverActions: { bodySizeLimit: ACTION_BODY_LIMIT }, proxyClientMaxBodySize: PROXY_BODY_LIMIT },
  async headers() {
    // Pages and API answers get their headers from proxy.ts; the hashed build assets it skips get these.
    return [{ source: '/_next/static/:path*', headers: [{ key: 'X-Content-Type-Options', value: 'nosniff' }] }]
  },
}

export default nextConfig
