/**
 * Straightness of a tracer path: the largest distance of its points from their best-fit line, the
 * total-least-squares line (the principal axis of the points: Pearson, "On lines and planes of
 * closest fit", 1901). Note: ISO 1101 judges straightness by the minimum zone, which this is not;
 * the least-squares line's largest distance is never smaller than half the minimum zone's width.
 */

export interface LineFit {
  /** Centroid of the points, mm. */
  cx: number
  cy: number
  /** Unit normal of the fitted line. */
  nx: number
  ny: number
}

/**
 * The total-least-squares line through n points: through the centroid, along the principal axis of
 * the scatter (angle ½·atan2(2Sxy, Sxx − Syy)). The normal is turned to agree with (refX, refY) when
 * given, so signed residuals keep one sign convention from one perturbed path to the next.
 */
export function fitLine(xs: Float64Array, ys: Float64Array, n: number, refX = 0, refY = 0): LineFit {
  let cx = 0
  let cy = 0
  for (let i = 0; i < n; i++) {
    cx += xs[i]
    cy += ys[i]
  }
  cx /= n
  cy /= n
  let sxx = 0
  let syy = 0
  let sxy = 0
  for (let i = 0; i < n; i++) {
    const dx = xs[i] - cx
    const dy = ys[i] - cy
    sxx += dx * dx
    syy += dy * dy
    sxy += dx * dy
  }
  const a = 0.5 * Math.atan2(2 * sxy, sxx - syy)
  let nx = -Math.sin(a)
  let ny = Math.cos(a)
  if (nx * refX + ny * refY < 0) {
    nx = -nx
    ny = -ny
  }
  return { cx, cy, nx, ny }
}

/** Largest |distance| of the points from the fitted line, mm. */
export function deviationOf(xs: Float64Array, ys: Float64Array, n: number): number {
  const f = fitLine(xs, ys, n)
  let worst = 0
  for (let i = 0; i < n; i++) {
    const d = Math.abs((xs[i] - f.cx) * f.nx + (ys[i] - f.cy) * f.ny)
    if (d > worst) worst = d
  }
  return worst
}

/** Signed distances of the points from the fitted line into `out`, normal oriented along (refX, refY). */
export function residualsOf(xs: Float64Array, ys: Float64Array, n: number, refX: number, refY: number, out: Float64Array): LineFit {
  const f = fitLine(xs, ys, n, refX, refY)
  for (let i = 0; i < n; i++) out[i] = (xs[i] - f.cx) * f.nx + (ys[i] - f.cy) * f.ny
  return f
}
