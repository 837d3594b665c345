/** Median time of a 1,000-position sweep with statics, per cell. */
import { runMechanism, type MechanismInput } from '@/lib/calc/mechanism'

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

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

export default function bench(): void {
  for (const input of CASES) {
    for (let i = 0; i < 5; i++) runMechanism(input) // warm-up for the JIT
    const times: number[] = []
    const cpu: number[] = []
    let positions = 0
    for (let i = 0; i < 25; i++) {
      const t0 = performance.now()
      const c0 = process.cpuUsage()
      positions = runMechanism(input).positions.length
      const c = process.cpuUsage(c0)
      times.push(performance.now() - t0)
      cpu.push((c.user + c.system) / 1000)
    }
    // CPU time as well: wall time swings when other jobs share the two cores.
    console.log(`${input.mechanism}: ${positions} positions with statics, median ${median(times).toFixed(2)} ms (cpu ${median(cpu).toFixed(2)} ms)`)
  }
}
