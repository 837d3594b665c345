/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // The PDF pipeline runs outside the Next bundle (see DEVELOPERS.md, "Calc packages").
  serverExternalPackages: ['@react-pdf/renderer', 'mathjax-full', 'mdx-bundler', 'esbuild'],
  experimental: { serverActions: { bodySizeLimit: '20mb' } },
}

export default nextConfig
