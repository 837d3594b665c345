/**
 * Finds the longest of several plane vectors stored in a flat array (x at 2i,
 * y at 2i + 1) exactly as a scan comparing Math.hypot lengths with a strict
 * `>` does (first one kept on ties), but calls Math.hypot only for the
 * candidates that squared lengths cannot tell apart from the longest.
 * Math.hypot is exact to the last bit, which the reported results rely on,
 * yet costs tens of nanoseconds in V8, and the sweep made some forty such
 * calls per position only to rank pin forces.
 */

/** Below this a squared length may lose relative precision to underflow. */
const SAFE_MIN = 1e-290
/** Squared lengths carry a few ulps of rounding: anything this close to the largest is settled by Math.hypot. */
const NEAR = 1 - 1e-9

/**
 * Position t in `at` of the first longest vector (flat index at[t]). −1 when
 * (Vector i at f[base + 2i], f[base + 2i + 1].) `at` is empty or a value is NaN, infinite, or so large or small that its
 * square leaves the safe range: the caller then runs its plain Math.hypot
 * scan, which defines the result in those cases.
 */
export function firstLongest(f: Float64Array, at: ArrayLike<number>, base = 0): number {
  let top = 0
  for (let t = 0; t < at.length; t++) {
    const i = base + 2 * at[t]
    const q = f[i] * f[i] + f[i + 1] * f[i + 1]
    if (!(q < Infinity)) return -1
    if (q > top) top = q
  }
  if (top < SAFE_MIN) return -1
  const near = top * NEAR
  let best = -1
  let bestLen = 0
  for (let t = 0; t < at.length; t++) {
    const i = base + 2 * at[t]
    if (f[i] * f[i] + f[i + 1] * f[i + 1] < near) continue
    const len = Math.hypot(f[i], f[i + 1])
    if (best < 0 || len > bestLen) {
      best = t
      bestLen = len
    }
  }
  return best
}
