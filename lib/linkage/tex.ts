/**
 * Numbers for TeX that KaTeX and MathJax both read: six significant digits,
 * no trailing zeros, powers of ten written out, negatives bracketed where a
 * value is substituted into an expression.
 */
export function tex(x: number, digits = 6): string {
  if (!Number.isFinite(x)) return '\\text{n/a}'
  if (x === 0) return '0'
  const abs = Math.abs(x)
  if (abs >= 1e-3 && abs < 1e7) {
    const s = Number(x.toPrecision(digits)).toString()
    return s.includes('e') ? sci(x, digits) : s
  }
  return sci(x, digits)
}

function sci(x: number, digits: number): string {
  const [m, e] = x.toExponential(digits - 1).split('e')
  return `${Number(m).toString()}\\times 10^{${Number(e)}}`
}

/** Bracketed when negative, for use inside an expression. */
export const texp = (x: number, digits = 6): string => (x < 0 ? `\\left(${tex(x, digits)}\\right)` : tex(x, digits))

/** Plain-text number for messages. */
export function plain(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return 'n/a'
  return Number(x.toPrecision(digits)).toString()
}
