/**
 * Median wall and CPU time of a 1,000-position sweep per cell: the whole calc
 * (runMechanism), the sweep alone (positions and statics) and the positions
 * alone (closed-form placement, no statics), so a change can be placed.
 */
import { mechanismInputSchema, runMechanism, type MechanismInput } from '@/lib/calc/mechanism'
import { placeAt } from '@/lib/linkage/crank'
import { getMechanism } from '@/lib/mechanisms'
import { runSweep } from '@/lib/linkage/sweep'
import { DEG } from '@/lib/linkage/vec'

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

// Other jobs share the two cores and the garbage collector runs in bursts: many repetitions, medians.
const WARM_UP = 10
const RUNS = 40

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

/** Median wall and CPU ms of fn; CPU as well, since wall time swings when the cores are shared. */
function measure(fn: () => unknown): string {
  for (let i = 0; i < WARM_UP; i++) fn()
  const wall: number[] = []
  const cpu: number[] = []
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now()
    const c0 = process.cpuUsage()
    fn()
    const c = process.cpuUsage(c0)
    wall.push(performance.now() - t0)
    cpu.push((c.user + c.system) / 1000)
  }
  return `${median(wall).toFixed(2)} ms (cpu ${median(cpu).toFixed(2)} ms)`
}

export default function bench(): void {
  for (const input of CASES) {
    const { cell, crank, offset } = getMechanism(input.mechanism).model(mechanismInputSchema.parse(input).geometry)
    const sweep = input.sweep!
    const anglesDeg = Array.from({ length: sweep.count }, (_, i) => sweep.fromDeg + ((sweep.toDeg - sweep.fromDeg) * i) / (sweep.count - 1))
    const positions = runMechanism(input).positions.length
    console.log(`${input.mechanism}: ${positions} positions`)
    console.log(`  whole calc, with statics, checks, steps, tables  median ${measure(() => runMechanism(input))}`)
    console.log(`  sweep: positions and statics                     median ${measure(() => runSweep({ cell, crank, offset, anglesDeg, loads: input.loads, weightPerMm: null, amplificationLimit: 100 }))}`)
    console.log(`  positions only, no statics                       median ${measure(() => anglesDeg.map((a) => placeAt(cell, offset, crank, a * DEG)))}`)
  }
}
