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
  backSubstitute(a, n, rhs, cols, start)
  return { ok: true, minPivot }
}

/**
 * Storage for solveMasked: the structural nonzeros of each row and of each column as bit masks
 * (bit k of rowMask[r]: a[r, k] may be nonzero), kept up to date through row swaps and fill-in.
 */
export interface MaskScratch extends SolveScratch {
  pattern: Int32Array
  rowMask: Int32Array
  colMask: Int32Array
  /** The masks of the pattern itself, copied in at the start of every solve. */
  rowMask0: Int32Array
  colMask0: Int32Array
}

/** Largest n solveMasked handles: one bit per row or column in an int32. */
export const MASKED_MAX = 31

export const maskScratch = (n: number, pattern: Int32Array): MaskScratch => {
  if (n > MASKED_MAX) throw new Error(`solveMasked handles up to ${MASKED_MAX} unknowns, not ${n}`)
  const rowMask0 = new Int32Array(n)
  const colMask0 = new Int32Array(n)
  for (let t = 0; t < pattern.length; t++) {
    const r = Math.floor(pattern[t] / n)
    const c = pattern[t] - r * n
    rowMask0[r] |= 1 << c
    colMask0[c] |= 1 << r
  }
  return { ...solveScratch(n, pattern), pattern, rowMask: new Int32Array(n), colMask: new Int32Array(n), rowMask0, colMask0 }
}

/**
 * solveInPlace with the same arithmetic, operation for operation, so the same bits: the same pivot
 * (first largest |a[r, c]|), the same eliminations in the same order, the same back-substitution.
 * What differs is only the bookkeeping: a sweep's matrix changes with position but its sparsity
 * does not, so the rows and columns that can hold a nonzero are kept as bit masks (from the
 * pattern, then through swaps and fill-in) and the searches visit those few entries instead of
 * scanning whole columns. An entry outside the masks is exactly zero, which the scans of
 * solveInPlace would skip or leave unchanged. Needs n ≤ MASKED_MAX and every nonzero of A in the
 * scratch's pattern. With `pivots`, writes the row chosen at each step (see planSolve).
 */
export function solveMasked(a: Float64Array, n: number, rhs: Float64Array[], scratch: MaskScratch, tol = 1e-11, pivots?: Int32Array): SolveOutcome {
  const { cols, start, pattern, rowMask, colMask } = scratch
  const scale = largestEntry(a, n, pattern)
  if (scale === 0) return { ok: false, minPivot: 0 }
  rowMask.set(scratch.rowMask0)
  colMask.set(scratch.colMask0)
  let used = 0
  let minPivot = Infinity
  const nr = rhs.length
  for (let c = 0; c < n; c++) {
    const above = ~((2 << c) - 1) // columns (or rows) after c
    let best = c
    let bestAbs = Math.abs(a[c * n + c])
    let m = colMask[c] & above
    while (m !== 0) {
      const low = m & -m
      m ^= low
      const r = 31 - Math.clz32(low)
      const v = Math.abs(a[r * n + c])
      if (v > bestAbs) {
        best = r
        bestAbs = v
      }
    }
    if (bestAbs / scale < minPivot) minPivot = bestAbs / scale
    if (bestAbs <= tol * scale) return { ok: false, minPivot }
    if (pivots) pivots[c] = best
    if (best !== c) {
      const mc = rowMask[c]
      const mb = rowMask[best]
      // Columns ≥ c where either row may be nonzero: elsewhere both entries are 0 and the swap changes nothing.
      let sw = (mc | mb) & ~((1 << c) - 1)
      while (sw !== 0) {
        const low = sw & -sw
        sw ^= low
        const k = 31 - Math.clz32(low)
        const t = a[c * n + k]
        a[c * n + k] = a[best * n + k]
        a[best * n + k] = t
        // Rows c and best trade places in column k's mask.
        const cm = colMask[k]
        const hasC = (cm >>> c) & 1
        const hasB = (cm >>> best) & 1
        if (hasC !== hasB) colMask[k] = cm ^ ((1 << c) | (1 << best))
      }
      rowMask[c] = mb
      rowMask[best] = mc
      for (let q = 0; q < nr; q++) {
        const b = rhs[q]
        const t = b[c]
        b[c] = b[best]
        b[best] = t
      }
    }
    start[c] = used
    const rowC = rowMask[c] & above
    let cm = rowC
    while (cm !== 0) {
      const low = cm & -cm
      cm ^= low
      const k = 31 - Math.clz32(low)
      if (a[c * n + k] !== 0) cols[used++] = k
    }
    const end = used
    const piv = a[c * n + c]
    let rows = colMask[c] & above
    while (rows !== 0) {
      const low = rows & -rows
      rows ^= low
      const r = 31 - Math.clz32(low)
      const arc = a[r * n + c]
      if (arc === 0) continue
      const f = arc / piv
      if (f === 0) continue
      a[r * n + c] = 0
      for (let t = start[c]; t < end; t++) a[r * n + cols[t]] -= f * a[c * n + cols[t]]
      for (let q = 0; q < nr; q++) rhs[q][r] -= f * rhs[q][c]
      // Fill-in: row r may now be nonzero wherever the pivot row is.
      let fill = rowC & ~rowMask[r]
      rowMask[r] |= rowC
      while (fill !== 0) {
        const lf = fill & -fill
        fill ^= lf
        colMask[31 - Math.clz32(lf)] |= low
      }
    }
  }
  start[n] = used
  backSubstitute(a, n, rhs, cols, start)
  return { ok: true, minPivot }
}

/** Back substitution over the upper triangle left by elimination, row r's nonzeros being cols[start[r] … start[r + 1]). */
function backSubstitute(a: Float64Array, n: number, rhs: Float64Array[], cols: Int32Array, start: Int32Array) {
  for (const b of rhs) {
    for (let r = n - 1; r >= 0; r--) {
      let s = b[r]
      for (let t = start[r]; t < start[r + 1]; t++) s -= a[r * n + cols[t]] * b[cols[t]]
      b[r] = s / a[r * n + r]
    }
  }
}

/**
 * Partial pivoting's eliminations of one sparsity pattern, recorded as index lists so that a sweep
 * can replay them (solvePlanned) instead of searching and bookkeeping at every position. Which rows
 * take part at a step depends on the pivots chosen before it, so the record is a tree: a step holds
 * the entries partial pivoting compares (every structural nonzero of the column at or below the
 * diagonal, in its scan order) and, per winner met so far, a branch with that pivot's elimination
 * and the next step. Rows are never moved: each keeps its storage and the tree knows where it stands.
 * A sweep meets a few dozen pivot sequences over a thousand positions, sharing most of their steps.
 */
export interface SolvePlan {
  n: number
  pattern: Int32Array
  root: PlanStep
  /** Branches recorded so far: the tree starts afresh past BRANCHES_KEPT (a long-running server meets many geometries). */
  branchCount: number
  /** The branch taken at each step of the current solve, for the back-substitution. */
  path: PlanBranch[]
  sol: Float64Array
}

interface PlanStep {
  c: number
  /** Positions (row order after the earlier swaps) of the candidates, position c first, and their entries' flat indices. */
  candPos: Int32Array
  candSlot: Int32Array
  /** Per candidate index, the branch where it won; undefined until a solve has chosen it. */
  branches: (PlanBranch | undefined)[]
  /** Where the rows stand, and the structural nonzeros by row and by column (bits by position). */
  perm: Int32Array
  rowMask: Int32Array
  colMask: Int32Array
}

interface PlanBranch {
  /** Flat index of the pivot and the pivot row's storage row. */
  pivSlot: number
  pivRow: number
  /** The pivot row's entries right of the diagonal (the pattern of U): flat index and column. */
  uSlot: Int32Array
  uCol: Int32Array
  /** The rows it eliminates: the entry in the pivot column and the storage row. */
  tgtSlot: Int32Array
  tgtRow: Int32Array
  next: PlanStep | null
}

const bitsOf = (m: number): number[] => {
  const out: number[] = []
  while (m !== 0) {
    const low = m & -m
    m ^= low
    out.push(31 - Math.clz32(low))
  }
  return out
}

function planStep(n: number, c: number, perm: Int32Array, rowMask: Int32Array, colMask: Int32Array): PlanStep {
  const pos = [c, ...bitsOf(colMask[c] & ~((2 << c) - 1))]
  return {
    c,
    candPos: Int32Array.from(pos),
    candSlot: Int32Array.from(pos, (r) => perm[r] * n + c),
    branches: new Array(pos.length),
    perm,
    rowMask,
    colMask,
  }
}

/** The branch of step s where the row at position p wins: swap, pattern of U, targets and their fill-in. */
function planBranch(n: number, s: PlanStep, p: number): PlanBranch {
  const c = s.c
  const perm = s.perm.slice()
  const rowMask = s.rowMask.slice()
  const colMask = s.colMask.slice()
  if (p !== c) {
    ;[perm[c], perm[p]] = [perm[p], perm[c]]
    ;[rowMask[c], rowMask[p]] = [rowMask[p], rowMask[c]]
    for (let k = 0; k < n; k++) {
      const m = colMask[k]
      if (((m >>> c) & 1) !== ((m >>> p) & 1)) colMask[k] = m ^ ((1 << c) | (1 << p))
    }
  }
  const above = ~((2 << c) - 1)
  const rowC = rowMask[c] & above
  const cols = bitsOf(rowC)
  const targets = bitsOf(colMask[c] & above)
  for (const r of targets) {
    rowMask[r] |= rowC
    for (const k of cols) colMask[k] |= 1 << r
  }
  return {
    pivSlot: perm[c] * n + c,
    pivRow: perm[c],
    uSlot: Int32Array.from(cols, (k) => perm[c] * n + k),
    uCol: Int32Array.from(cols),
    tgtSlot: Int32Array.from(targets, (r) => perm[r] * n + c),
    tgtRow: Int32Array.from(targets, (r) => perm[r]),
    next: c + 1 < n ? planStep(n, c + 1, perm, rowMask, colMask) : null,
  }
}

/** Plans by pattern: a plan depends on nothing else, and every sweep of a mechanism meets the same pivot sequences. */
const plans = new Map<string, SolvePlan>()
const PLANS_KEPT = 64
const BRANCHES_KEPT = 20_000

const planRoot = (n: number, pattern: Int32Array): PlanStep => {
  const { rowMask0, colMask0 } = maskScratch(n, pattern)
  return planStep(n, 0, Int32Array.from({ length: n }, (_, i) => i), rowMask0.slice(), colMask0.slice())
}

/**
 * The plan for `pattern`, shared by every solve of that pattern (solvePlanned is synchronous, so
 * its scratch is never in use twice); solves add to it with recordPivots. Needs n ≤ MASKED_MAX.
 */
export function solvePlan(n: number, pattern: Int32Array): SolvePlan {
  const key = `${n}:${pattern.join()}`
  let plan = plans.get(key)
  if (!plan) {
    if (plans.size >= PLANS_KEPT) plans.clear()
    plan = { n, pattern, root: planRoot(n, pattern), branchCount: 0, path: new Array(n), sol: new Float64Array(n) }
    plans.set(key, plan)
  }
  return plan
}

/**
 * Adds the pivot sequence of a successful solveMasked (its `pivots`) to the plan. Its eliminations
 * then replay with the same candidates, targets and updates in the same order, the fill-in taken at
 * every structural nonzero: a superset of what solveMasked visits, the extra entries being exact
 * zeros, which change no bit.
 */
export function recordPivots(plan: SolvePlan, pivots: Int32Array): void {
  if (plan.branchCount > BRANCHES_KEPT) {
    plan.root = planRoot(plan.n, plan.pattern)
    plan.branchCount = 0
  }
  let s: PlanStep | null = plan.root
  while (s) {
    const t = s.candPos.indexOf(pivots[s.c])
    if (t < 0) throw new Error(`pivot ${pivots[s.c]} at step ${s.c} is not a candidate of the pattern`)
    if (!s.branches[t]) {
      s.branches[t] = planBranch(plan.n, s, pivots[s.c])
      plan.branchCount++
    }
    s = s.branches[t]!.next
  }
}

/**
 * solveMasked replayed from a plan: the same pivots (first largest |a| among the candidates), the
 * same arithmetic in the same order, so the same bits. Returns null, with A and the right-hand sides
 * part-eliminated, when partial pivoting chooses a branch the plan has not recorded yet: the caller
 * rebuilds them, solves with solveMasked and records its pivots.
 */
export function solvePlanned(plan: SolvePlan, a: Float64Array, rhs: Float64Array[], tol = 1e-11): SolveOutcome | null {
  const { n, path, sol } = plan
  const scale = largestEntry(a, n, plan.pattern)
  if (scale === 0) return { ok: false, minPivot: 0 }
  const nr = rhs.length
  let minPivot = Infinity
  let s: PlanStep | null = plan.root
  for (let c = 0; c < n; c++) {
    const cand: Int32Array = s!.candSlot
    let best = 0
    let bestAbs = Math.abs(a[cand[0]])
    for (let t = 1; t < cand.length; t++) {
      const v = Math.abs(a[cand[t]])
      if (v > bestAbs) {
        best = t
        bestAbs = v
      }
    }
    if (bestAbs / scale < minPivot) minPivot = bestAbs / scale
    if (bestAbs <= tol * scale) return { ok: false, minPivot }
    const br: PlanBranch | undefined = s!.branches[best]
    if (!br) return null
    path[c] = br
    const piv = a[br.pivSlot]
    const pr = br.pivRow
    const { uSlot, uCol, tgtSlot, tgtRow } = br
    for (let t = 0; t < tgtSlot.length; t++) {
      const arc = a[tgtSlot[t]]
      if (arc === 0) continue
      const f = arc / piv
      if (f === 0) continue
      a[tgtSlot[t]] = 0
      const row = tgtRow[t]
      const base = row * n
      for (let k = 0; k < uSlot.length; k++) a[base + uCol[k]] -= f * a[uSlot[k]]
      for (let q = 0; q < nr; q++) rhs[q][row] -= f * rhs[q][pr]
    }
    s = br.next
  }
  for (let q = 0; q < nr; q++) {
    const b = rhs[q]
    for (let r = n - 1; r >= 0; r--) {
      const br = path[r]
      let x = b[br.pivRow]
      for (let k = 0; k < br.uSlot.length; k++) x -= a[br.uSlot[k]] * sol[br.uCol[k]]
      sol[r] = x / a[br.pivSlot]
    }
    b.set(sol)
  }
  return { ok: true, minPivot }
}
