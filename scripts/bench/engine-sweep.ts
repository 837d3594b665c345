/**
 * The engine's speed against its yardstick, in one run (issue 12, item 4): closed-form positions
 * alone for 1,000 crank angles (the yardstick), the 1,000-position sweep with statics as analyse()
 * runs it (flat arrays, no per-position objects), the same sweep through runSweep (which also builds
 * every CaseSample object, for callers that want them), and a whole calc (`calculate` on each demo
 * input). Medians of warm runs, each with its ratio to the yardstick; the load average is printed
 * because two shared cores make wall times swing.
 */
import os from 'node:os'
import { calculate } from '@/lib/calc/run'
import { mechanismInputSchema, type MechanismInput } from '@/lib/calc/mechanism'
import { DEMO_CALCS } from '@/lib/demo/calcs'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { maskScratch, recordPivots, solveMasked, solvePlan, solvePlanned } from '@/lib/linkage/dense'
import { equilibriumMatrix, equilibriumPattern } from '@/lib/linkage/equations'
import { buildModel, pointsFromJoints } from '@/lib/linkage/model'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { runSweep, sweepArrays } from '@/lib/linkage/sweep'
import { DEG } from '@/lib/linkage/vec'
import { getMechanism } from '@/lib/mechanisms'
import { measure } from '../lib/measure'

const CASES: MechanismInput[] = [
  {
    mechanism: 'peaucellier',
    geometry: { arm: 200, side: 90, crank: 70 },
    loads: [{ name: 'push', fx: 0, fy: 150 }],
    sweep: { fromDeg: -60, toDeg: 60, count: 1000 },
  },
  {
    mechanism: 'hart',
    geometry: { long: 240, short: 100, ratio: 0.4, crank: 40 },
    loads: [{ name: 'push', fx: 0, fy: 150 }],
    sweep: { fromDeg: -40, toDeg: 40, count: 1000 },
  },
]


/**
 * The part of the sweep that is the equilibrium solve: the matrix built and solved (three
 * right-hand sides, the case and the two unit probes, replayed from the elimination plan) at every
 * position, the positions placed beforehand.
 */
function solvesAlone(cell: InversorCell, crank: number, offset: number, anglesDeg: number[]): () => void {
  const model = buildModel(linkageOf(cell, offset, crank))
  const n = model.size
  const pattern = equilibriumPattern(model)
  const pts = anglesDeg.flatMap((d) => {
    const j = placeAt(cell, offset, crank, d * DEG)
    return j ? [pointsFromJoints(model, j)] : []
  })
  const a = new Float64Array(n * n)
  const rhs = [0, 1, 2].map(() => new Float64Array(n))
  const plan = solvePlan(n, pattern)
  const pivots = new Int32Array(n)
  const solve = (p: Float64Array) => {
    equilibriumMatrix(model, p, a)
    rhs.forEach((b, q) => b.fill(0)[n - 1 - q] = 1)
    return solvePlanned(plan, a, rhs)
  }
  for (const p of pts) if (!solve(p) && solveMasked(equilibriumMatrix(model, p), n, rhs, maskScratch(n, pattern), undefined, pivots).ok) recordPivots(plan, pivots)
  return () => pts.forEach(solve)
}

const ms = (x: number) => (x < 1 ? x.toFixed(3) : x.toFixed(2))
const load = () => os.loadavg().map((x) => x.toFixed(2)).join(' ')

export default function bench(): void {
  console.log(`load average before: ${load()} (${os.cpus().length} cores)`)
  for (const input of CASES) {
    const { cell, crank, offset } = getMechanism(input.mechanism).model(mechanismInputSchema.parse(input).geometry)
    const s = input.sweep!
    const anglesDeg = Array.from({ length: s.count }, (_, i) => s.fromDeg + ((s.toDeg - s.fromDeg) * i) / (s.count - 1))
    const sweepInput = { cell, crank, offset, anglesDeg, loads: input.loads, weightPerMm: null, amplificationLimit: 100 }
    const yard = measure(() => anglesDeg.map((a) => placeAt(cell, offset, crank, a * DEG)), 20, 60)
    const line = (label: string, m: { wall: number; cpu: number }) =>
      console.log(`  ${label.padEnd(50)} median ${ms(m.wall).padStart(7)} ms (cpu ${ms(m.cpu)} ms)  ×${(m.wall / yard.wall).toFixed(1)} the yardstick`)
    console.log(`${input.mechanism}: ${s.count} positions`)
    line('yardstick: closed-form positions alone', yard)
    line('positions placed flat, ×3 (each and its two virtual-work neighbours)', measure(() => {
      const out = new Float64Array(16)
      for (const a of anglesDeg) for (const d of [-1e-5, 0, 1e-5]) cell.placeInto?.(offset + crank * Math.cos(a * DEG + d), crank * Math.sin(a * DEG + d), out, 0)
    }, 20, 60))
    line('equilibrium solves alone (3 right-hand sides each)', measure(solvesAlone(cell, crank, offset, anglesDeg), 20, 60))
    line('sweep with statics, flat (as analyse() runs it)', measure(() => sweepArrays(sweepInput), 20, 60))
    line('runSweep: the same plus every CaseSample object', measure(() => runSweep(sweepInput), 10, 40))
  }
  const { cell, crank, offset } = getMechanism('peaucellier').model(mechanismInputSchema.parse(CASES[0]).geometry)
  const angles = Array.from({ length: 1000 }, (_, i) => -60 + (120 * i) / 999)
  const yard = measure(() => angles.map((a) => placeAt(cell, offset, crank, a * DEG)), 20, 60)
  console.log('whole calc: calculate() on the demo inputs (ratio to the Peaucellier yardstick)')
  for (const d of DEMO_CALCS) {
    const features = [('tolerances' in d.inputs) && 'tolerance Monte Carlo', ('operatingSpeed' in d.inputs) && 'operating speed'].filter(Boolean).join(', ')
    const slow = 'tolerances' in d.inputs
    const m = measure(() => calculate(d.inputs), slow ? 2 : 5, slow ? 7 : 21)
    console.log(`  ${`${d.number} ${d.inputs.mechanism}${features ? ` (${features})` : ''}`.padEnd(50)} median ${ms(m.wall).padStart(7)} ms (cpu ${ms(m.cpu)} ms)  ×${(m.wall / yard.wall).toFixed(0)} the yardstick`)
  }
  console.log(`load average after: ${load()}`)
}
