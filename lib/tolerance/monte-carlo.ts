/**
 * Monte Carlo of the straightness deviation: every random item drawn per sample (normal with the
 * tolerance at `sigmas`·σ, 3σ by default — common practice — or uniform over ±t), the perturbed
 * mechanism solved at every position, the deviation from the best-fit line kept in a Float64Array.
 * Eyes with a known force direction keep their fixed shift c/2 in every sample. The stream is seeded
 * (lib/tolerance/prng), so a seed reproduces the run exactly, whatever the chunk size.
 */
import { scratchFor, solvePositions, type Effect } from './kinematics'
import { createRng } from './prng'
import { baseValues, ToleranceInputError, type ToleranceSetup } from './setup'
import { deviationOf } from './straightness'

export type Distribution = 'normal' | 'uniform'

export interface MonteCarloOptions {
  /** Number of samples (mechanisms built). */
  samples: number
  /** Seed of the random stream (default 1). */
  seed?: number
  /** Distribution of every length tolerance (default normal); eyes with an unknown force direction default to uniform. */
  distribution?: Distribution
  /** Per item id: its own distribution. */
  perItem?: Record<string, Distribution>
  /** Normal: the tolerance is this many σ (default 3 — common practice). */
  sigmas?: number
  /** Normal: draws beyond ±t are drawn again, so no sample leaves its tolerance (default false). */
  truncate?: boolean
  /** Histogram bins between the smallest and largest deviation (default 30). */
  bins?: number
  /** Straightness limit, mm: the share of samples within it is reported. */
  limit?: number
  /** Keep every sample's deviation in the result (Float64Array). */
  keepSamples?: boolean
  /** Called after every chunk with the samples done so far. */
  onProgress?: (done: number, total: number) => void
  signal?: AbortSignal
  /** Samples between progress calls and abort checks (default 2000). */
  chunk?: number
}

export interface HistogramBin {
  from: number
  to: number
  count: number
}

export interface MonteCarloResult {
  samples: number
  seed: number
  distribution: Distribution
  sigmas: number
  truncate: boolean
  /** Samples whose mechanism assembled at every position; the statistics are over these. */
  assembled: number
  mean: number
  /** Sample standard deviation (n − 1), mm. */
  sigma: number
  min: number
  max: number
  /** Linear interpolation between order statistics. */
  percentiles: { p: number; value: number }[]
  histogram: HistogramBin[]
  withinLimit?: { limit: number; count: number; fraction: number }
  deviations?: Float64Array
}

export const PERCENTILES = [50, 90, 95, 99, 99.9] as const

/** One run's state: draw and solve samples [from, to) into `out`. */
function runner(setup: ToleranceSetup, opts: MonteCarloOptions) {
  const lk = setup.linkage
  const n = lk.anglesDeg.length
  const sigmas = opts.sigmas ?? 3
  if (!(sigmas > 0)) throw new Error('sigmas must be positive')
  const truncate = opts.truncate ?? false
  const dist = opts.distribution ?? 'normal'
  const unknown = Object.keys(opts.perItem ?? {}).find((k) => !setup.items.some((it) => it.id === k))
  if (unknown) throw new ToleranceInputError(`distributions.${unknown}`, `no dimension "${unknown}"; the dimensions are ${setup.items.filter((it) => it.kind !== 'clearance').map((it) => it.id).join(', ')}`)
  const rng = createRng(opts.seed ?? 1)
  // Random items only, with their effects; fixed shifts are folded into per-position offsets once.
  const randomIdx: number[] = []
  setup.items.forEach((it, i) => {
    if (it.fixed === null && it.plusMinus > 0) randomIdx.push(i)
  })
  const effects: Effect[] = randomIdx.map((i) => setup.effects[i])
  const bounds = Float64Array.from(randomIdx, (i) => setup.items[i].plusMinus)
  const uniformFlags = Uint8Array.from(randomIdx, (i) => {
    const it = setup.items[i]
    const d = opts.perItem?.[it.id] ?? (it.kind === 'clearance' ? 'uniform' : dist)
    return d === 'uniform' ? 1 : 0
  })
  // Fixed shifts (eyes with a known force direction): the same in every sample, so added once per position.
  const base = baseValues(setup)
  const fixedIdx = setup.items.map((it, i) => (it.fixed !== null ? i : -1)).filter((i) => i >= 0)
  const len = lk.baseLocal.length
  let offsets: Float64Array | undefined
  if (fixedIdx.length > 0) {
    offsets = new Float64Array(n * len)
    for (let p = 0; p < n; p++) {
      for (const i of fixedIdx) {
        const ef = setup.effects[i]
        if (ef.mode !== 'direction') continue
        offsets[p * len + 2 * ef.point] += base[i] * ef.dirs[2 * p]
        offsets[p * len + 2 * ef.point + 1] += base[i] * ef.dirs[2 * p + 1]
      }
    }
  }
  const s = scratchFor(lk)
  const xs = new Float64Array(n)
  const ys = new Float64Array(n)
  const values = new Float64Array(randomIdx.length)
  const draw = (k: number): number => {
    const t = bounds[k]
    if (uniformFlags[k]) return t * (2 * rng.uniform() - 1)
    let z = rng.normal()
    if (truncate) while (Math.abs(z) > sigmas) z = rng.normal()
    return (t / sigmas) * z
  }
  return {
    sigmas,
    truncate,
    dist,
    run(from: number, to: number, out: Float64Array): void {
      for (let k = from; k < to; k++) {
        for (let v = 0; v < values.length; v++) values[v] = draw(v)
        out[k] = solvePositions(lk, effects, values, s, xs, ys, offsets) ? deviationOf(xs, ys, n) : Number.NaN
      }
    },
  }
}

function summarise(out: Float64Array, opts: MonteCarloOptions, r: { sigmas: number; truncate: boolean; dist: Distribution }): MonteCarloResult {
  const ok = out.filter((v) => !Number.isNaN(v))
  const count = ok.length
  let mean = 0
  for (let i = 0; i < count; i++) mean += ok[i]
  mean = count ? mean / count : Number.NaN
  let ss = 0
  for (let i = 0; i < count; i++) ss += (ok[i] - mean) * (ok[i] - mean)
  const sorted = ok.slice().sort()
  const min = count ? sorted[0] : Number.NaN
  const max = count ? sorted[count - 1] : Number.NaN
  const pct = (p: number): number => {
    if (!count) return Number.NaN
    const h = (count - 1) * (p / 100)
    const lo = Math.floor(h)
    return sorted[lo] + (h - lo) * ((sorted[Math.min(lo + 1, count - 1)] ?? sorted[lo]) - sorted[lo])
  }
  const bins = opts.bins ?? 30
  const width = count ? (max - min) / bins || 1e-12 : 0
  const histogram: HistogramBin[] = Array.from({ length: count ? bins : 0 }, (_, b) => ({ from: min + b * width, to: min + (b + 1) * width, count: 0 }))
  for (let i = 0; i < count; i++) histogram[Math.min(bins - 1, Math.floor((sorted[i] - min) / width))].count++
  const limit = opts.limit
  let within = 0
  if (limit !== undefined) for (let i = 0; i < count; i++) if (sorted[i] <= limit) within++
  return {
    samples: out.length,
    seed: opts.seed ?? 1,
    distribution: r.dist,
    sigmas: r.sigmas,
    truncate: r.truncate,
    assembled: count,
    mean,
    sigma: count > 1 ? Math.sqrt(ss / (count - 1)) : 0,
    min,
    max,
    percentiles: PERCENTILES.map((p) => ({ p, value: pct(p) })),
    histogram,
    ...(limit !== undefined ? { withinLimit: { limit, count: within, fraction: count ? within / count : 0 } } : {}),
    ...(opts.keepSamples ? { deviations: out } : {}),
  }
}

function check(opts: MonteCarloOptions): number {
  if (!Number.isInteger(opts.samples) || opts.samples < 1) throw new Error('samples must be a whole number of at least 1')
  return Math.max(1, Math.floor(opts.chunk ?? 2000))
}

/** The whole run in one call (abort and progress are looked at between chunks). */
export function monteCarlo(setup: ToleranceSetup, opts: MonteCarloOptions): MonteCarloResult {
  const chunk = check(opts)
  const r = runner(setup, opts)
  const out = new Float64Array(opts.samples)
  for (let from = 0; from < opts.samples; from += chunk) {
    opts.signal?.throwIfAborted()
    const to = Math.min(opts.samples, from + chunk)
    r.run(from, to, out)
    opts.onProgress?.(to, opts.samples)
  }
  return summarise(out, opts, r)
}

/**
 * The same run, giving the event loop a turn between chunks so a progress display can update and an
 * AbortSignal fired from elsewhere (a Cancel button, a closed request) stops it. Same numbers as
 * `monteCarlo` for the same seed.
 */
export async function monteCarloAsync(setup: ToleranceSetup, opts: MonteCarloOptions & { yieldTo?: () => Promise<void> }): Promise<MonteCarloResult> {
  const chunk = check(opts)
  const r = runner(setup, opts)
  const out = new Float64Array(opts.samples)
  const pause = opts.yieldTo ?? (() => new Promise<void>((resolve) => setTimeout(resolve, 0)))
  for (let from = 0; from < opts.samples; from += chunk) {
    opts.signal?.throwIfAborted()
    const to = Math.min(opts.samples, from + chunk)
    r.run(from, to, out)
    opts.onProgress?.(to, opts.samples)
    await pause()
  }
  opts.signal?.throwIfAborted()
  return summarise(out, opts, r)
}
