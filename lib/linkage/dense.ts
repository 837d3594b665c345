/**
 * Gaussian elimination with partial pivoting on a dense row-major matrix.
 * The statics and loop-closure matrices hold about 2.5 nonzeros per row and
 * barely fill in, so the elimination and the back-substitution only visit the
 * pivot rows' nonzeros; a 21×21 statics solve then costs a few hundred
 * operations instead of n³/3.
 */
export interface SolveOutcome {
  ok: boolean
  /** Smallest |pivot| met, relative to the largest |entry| of the matrix. */
  minPivot: number
}

/**
 * Working storage of one solver size. A sweep solves a thousand small systems
 * of the same size, and allocating these typed arrays per solve cost more than
 * the elimination itself, so callers that solve repeatedly keep one.
 */
export interface SolveScratch {
  /** Column indices of each pivot row's nonzeros right of the diagonal: the pattern of U. */
  cols: Int32Array
  start: Int32Array
  /**
   * Flat indices of every entry of A that can be nonzero, when the caller
   * knows them; the matrix scale then reads those instead of all n² entries.
   */
  pattern: Int32Array | null
}

export const solveScratch = (n: number, pattern: Int32Array | null = null): SolveScratch => ({
  cols: new Int32Array(n * n),
  start: new Int32Array(n + 1),
  pattern,
})

function largestEntry(a: Float64Array, n: number, pattern: Int32Array | null): number {
  let scale = 0
  if (pattern) {
    for (let t = 0; t < pattern.length; t++) {
      const v = Math.abs(a[pattern[t]])
      if (v > scale) scale = v
    }
  } else {
    for (let i = 0; i < n * n; i++) {
      const v = Math.abs(a[i])
      if (v > scale) scale = v
    }
  }
  return scale
}

/**
 * Solves A·x = b for each right-hand side in place (A is destroyed, each b
 * becomes its x). Reports failure instead of dividing by a vanishing pivot.
 */
export function solveInPlace(a: Float64Array, n: number, rhs: Float64Array[], tol = 1e-11, scratch: SolveScratch = solveScratch(n)): SolveOutcome {
  const { cols, start } = scratch
  const scale = largestEntry(a, n, scratch.pattern)
  if (scale === 0) return { ok: false, minPivot: 0 }
  let used = 0
  let minPivot = Infinity
  const nr = rhs.length
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
    if (bestAbs / scale < minPivot) minPivot = bestAbs / scale
    if (bestAbs <= tol * scale) return { ok: false, minPivot }
    if (best !== c) {
      for (let k = c; k < n; k++) {
        const t = a[c * n + k]
        a[c * n + k] = a[best * n + k]
        a[best * n + k] = t
      }
      for (let q = 0; q < nr; q++) {
        const b = rhs[q]
        const t = b[c]
        b[c] = b[best]
        b[best] = t
      }
    }
    start[c] = used
    for (let k = c + 1; k < n; k++) if (a[c * n + k] !== 0) cols[used++] = k
    const end = used
    const piv = a[c * n + c]
    for (let r = c + 1; r < n; r++) {
      // Most of the column is zero: test before dividing, the division is the costly part.
      const arc = a[r * n + c]
      if (arc === 0) continue
      const f = arc / piv
      if (f === 0) continue
      a[r * n + c] = 0
      for (let t = start[c]; t < end; t++) a[r * n + cols[t]] -= f * a[c * n + cols[t]]
      for (let q = 0; q < nr; q++) rhs[q][r] -= f * rhs[q][c]
    }
  }
  start[n] = used
  for (let q = 0; q < nr; q++) {
    const b = rhs[q]
    for (let r = n - 1; r >= 0; r--) {
      let s = b[r]
      for (let t = start[r]; t < start[r + 1]; t++) s -= a[r * n + cols[t]] * b[cols[t]]
      b[r] = s / a[r * n + r]
    }
  }
  return { ok: true, minPivot }
}
