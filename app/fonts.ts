import localFont from 'next/font/local'

// Subset WOFF2 for the browser (fonts/SUBSETS.md); the full TTFs stay for the PDF.
export const notoSans = localFont({
  src: [
    { path: '../fonts/NotoSans-Regular.subset.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/NotoSans-Italic.subset.woff2', weight: '400', style: 'italic' },
    { path: '../fonts/NotoSans-Bold.subset.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-noto-sans',
  display: 'swap',
  fallback: ['ui-sans-serif', 'system-ui', 'sans-serif'],
})

export const notoMono = localFont({
  src: [{ path: '../fonts/NotoSansMono-Regular.subset.woff2', weight: '400', style: 'normal' }],
  variable: '--font-noto-mono',
  display: 'swap',
  preload: false,
  fallback: ['ui-monospace', 'monospace'],
})
