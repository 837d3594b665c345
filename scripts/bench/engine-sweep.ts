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
import { placeAt } from '@/lib/linkage/crank'
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
