import localFont from 'next/font/local'

export const notoSans = localFont({
  src: [
    { path: '../fonts/NotoSans-Regular.ttf', weight: '400', style: 'normal' },
    { path: '../fonts/NotoSans-Italic.ttf', weight: '400', style: 'italic' },
    { path: '../fonts/NotoSans-Bold.ttf', weight: '700', style: 'normal' },
  ],
  variable: '--font-noto-sans',
  display: 'swap',
})

export const notoMono = localFont({
  src: [{ path: '../fonts/NotoSansMono-Regular.ttf', weight: '400', style: 'normal' }],
  variable: '--font-noto-mono',
  display: 'swap',
})
