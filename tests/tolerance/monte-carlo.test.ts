import { describe, expect, it } from 'vitest'
import {
  analyseTolerances,
  createRng,
  evaluatePath,
  eyeForcesFromLoad,
  monteCarlo,
  monteCarloAsync,
  residualsOf,
  scratchFor,
  worstCase,
} from '@/lib/tolerance'
import { only, PEAUCELLIER, RANGE } from './fixtures'

const N = 20_000

describe('Monte Carlo against the first-order worst case, worked by hand', () => {
  // One tolerance on one length, small enough to be linear: at the ideal cell r⁰ = 0, so the deviation
  // is |δ|·K with K = max_p |∂r_p/∂x|, and the first-order worst case is K·t.
  const t = 0.01
  const setup = only(PEAUCELLIER, { AP: t })
  const wc = worstCase(setup)
  const K = wc.linear.deviation / t

  it('the worst case is |∂r/∂x|·t, confirmed at the extreme length within linearisation error', () => {
    expect(wc.idealDeviation).toBeLessThan(1e-9)
    expect(K).toBeGreaterThan(0.01)
    expect(Math.abs(wc.confirmed.deviation - wc.linear.deviation) / wc.linear.deviation).toBeLessThan(1e-3)
  })

  it('uniform ±t: |δ| is uniform on [0, t], so mean = K·t/2 and σ = K·t/√12 (uniform distribution: statistics textbook)', () => {
    const mc = monteCarlo(setup, { samples: N, seed: 3, distribution: 'uniform' })
    // Standard error of the mean ≈ σ/√N ≈ 0.2 % of the mean here; 1.5 % leaves room for nonlinearity.
    expect(Math.abs(mc.mean / (wc.linear.deviation / 2) - 1)).toBeLessThan(0.015)
    expect(Math.abs(mc.sigma / (wc.linear.deviation / Math.sqrt(12)) - 1)).toBeLessThan(0.02)
  })

  it('normal with t = 3σ (common practice): |δ| is half-normal, mean = σK√(2/π), spread σK√(1 − 2/π) (half-normal distribution: statistics textbook)', () => {
    const mc = monteCarlo(setup, { samples: N, seed: 4, distribution: 'normal', sigmas: 3 })
    const s = (K * t) / 3
    expect(Math.abs(mc.mean / (s * Math.sqrt(2 / Math.PI)) - 1)).toBeLessThan(0.015)
    expect(Math.abs(mc.sigma / (s * Math.sqrt(1 - 2 / Math.PI)) - 1)).toBeLessThan(0.02)
  })

  it('two tolerances: the signed deviation at one position has σ = √Σ(s_i t_i)²/√3 for uniform draws (variance of a sum of independent variables; RSS — common practice)', () => {
    const two = only(PEAUCELLIER, { AP: 0.01, OA: 0.02 })
    const w = worstCase(two)
    const p = w.linear.position
    const iAP = two.items.findIndex((i) => i.id === 'AP')
    const iOA = two.items.findIndex((i) => i.id === 'OA')
    const rss = Math.hypot(w.sensitivities[iAP][p] * 0.01, w.sensitivities[iOA][p] * 0.02)
    // The root-sum-square step adds √Σ(s t)² to |r⁰| (= 0 here).
    expect(w.rss.deviation).toBeGreaterThanOrEqual(rss - 1e-12)
    const rng = createRng(11)
    const lk = two.linkage
    const n = lk.anglesDeg.length
    const xs = new Float64Array(n)
    const ys = new Float64Array(n)
    const res = new Float64Array(n)
    const s = scratchFor(lk)
    const v = new Float64Array(two.items.length)
    let sum = 0
    let sum2 = 0
    for (let k = 0; k < N; k++) {
      v[iAP] = 0.01 * (2 * rng.uniform() - 1)
      v[iOA] = 0.02 * (2 * rng.uniform() - 1)
      evaluatePath(two, v, s, xs, ys)
      residualsOf(xs, ys, n, 1, 0, res)
      sum += res[p]
      sum2 += res[p] * res[p]
    }
    const mean = sum / N
    const sigma = Math.sqrt(sum2 / N - mean * mean)
    expect(Math.abs(sigma / (rss / Math.sqrt(3)) - 1)).toBeLessThan(0.02)
  })
})

describe('Monte Carlo: reproducible, bounded by the worst case, cancellable', () => {
  const forces = eyeForcesFromLoad(PEAUCELLIER, RANGE, { fx: 20, fy: 150 })
  const setup = only(PEAUCELLIER, { OA: 0.05, OB: 0.05, AP: 0.05, BP: 0.05, AT: 0.05, BT: 0.05, CP: 0.05, 'frame:OC': 0.05 }, { clearances: { A: 0.04, B: 0.04, P: 0.04, T: 0.04 }, eyeForces: forces })

  it('the same seed gives the same samples, whatever the chunk size; another seed others', () => {
    const a = monteCarlo(setup, { samples: 3000, seed: 5, keepSamples: true })
    const b = monteCarlo(setup, { samples: 3000, seed: 5, keepSamples: true, chunk: 7 })
    const c = monteCarlo(setup, { samples: 3000, seed: 6, keepSamples: true })
    expect(Array.from(b.deviations!)).toEqual(Array.from(a.deviations!))
    expect(b.mean).toBe(a.mean)
    expect(c.mean).not.toBe(a.mean)
  })

  it('the confirmed worst case is not exceeded by any uniform or truncated-normal sample (up to linearisation error)', () => {
    const wc = worstCase(setup)
    for (const opts of [{ distribution: 'uniform' as const }, { distribution: 'normal' as const, truncate: true }]) {
      const mc = monteCarlo(setup, { samples: N, seed: 9, ...opts })
      expect(mc.assembled).toBe(N)
      expect(mc.max).toBeLessThanOrEqual(wc.confirmed.deviation * (1 + 1e-3))
      expect(mc.max).toBeLessThanOrEqual(wc.linear.deviation * 1.01)
      expect(mc.min).toBeGreaterThanOrEqual(0)
    }
  })

  it('zero tolerances and zero clearance: every sample is the ideal cell, deviation ≈ 0 (Peaucellier 1864)', () => {
    const mc = monteCarlo(only(PEAUCELLIER, {}), { samples: 200, seed: 1 })
    expect(mc.max).toBeLessThan(1e-9)
  })

  it('statistics hang together: histogram counts sum to the samples, percentiles rise, the share within a limit is counted', () => {
    const mc = monteCarlo(setup, { samples: 5000, seed: 2, bins: 20, limit: 0.05, keepSamples: true })
    expect(mc.histogram).toHaveLength(20)
    expect(mc.histogram.reduce((s, b) => s + b.count, 0)).toBe(5000)
    const v = mc.percentiles.map((p) => p.value)
    expect([...v].sort((x, y) => x - y)).toEqual(v)
    expect(mc.min).toBeLessThanOrEqual(v[0])
    expect(mc.max).toBeGreaterThanOrEqual(v[v.length - 1])
    expect(mc.withinLimit!.count).toBe(Array.from(mc.deviations!).filter((d) => d <= 0.05).length)
  })

  it('reports progress and stops when its AbortSignal fires', () => {
    const seen: number[] = []
    const ac = new AbortController()
    expect(() =>
      monteCarlo(setup, {
        samples: 10_000,
        chunk: 1000,
        signal: ac.signal,
        onProgress: (done) => {
          seen.push(done)
          if (done >= 3000) ac.abort()
        },
      }),
    ).toThrow(/abort/i)
    expect(seen).toEqual([1000, 2000, 3000])
  })

  it('the asynchronous run gives the sync run\'s numbers and can be cancelled from outside', async () => {
    const sync = monteCarlo(setup, { samples: 2000, seed: 8 })
    const asyncRun = await monteCarloAsync(setup, { samples: 2000, seed: 8, chunk: 300 })
    expect(asyncRun).toEqual(sync)
    const ac = new AbortController()
    const running = monteCarloAsync(setup, { samples: 1_000_000, chunk: 500, signal: ac.signal })
    setTimeout(() => ac.abort(), 20)
    await expect(running).rejects.toThrow(/abort/i)
  })

  it('analyseTolerances bundles the worst case, the Monte Carlo run, steps, the ranked table and the histogram', () => {
    const r = analyseTolerances({
      model: PEAUCELLIER,
      workingRange: RANGE,
      toleranceClass: 'f',
      clearances: { A: 0.04 },
      eyeForces: forces,
      limit: 0.1,
      monteCarlo: { samples: 2000, seed: 1 },
    })
    expect(r.steps.map((s) => s.id)).toEqual(['tol.class', 'tol.clearance-model', 'tol.ideal', 'tol.with-clearance', 'tol.worst-case', 'tol.worst-confirmed', 'tol.rss', 'tol.monte-carlo'])
    expect(r.steps.every((s) => s.section === 'tolerance')).toBe(true)
    expect(r.steps.find((s) => s.id === 'tol.worst-confirmed')!.verdict).toBe(r.worstCase.confirmed.deviation <= 0.1 ? 'pass' : 'fail')
    const contrib = r.table.rows.map((row) => Math.abs(row.contribution as number))
    expect([...contrib].sort((a, b) => b - a)).toEqual(contrib)
    // The random items' contributions add up to the first-order worst case less |r⁰| (its definition).
    const random = r.worstCase.contributions.filter((c) => !c.fixed).reduce((s, c) => s + c.contribution, 0)
    expect(random).toBeCloseTo(r.worstCase.linear.sumAbs, 12)
    expect(r.histogram.reduce((s, b) => s + b.count, 0)).toBe(2000)
    expect(r.steps[0].source).toMatch(/from memory/)
  })
})
