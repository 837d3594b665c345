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
 * L, and smooth curves (S/T) become explicit curves: react-pdf expands smooth
 * quadratics slowly, and MathJax glyphs are full of them. Quadratics leave as
 * their exact cubics, since pdfkit writes a Q as the PDF `v` operator, which
 * is a different curve and visibly dents glyph outlines. Segments that vanish
 * at whole units and flat curves are dropped or drawn as lines: glyphs carry
 * many of both, and every operator costs layout, render and file size.
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
  // Where the emitted outline stands, in rounded output units.
  const pen: [number, number] = [NaN, NaN]
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
      ;[pen[0], pen[1]] = apply(m, sx, sy).map(Math.round)
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
    emit(out, letter, pts.map(([x, y]) => apply(m, x, y).map(Math.round) as [number, number]), pen)
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

type Pt = [number, number]

/** Twice the area of triangle a-b-c: zero when c lies on the line through a and b. */
const cross = (a: Pt, b: Pt, c: Pt) => (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])
const same = (a: Pt, b: Pt) => a[0] === b[0] && a[1] === b[1]

function emit(out: string[], letter: string, pts: Pt[], pen: Pt): void {
  const end = pts[pts.length - 1]
  const put = (l: string, ps: Pt[]) => {
    out.push(l + ps.map((p) => `${r(p[0])} ${r(p[1])}`).join(' '))
    pen[0] = end[0]
    pen[1] = end[1]
  }
  if (letter === 'M') return put('M', pts)
  if (pts.every((p) => same(p, pen))) return
  const chord = Math.hypot(end[0] - pen[0], end[1] - pen[1])
  // Control points within half a unit of the chord: the curve is a line at this resolution.
  const flat = (c: Pt) => chord > 0 && Math.abs(cross(pen, end, c)) / chord < 0.5
  if (letter === 'L' || (letter !== 'L' && pts.slice(0, -1).every(flat))) return put('L', [end])
  if (letter === 'Q') {
    const [q] = pts
    const c1: Pt = [pen[0] + (2 / 3) * (q[0] - pen[0]), pen[1] + (2 / 3) * (q[1] - pen[1])]
    const c2: Pt = [end[0] + (2 / 3) * (q[0] - end[0]), end[1] + (2 / 3) * (q[1] - end[1])]
    return put('C', [c1.map(Math.round) as Pt, c2.map(Math.round) as Pt, end])
  }
  put('C', pts)
}

export function rectPath(x: number, y: number, w: number, h: number, m: Affine): string {
  return transformPath(`M${x} ${y}H${x + w}V${y + h}H${x}Z`, m)
}
