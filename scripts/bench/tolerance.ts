/**
 * Tolerance Monte Carlo: 100,000 samples × 50 positions of the perturbed kinematics (each sample a
 * mechanism with its own link lengths, solved at every position by circle intersections, then its
 * straightness from the best-fit line), wall and CPU time, beside the closed-form ideal positions
 * (`placeAt`, the engine's positions-only path) for the same 5,000,000 positions as a yardstick.
 * The machine is shared: the load average is printed beside the figures.
 */
import { loadavg } from 'node:os'
import { runMechanism, type MechanismInput } from '@/lib/calc/mechanism'
import { placeAt } from '@/lib/linkage/crank'
import { DEG } from '@/lib/linkage/vec'
import { mechanismComponents } from '@/lib/mechanisms'
import { eyeForcesFromLoad, monteCarlo, prepareTolerance, toleranceModelFor } from '@/lib/tolerance'
import { measure } from '../lib/measure'

const SAMPLES = 100_000
const POSITIONS = 50
const RUNS = 3

const CASES: MechanismInput[] = [
  { mechanism: 'peaucellier', geometry: { arm: 250, side: 100, crank: 100 }, loads: [{ name: 'push', fx: 0, fy: 150 }] },
  { mechanism: 'hart', geometry: { long: 240, short: 100, ratio: 0.3, crank: 40 }, loads: [{ name: 'push', fx: 0, fy: 150 }] },
]


const load = () => loadavg().map((x) => x.toFixed(2)).join(' / ')
const fmt = (t: { wall: number; cpu: number }) => `${(t.wall / 1000).toFixed(3)} s (cpu ${(t.cpu / 1000).toFixed(3)} s)`

export default function bench(): void {
  console.log(`load average (1 / 5 / 15 min) before: ${load()}`)
  for (const input of CASES) {
    const res = runMechanism(input)
    const wr = res.workingRange!
    const model = toleranceModelFor(input.mechanism, input.geometry)
    // Class m lengths, 0.05 mm clearance on every pin, pushed along the pin forces of the load case.
    const setup = prepareTolerance({
      model,
      workingRange: wr,
      positions: POSITIONS,
      toleranceClass: 'm',
      clearances: Object.fromEntries(mechanismComponents(input.mechanism).joints.map((j) => [j, 0.05])),
      eyeForces: eyeForcesFromLoad(model, wr, input.loads[0], POSITIONS),
    })
    monteCarlo(setup, { samples: 5000, seed: 7 }) // warm-up
    let mean = 0
    const mc = measure(() => (mean = monteCarlo(setup, { samples: SAMPLES, seed: 1 }).mean), 0, RUNS)
    const angles = setup.linkage.anglesDeg
    const { cell, crank, offset } = model
    const ideal = measure(() => {
      let sink = 0
      for (let s = 0; s < SAMPLES; s++) {
        for (let p = 0; p < POSITIONS; p++) sink += placeAt(cell, offset, crank, angles[p] * DEG)!.T.y
      }
      return sink
    }, 0, RUNS)
    const random = setup.items.filter((i) => i.fixed === null && i.plusMinus > 0).length
    console.log(`${input.mechanism}: ${SAMPLES.toLocaleString('en')} samples × ${POSITIONS} positions, ${random} random tolerances, ${setup.items.length - random} clearance shifts (mean deviation ${mean.toFixed(4)} mm)`)
    console.log(`  Monte Carlo, perturbed kinematics + straightness   median of ${RUNS}: ${fmt(mc)}`)
    console.log(`  closed-form ideal positions (placeAt), same count  median of ${RUNS}: ${fmt(ideal)}`)
    console.log(`  ratio Monte Carlo / closed form: ${(mc.wall / ideal.wall).toFixed(2)} (wall), ${(mc.cpu / ideal.cpu).toFixed(2)} (cpu)`)
    console.log(`  load average after: ${load()}`)
  }
}

// Run directly (`npx tsx scripts/bench/tolerance.ts`) as well as through scripts/bench.ts.
if (import.meta.url === `file://${process.argv[1]}`) bench()
