import type { LinkageModel } from './model'

/**
 * The equilibrium matrix of the linkage, row-major, size × size, from the
 * world positions of the body points (flat layout, see LinkageModel.offset).
 * Rows: for each body ΣFx, ΣFy, ΣM/lc about its first point. Columns: the two
 * components of every connection force, then the drive torque divided by lc.
 * It is the transpose of the loop-closure Jacobian with body coordinates
 * (x, y, lc·φ), which is why the Newton solver reuses it: a toggle makes both
 * singular at once (the statics/kinematics duality of virtual work).
 */
export function equilibriumMatrix(model: LinkageModel, pts: Float64Array, into?: Float64Array): Float64Array {
  const n = model.size
  // A sweep passes the same matrix back in: a fresh n² array per position cost more than filling it.
  const a = into ? into.fill(0) : new Float64Array(n * n)
  const inv = 1 / model.lc
  const conns = model.connections
  for (let i = 0; i < conns.length; i++) {
    const c = conns[i]
    addBody(a, n, inv, pts, model.offset[c.body], model.connBodyK[i], c.body, 2 * i, 1)
    if (c.other >= 0) addBody(a, n, inv, pts, model.offset[c.other], model.connOtherK[i], c.other, 2 * i, -1)
  }
  a[(3 * model.crankIndex + 2) * n + n - 1] = 1
  return a
}

/**
 * Flat indices of the entries equilibriumMatrix can write, whatever the
 * positions: the rest of the matrix is zero, so the solver need not scan it.
 */
export function equilibriumPattern(model: LinkageModel): Int32Array {
  const n = model.size
  const at = new Set<number>()
  const body = (b: number, col: number): void => {
    at.add(3 * b * n + col)
    at.add((3 * b + 1) * n + col + 1)
    at.add((3 * b + 2) * n + col)
    at.add((3 * b + 2) * n + col + 1)
  }
  model.connections.forEach((c, i) => {
    body(c.body, 2 * i)
    if (c.other >= 0) body(c.other, 2 * i)
  })
  at.add((3 * model.crankIndex + 2) * n + n - 1)
  return Int32Array.from([...at].sort((x, y) => x - y))
}

function addBody(a: Float64Array, n: number, inv: number, pts: Float64Array, off: number, k: number, b: number, col: number, sign: number): void {
  const dx = pts[2 * (off + k)] - pts[2 * off]
  const dy = pts[2 * (off + k) + 1] - pts[2 * off + 1]
  a[3 * b * n + col] += sign
  a[(3 * b + 1) * n + col + 1] += sign
  a[(3 * b + 2) * n + col] -= sign * dy * inv
  a[(3 * b + 2) * n + col + 1] += sign * dx * inv
}

export function transpose(a: Float64Array, n: number): Float64Array {
  const t = new Float64Array(n * n)
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) t[c * n + r] = a[r * n + c]
  return t
}
