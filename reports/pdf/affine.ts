/**
 * Just enough SVG geometry to flatten MathJax output into one path: affine
 * transforms and path data rewritten to absolute, transformed coordinates.
 */
export type Affine = [number, number, number, number, number, number]

export const IDENTITY: Affine = [1, 0, 0, 1, 0, 0]

export function multiply(m: Affine, n: Affine): Affine {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ]
}

/** Parses translate/scale/matrix lists, the only forms MathJax emits. */
export function parseTransform(s: string | null | undefined): Affine {
  let m = IDENTITY
  if (!s) return m
  for (const [, fn, args] of s.matchAll(/(\w+)\s*\(([^)]*)\)/g)) {
    const a = args.split(/[\s,]+/).filter(Boolean).map(Number)
    if (fn === 'translate') m = multiply(m, [1, 0, 0, 1, a[0] ?? 0, a[1] ?? 0])
    else if (fn === 'scale') m = multiply(m, [a[0], 0, 0, a[1] ?? a[0], 0, 0])
    else if (fn === 'matrix' && a.length === 6) m = multiply(m, a as Affine)
  }
  return m
}

const apply = (m: Affine, x: number, y: number): [number, number] => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]]

// MathJax units are 1/1000 em: whole units are far below what print can show.
const r = (n: number) => String(Math.round(n))

const ARITY: Record<string, number> = { M: 2, L: 2, H: 1, V: 1, C: 6, S: 4, Q: 4, T: 2, Z: 0, A: 7 }

/**
 * Rewrites path data through `m`. Every command becomes absolute, H/V become
 * L, and smooth curves (S/T) become explicit C/Q: react-pdf expands smooth
 * quadratics slowly, and MathJax glyphs are full of them.
 */
export function transformPath(d: string, m: Affine): string {
  const tokens = d.match(/[A-Za-z]|-?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?/g) ?? []
  const out: string[] = []
  let i = 0
  let cmd = ''
  let cx = 0
  let cy = 0
  let sx = 0
  let sy = 0
  // Last control point, for reflecting into the next S/T command.
  let qx = 0
  let qy = 0
  let last = ''
  while (i < tokens.length) {
    if (/[A-Za-z]/.test(tokens[i])) cmd = tokens[i++]
    const up = cmd.toUpperCase()
    const rel = cmd !== up
    const n = ARITY[up]
    if (n === undefined) throw new Error(`Unsupported path command ${cmd}`)
    if (up === 'Z') {
      out.push('Z')
      last = 'Z'
      cx = sx
      cy = sy
      continue
    }
    const a = tokens.slice(i, i + n).map(Number)
    i += n
    const pts: [number, number][] = []
    if (up === 'H') pts.push([rel ? cx + a[0] : a[0], cy])
    else if (up === 'V') pts.push([cx, rel ? cy + a[0] : a[0]])
    else if (up === 'A') throw new Error('Arc commands are not produced by MathJax glyphs')
    else for (let k = 0; k < n; k += 2) pts.push([rel ? cx + a[k] : a[k], rel ? cy + a[k + 1] : a[k + 1]])
    let letter = up === 'H' || up === 'V' ? 'L' : up
    if (up === 'T' || up === 'S') {
      const smooth = up === 'T' ? last === 'Q' : last === 'C'
      const reflected: [number, number] = smooth ? [2 * cx - qx, 2 * cy - qy] : [cx, cy]
      pts.unshift(reflected)
      letter = up === 'T' ? 'Q' : 'C'
    }
    out.push(letter + pts.map(([x, y]) => apply(m, x, y).map(r).join(' ')).join(' '))
    if (letter === 'Q' || letter === 'C') [qx, qy] = pts[pts.length - 2]
    last = letter
    ;[cx, cy] = pts[pts.length - 1]
    if (up === 'M') {
      sx = cx
      sy = cy
      // Further pairs after M are implicit L commands.
      cmd = rel ? 'l' : 'L'
    }
  }
  return out.join('')
}

export function rectPath(x: number, y: number, w: number, h: number, m: Affine): string {
  return transformPath(`M${x} ${y}H${x + w}V${y + h}H${x}Z`, m)
}
