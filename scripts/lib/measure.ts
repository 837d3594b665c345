/** Timing for the bench scripts: medians of wall and CPU time, since wall time swings when the two cores are shared. */

export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

/** Median wall and CPU ms of `fn` over `runs` runs, after `warm` runs that are not counted. */
export function measure(fn: () => unknown, warm: number, runs: number): { wall: number; cpu: number } {
  for (let i = 0; i < warm; i++) fn()
  const wall: number[] = []
  const cpu: number[] = []
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now()
    const c0 = process.cpuUsage()
    fn()
    const c = process.cpuUsage(c0)
    wall.push(performance.now() - t0)
    cpu.push((c.user + c.system) / 1000)
  }
  return { wall: median(wall), cpu: median(cpu) }
}
