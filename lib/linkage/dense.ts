/**
 * Gaussian elimination with partial pivoting on a dense row-major matrix.
 * The statics and loop-closure matrices are mostly zeros, so rows whose
 * factor is zero are skipped; that keeps a 21×21 solve well under a
 * microsecond-per-entry budget without a sparse library.
 */
export interface SolveOutcome {
  ok: boolean
  /** Smallest |pivot| met, relative to the largest |entry| of the matrix. */
  minPivot: number
}

/**
 * Solves A·x = b for each right-hand side in place (A is destroyed, each b
 * becomes its x). Reports failure instead of dividing by a vanishing pivot.
 */
export function solveInPlace(a: Float64Array, n: number, rhs: Float64Array[], tol = 1e-11): SolveOutcome {
  const nz = new Int32Array(n)
  let scale = 0
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]))
  if (scale === 0) return { ok: false, minPivot: 0 }
  let minPivot = Infinity
  for (let c = 0; c < n; c++) {
    let best = c
    let bestAbs = Math.abs(a[c * n + c])
    for (let r = c + 1; r < n; r++) {
      const v = Math.abs(a[r * n + c])
      if (v > bestAbs) {
        best = r
        bestAbs = v
      }
    }
    minPivot = Math.min(minPivot, bestAbs / scale)
    if (bestAbs <= tol * scale) return { ok: false, minPivot }
    if (best !== c) {
      for (let k = c; k < n; k++) {
        const t = a[c * n + k]
        a[c * n + k] = a[best * n + k]
        a[best * n + k] = t
      }
      for (const b of rhs) {
        const t = b[c]
        b[c] = b[best]
        b[best] = t
      }
    }
    const piv = a[c * n + c]
    // The pivot row's nonzeros, once: the rows below only change there.
    let m = 0
    for (let k = c + 1; k < n; k++) if (a[c * n + k] !== 0) nz[m++] = k
    for (let r = c + 1; r < n; r++) {
      const f = a[r * n + c] / piv
      if (f === 0) continue
      a[r * n + c] = 0
      for (let t = 0; t < m; t++) a[r * n + nz[t]] -= f * a[c * n + nz[t]]
      for (let q = 0; q < rhs.length; q++) rhs[q][r] -= f * rhs[q][c]
    }
  }
  for (const b of rhs) {
    for (let r = n - 1; r >= 0; r--) {
      let s = b[r]
      for (let k = r + 1; k < n; k++) s -= a[r * n + k] * b[k]
      b[r] = s / a[r * n + r]
    }
  }
  return { ok: true, minPivot }
}
