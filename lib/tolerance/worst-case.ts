/**
 * Worst case by sensitivities. The signed distance r_p of the tracer from its best-fit line at each
 * position p is linearised in the variables x_i: r_p ≈ r_p⁰ + Σ s_pi (x_i − x_i⁰), with s_pi = ∂r_p/∂x_i
 * by central differences (the line refitted each time). Over the box |x_i − x_i⁰| ≤ t_i the largest
 * |r_p| is |r_p⁰| + Σ |s_pi| t_i, reached at x_i = x_i⁰ + sign(r_p⁰) sign(s_pi) t_i; the worst case is
 * the largest of these over the positions (first-order worst case — common practice). The extreme
 * combination of every position is then evaluated with the full kinematics to confirm it.
 */
import { scratchFor, solvePositions, type Scratch } from './kinematics'
import { baseValues, type ToleranceItem, type ToleranceSetup } from './setup'
import { deviationOf, residualsOf } from './straightness'

export interface Contribution {
  id: string
  label: string
  kind: ToleranceItem['kind']
  /** ∂r/∂x at the governing position, mm per mm. */
  sensitivity: number
  /** ± bound t (random items) or fixed shift (clearance along a known force), mm. */
  bound: number
  fixed: boolean
  /** What the item adds to |r| at the governing position, mm (a fixed shift may subtract). */
  contribution: number
  /** contribution / linearised worst case. */
  share: number
  /** s·t over every position: the item's largest effect anywhere in the range, mm. */
  largest: number
}

export interface WorstCase {
  crankDeg: number[]
  /** Every variable at zero: nominal lengths, pins centred (the ideal mechanism), mm. */
  idealDeviation: number
  /** Nominal lengths, pins shifted by their clearance along known forces, mm. */
  baseDeviation: number
  /** Signed residuals of the base configuration, per position, mm. */
  baseResiduals: number[]
  /** s_pi, item-major: sensitivities[i][p]. */
  sensitivities: number[][]
  linear: { deviation: number; position: number; crankDeg: number; base: number; sumAbs: number }
  /** |r_p⁰| + √Σ (s_pi t_i)², largest over the positions: the root-sum-square estimate. */
  rss: { deviation: number; position: number; crankDeg: number }
  /** The extreme combinations evaluated with the full kinematics: the largest deviation found, and where. */
  confirmed: { deviation: number; values: number[]; forPosition: number; crankDeg: number; assembled: boolean }
  /** Ranked, largest first. */
  contributions: Contribution[]
}

/** Tracer path for one set of values into xs/ys; false if the mechanism does not assemble. */
export function evaluatePath(setup: ToleranceSetup, values: Float64Array, s: Scratch, xs: Float64Array, ys: Float64Array): boolean {
  return solvePositions(setup.linkage, setup.effects, values, s, xs, ys)
}

/** Straightness deviation for one set of values, mm; NaN when the mechanism does not assemble. */
export function deviationFor(setup: ToleranceSetup, values: Float64Array): number {
  const n = setup.linkage.anglesDeg.length
  const xs = new Float64Array(n)
  const ys = new Float64Array(n)
  return evaluatePath(setup, values, scratchFor(setup.linkage), xs, ys) ? deviationOf(xs, ys, n) : Number.NaN
}

export function worstCase(setup: ToleranceSetup): WorstCase {
  const lk = setup.linkage
  const n = lk.anglesDeg.length
  const m = setup.items.length
  const s = scratchFor(lk)
  const xs = new Float64Array(n)
  const ys = new Float64Array(n)
  const res = new Float64Array(n)
  const base = baseValues(setup)
  if (!evaluatePath(setup, new Float64Array(m), s, xs, ys)) throw new Error('the nominal mechanism does not assemble over the working range')
  const idealDeviation = deviationOf(xs, ys, n)
  // The normal of the ideal path fixes the sign convention of every residual that follows.
  const ref = residualsOf(xs, ys, n, 1, 0, res)
  const signed = (values: Float64Array, out: Float64Array): boolean => {
    if (!evaluatePath(setup, values, s, xs, ys)) return false
    residualsOf(xs, ys, n, ref.nx, ref.ny, out)
    return true
  }
  const r0 = new Float64Array(n)
  if (!signed(base, r0)) throw new Error('the mechanism with its pin clearances does not assemble over the working range')
  const baseDeviation = Math.max(...Array.from(r0, Math.abs))
  const h = 1e-6 * lk.scale
  const plus = new Float64Array(n)
  const minus = new Float64Array(n)
  const x = Float64Array.from(base)
  const sens: number[][] = []
  for (let i = 0; i < m; i++) {
    x[i] = base[i] + h
    const ok1 = signed(x, plus)
    x[i] = base[i] - h
    const ok2 = signed(x, minus)
    x[i] = base[i]
    if (!ok1 || !ok2) throw new Error(`the mechanism does not assemble when ${setup.items[i].id} changes by ${h} mm: the working range is too close to a locked position`)
    sens.push(Array.from(plus, (v, p) => (v - minus[p]) / (2 * h)))
  }
  const random = setup.items.map((it) => it.fixed === null && it.plusMinus > 0)
  let lin = { deviation: -1, position: 0, crankDeg: 0, base: 0, sumAbs: 0 }
  let rss = { deviation: -1, position: 0, crankDeg: 0 }
  for (let p = 0; p < n; p++) {
    let sumAbs = 0
    let sumSq = 0
    for (let i = 0; i < m; i++) {
      if (!random[i]) continue
      const st = sens[i][p] * setup.items[i].plusMinus
      sumAbs += Math.abs(st)
      sumSq += st * st
    }
    const b = Math.abs(r0[p])
    if (b + sumAbs > lin.deviation) lin = { deviation: b + sumAbs, position: p, crankDeg: lk.anglesDeg[p], base: r0[p], sumAbs }
    if (b + Math.sqrt(sumSq) > rss.deviation) rss = { deviation: b + Math.sqrt(sumSq), position: p, crankDeg: lk.anglesDeg[p] }
  }
  // Confirm: the extreme combination of each position, evaluated in full.
  const seen = new Set<string>()
  let confirmed: WorstCase['confirmed'] = { deviation: -1, values: Array.from(base), forPosition: lin.position, crankDeg: lin.crankDeg, assembled: true }
  const order = [lin.position, ...Array.from({ length: n }, (_, p) => p).filter((p) => p !== lin.position)]
  for (const p of order) {
    const sg = r0[p] < 0 ? -1 : 1
    const combo = Float64Array.from(base)
    let key = ''
    for (let i = 0; i < m; i++) {
      if (!random[i]) continue
      const dir = sg * (sens[i][p] < 0 ? -1 : 1)
      combo[i] = base[i] + dir * setup.items[i].plusMinus
      key += dir > 0 ? '+' : '-'
    }
    if (seen.has(key)) continue
    seen.add(key)
    const d = deviationFor(setup, combo)
    if (Number.isNaN(d)) {
      confirmed = { deviation: Number.POSITIVE_INFINITY, values: Array.from(combo), forPosition: p, crankDeg: lk.anglesDeg[p], assembled: false }
      break
    }
    if (d > confirmed.deviation) confirmed = { deviation: d, values: Array.from(combo), forPosition: p, crankDeg: lk.anglesDeg[p], assembled: true }
  }
  const gp = lin.position
  const sg = r0[gp] < 0 ? -1 : 1
  const contributions: Contribution[] = setup.items.map((it, i) => {
    const sp = sens[i][gp]
    const fixed = it.fixed !== null
    const bound = fixed ? it.fixed! : it.plusMinus
    const contribution = fixed ? sg * sp * bound : Math.abs(sp) * bound
    const largest = Math.max(...sens[i].map((v) => Math.abs(v) * bound))
    return { id: it.id, label: it.label, kind: it.kind, sensitivity: sp, bound, fixed, contribution, share: lin.deviation > 0 ? contribution / lin.deviation : 0, largest }
  })
  contributions.sort((a, b) => Math.abs(b.contribution) - Math.abs(a.contribution) || b.largest - a.largest)
  return {
    crankDeg: Array.from(lk.anglesDeg),
    idealDeviation,
    baseDeviation,
    baseResiduals: Array.from(r0),
    sensitivities: sens,
    linear: lin,
    rss,
    confirmed,
    contributions,
  }
}
