/**
 * The tolerance analysis as the package prints it: steps (section `tolerance`), the ranked
 * contributions as a Table and the Monte Carlo histogram as plain data.
 */
import type { Step, Table } from '@/lib/contract'
import { formatNumber, texNumber } from '@/lib/units/format'
import { ISO2768_SOURCE, TOLERANCE_CLASS_NAMES } from './iso2768'
import type { HistogramBin, MonteCarloResult } from './monte-carlo'
import { CLEARANCE_ASSUMPTION, type ToleranceSetup } from './setup'
import type { WorstCase } from './worst-case'

export const TOLERANCE_SECTION = 'tolerance'

const tex = (x: number): string => texNumber(x)
const mm = (x: number): string => `${tex(x)}\\ \\text{mm}`

export const TOLERANCE_SOURCES = {
  line: 'total least squares line (principal axis of the points: Pearson, On lines and planes of closest fit, 1901)',
  worst: 'first-order worst case from sensitivities by central differences — common practice',
  rss: 'root sum of squares of the first-order contributions — common practice (statistical tolerancing)',
  monteCarlo: 'Monte Carlo; xoshiro128** (Blackman & Vigna 2018) seeded by splitmix32; normal deviates by Box–Muller (1958)',
} as const

export function toleranceSteps(setup: ToleranceSetup, wc: WorstCase, mc: MonteCarloResult | null, limit?: number): Step[] {
  const lk = setup.linkage
  const n = lk.anglesDeg.length
  const range = `${n} positions from θ = ${formatNumber(lk.anglesDeg[0])}° to ${formatNumber(lk.anglesDeg[n - 1])}°`
  const cls = setup.toleranceClass
  const lengths = setup.items.filter((i) => i.kind !== 'clearance')
  const eyes = setup.items.filter((i) => i.kind === 'clearance')
  const steps: Step[] = [
    {
      id: 'tol.class',
      section: TOLERANCE_SECTION,
      title: 'Tolerances of the link lengths',
      value: `${cls} (${TOLERANCE_CLASS_NAMES[cls]})`,
      unit: '—',
      source: ISO2768_SOURCE,
      note: `${lengths.map((i) => `${i.id} ${formatNumber(i.nominal)} ± ${formatNumber(i.plusMinus)} mm`).join('; ')}.${setup.notes.length ? ' ' + setup.notes.join(' ') : ''}`,
      verdict: 'info',
    },
    {
      id: 'tol.clearance-model',
      section: TOLERANCE_SECTION,
      title: 'Pin clearance model',
      formula: '\\Delta = \\tfrac{c}{2}, \\quad c = d_0 - d',
      substituted: eyes.length ? `c = ${[...new Set(eyes.map((e) => e.nominal))].map(tex).join(',\\ ')}\\ \\text{mm}` : 'c = 0',
      value: eyes.length ? Math.max(...eyes.map((e) => e.nominal)) / 2 : 0,
      unit: 'mm',
      source: 'assumption of this analysis; clearances from the pin and hole diameters of the inputs',
      note: CLEARANCE_ASSUMPTION,
      verdict: 'info',
    },
    {
      id: 'tol.ideal',
      section: TOLERANCE_SECTION,
      title: 'Straightness of the ideal mechanism (exact lengths, no clearance)',
      formula: '\\delta_0 = \\max_p |r_p|',
      substituted: `\\delta_0 = ${mm(wc.idealDeviation)}`,
      value: wc.idealDeviation,
      unit: 'mm',
      source: TOLERANCE_SOURCES.line,
      note: `r_p: distance of the tracer from its best-fit line at position p; ${range}.`,
      verdict: 'info',
    },
    {
      id: 'tol.with-clearance',
      section: TOLERANCE_SECTION,
      title: 'Straightness with the pin clearances, lengths exact',
      formula: '\\delta_c = \\max_p |r^0_p|',
      substituted: `\\delta_c = ${mm(wc.baseDeviation)}`,
      value: wc.baseDeviation,
      unit: 'mm',
      source: TOLERANCE_SOURCES.line,
      verdict: 'info',
    },
    {
      id: 'tol.worst-case',
      section: TOLERANCE_SECTION,
      title: 'Worst case, first order',
      formula: '\\delta_{wc} = \\max_p \\Big( |r^0_p| + \\sum_i \\Big|\\dfrac{\\partial r_p}{\\partial x_i}\\Big|\\, t_i \\Big)',
      substituted: `\\delta_{wc} = ${tex(Math.abs(wc.linear.base))} + ${tex(wc.linear.sumAbs)} = ${mm(wc.linear.deviation)} \\quad (\\theta = ${tex(wc.linear.crankDeg)}^\\circ)`,
      value: wc.linear.deviation,
      unit: 'mm',
      source: TOLERANCE_SOURCES.worst,
      note: `Largest contributions: ${wc.contributions
        .slice(0, 3)
        .map((c) => `${c.id} ${formatNumber(c.contribution)} mm`)
        .join(', ')} (table of contributions).`,
      refs: [{ stepId: 'tol.with-clearance', what: `δ_c = ${formatNumber(wc.baseDeviation)} mm` }],
      verdict: 'info',
    },
  ]
  const conf = wc.confirmed
  const ok = conf.assembled && (limit === undefined || conf.deviation <= limit)
  steps.push({
    id: 'tol.worst-confirmed',
    section: TOLERANCE_SECTION,
    title: 'Worst case confirmed at the extreme combinations of the tolerances',
    formula: '\\delta_{wc}^{*} = \\max_p\\ \\delta\\big(x^0_i + \\operatorname{sign}(r^0_p\\, \\partial r_p/\\partial x_i)\\, t_i\\big)',
    substituted: conf.assembled ? `\\delta_{wc}^{*} = ${mm(conf.deviation)}${limit !== undefined ? ` ${conf.deviation <= limit ? '\\le' : '>'} ${mm(limit)}` : ''}` : '\\text{the mechanism does not assemble}',
    value: conf.assembled ? conf.deviation : 'does not assemble',
    unit: 'mm',
    ...(limit !== undefined ? { criterion: `\\le ${mm(limit)}` } : {}),
    source: 'full kinematics at the extreme combination of each position',
    note: conf.assembled
      ? `Evaluated with the complete (not linearised) kinematics; first-order value ${formatNumber(wc.linear.deviation)} mm. Extreme combination for θ = ${formatNumber(conf.crankDeg)}°.`
      : `At the extreme combination for θ = ${formatNumber(conf.crankDeg)}° two links of the cell no longer meet: tighten the tolerances or keep the working range further from the locked positions.`,
    refs: [{ stepId: 'tol.worst-case', what: `δ_wc = ${formatNumber(wc.linear.deviation)} mm` }],
    verdict: limit === undefined ? (conf.assembled ? 'info' : 'fail') : ok ? 'pass' : 'fail',
  })
  steps.push({
    id: 'tol.rss',
    section: TOLERANCE_SECTION,
    title: 'Root-sum-square estimate',
    formula: '\\delta_{rss} = \\max_p \\Big( |r^0_p| + \\sqrt{\\textstyle\\sum_i \\big(\\frac{\\partial r_p}{\\partial x_i}\\, t_i\\big)^2} \\Big)',
    substituted: `\\delta_{rss} = ${mm(wc.rss.deviation)} \\quad (\\theta = ${tex(wc.rss.crankDeg)}^\\circ)`,
    value: wc.rss.deviation,
    unit: 'mm',
    source: TOLERANCE_SOURCES.rss,
    verdict: 'info',
  })
  if (mc) {
    const p = (q: number) => mc.percentiles.find((x) => x.p === q)!.value
    const distText =
      mc.distribution === 'normal'
        ? `normal, tolerance = ${formatNumber(mc.sigmas)}σ (common practice)${mc.truncate ? ', truncated at the tolerance' : ''}`
        : 'uniform over ± tolerance'
    steps.push({
      id: 'tol.monte-carlo',
      section: TOLERANCE_SECTION,
      title: `Monte Carlo: straightness over ${formatNumber(mc.samples)} built mechanisms`,
      formula: '\\bar\\delta,\\ s_\\delta,\\ \\delta_{99\\%}',
      substituted: `\\bar\\delta = ${mm(mc.mean)},\\ s_\\delta = ${mm(mc.sigma)},\\ \\delta_{99\\%} = ${mm(p(99))}`,
      value: p(99),
      unit: 'mm',
      source: TOLERANCE_SOURCES.monteCarlo,
      note: `Lengths ${distText}; clearances as in the clearance model; seed ${mc.seed}; ${mc.assembled} of ${mc.samples} samples assembled; largest ${formatNumber(mc.max)} mm.${mc.withinLimit ? ` ${formatNumber(100 * mc.withinLimit.fraction)} % within ${formatNumber(mc.withinLimit.limit)} mm.` : ''}`,
      refs: [{ stepId: 'tol.worst-confirmed', what: `δ*_wc = ${formatNumber(conf.deviation)} mm` }],
      verdict: 'info',
    })
  }
  return steps
}

/** The ranked contributions at the governing position of the first-order worst case. */
export function contributionsTable(wc: WorstCase): Table {
  return {
    id: 'tol.contributions',
    section: TOLERANCE_SECTION,
    title: `Contributions to the worst-case straightness deviation at θ = ${formatNumber(wc.linear.crankDeg)}°, largest first`,
    columns: [
      { key: 'rank', label: '#' },
      { key: 'item', label: 'Dimension or eye' },
      { key: 'kind', label: 'Kind' },
      { key: 'bound', label: 'Tolerance t (± or fixed shift)', unit: 'mm' },
      { key: 'sensitivity', label: '∂r/∂x', unit: '—' },
      { key: 'contribution', label: 'Contribution', unit: 'mm' },
      { key: 'share', label: 'Share', unit: '%' },
      { key: 'largest', label: 'Largest over the range', unit: 'mm' },
    ],
    rows: wc.contributions.map((c, i) => ({
      rank: i + 1,
      item: c.id,
      kind: c.kind === 'clearance' ? (c.fixed ? 'clearance (along the force)' : 'clearance (±, axis)') : c.kind,
      bound: c.fixed ? `${formatNumber(c.bound)} fixed` : `± ${formatNumber(c.bound)}`,
      sensitivity: c.sensitivity,
      contribution: c.contribution,
      share: 100 * c.share,
      largest: c.largest,
    })),
  }
}

/** Histogram bins as figure data: bin centre, width and count, in mm. */
export function histogramData(bins: HistogramBin[]): { centre: number; width: number; count: number }[] {
  return bins.map((b) => ({ centre: (b.from + b.to) / 2, width: b.to - b.from, count: b.count }))
}
