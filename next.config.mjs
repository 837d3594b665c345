/** Uploads are refused above 10 MB (server/attachments.ts); the action body may be a little larger (form fields, multipart framing). */
const ACTION_BODY_LIMIT = '11mb'

/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // The PDF pipeline runs outside the Next bundle (see DEVELOPERS.md, "Calc packages").
  serverExternalPackages: ['@react-pdf/renderer', 'mathjax-full', 'mdx-bundler', 'esbuild'],
  experimental: { serverActions: { bodySizeLimit: ACTION_BODY_LIMIT } },
  async headers() {
    // Pages and API answers get their headers from proxy.ts; the hashed build assets it skips get these.
    return [{ source: '/_next/static/:path*', headers: [{ key: 'X-Content-Type-Options', value: 'nosniff' }] }]
  },
}

export default nextConfig
