import { inversionError, linkLengthError, pathError } from '../kinematic-checks'
import { plain, tex } from '../tex'
import type { Step } from '@/lib/contract'
import { caseSlugs, type ReportContext } from './context'

const EQUILIBRIUM = 'statics: equilibrium of pin-jointed bodies'

/** Steps that read the solved sweep: straightness, toggles, envelopes and the independent checks. */
export function sweepSteps(ctx: ReportContext): Step[] {
  const sweep = ctx.sweep
  if (!sweep || !ctx.verdict.path) return []
  const first = sweep.cases[0]?.samples ?? []
  const steps: Step[] = [
    {
      id: 'kin.straightness',
      section: 'kinematics',
      title: 'Straightness: largest distance of the solved tracer positions from the chord through the end positions',
      formula: '\\delta = \\max_i \\operatorname{dist}(T_i,\\ \\overline{T_{\\text{first}}\\,T_{\\text{last}}})',
      substituted: `\\delta = ${tex(ctx.straightness)}`,
      value: ctx.straightness,
      unit: 'mm',
      verdict: ctx.verdict.path.kind === 'line' ? 'pass' : 'info',
      source: 'geometry, measured on the solved positions',
    },
  ]
  if (first.length) {
    const minAngle = Math.min(...first.map((s) => s.position.transmissionAngleDeg ?? 90))
    steps.push({
      id: 'kin.transmission-angle',
      section: 'kinematics',
      title: 'Smallest transmission angle over the sweep (0° = links in line)',
      formula: '\\gamma_{\\min} = \\min_i \\min(\\gamma_i,\\ 180^\\circ - \\gamma_i)',
      substituted: `\\gamma_{\\min} = ${tex(minAngle, 4)}^\\circ`,
      value: minAngle,
      unit: '°',
      verdict: minAngle < 15 ? 'warn' : 'pass',
      note: 'Below about 15° the cell is close to a toggle and forces grow fast (common practice).',
      source: 'common practice',
    })
  }
  const t = sweep.toggles
  steps.push({
    id: 'kin.toggles',
    section: 'kinematics',
    title: 'Requested positions left out: out of reach or at or near a toggle',
    value: t.length,
    unit: '—',
    verdict: t.length ? 'warn' : 'pass',
    note: t.length
      ? t.map((x) => `${plain(x.crankDeg)}° (${x.reason}${x.amplification ? `, ${plain(x.amplification)} N per N` : ''})`).join('; ')
      : `No position met a singular equilibrium matrix or a force amplification above ${plain(ctx.amplificationLimit)} N per N of tracer load.`,
    source: EQUILIBRIUM,
  })
  let lenErr = 0
  let invErr = 0
  let pathErr = 0
  for (const s of first) {
    lenErr = Math.max(lenErr, linkLengthError(sweep.model, s.position.joints))
    invErr = Math.max(invErr, inversionError(ctx.cell.k, s.position.joints))
    pathErr = Math.max(pathErr, pathError(ctx.verdict.path, s.position.tracer))
  }
  steps.push(
    { id: 'ver.link-lengths', section: 'verification', title: 'Link lengths kept in every solved position', formula: '\\max |\\,|X_i X_j| - L_{ij}\\,|', substituted: `${tex(lenErr)}`, value: lenErr, unit: 'mm', verdict: lenErr < 1e-9 * sweep.model.lc ? 'pass' : 'fail', source: 'geometry' },
    { id: 'ver.inversion', section: 'verification', title: 'Inversion property in every solved position', formula: '\\max \\left| \\dfrac{|OP|\\,|OT|}{k} - 1 \\right|', substituted: `${tex(invErr)}`, value: invErr, unit: '—', verdict: invErr < 1e-9 ? 'pass' : 'fail', source: ctx.cell.source },
    { id: 'ver.path', section: 'verification', title: 'Tracer on its predicted line or circle in every solved position', formula: '\\max \\operatorname{dist}(T_i,\\ \\text{path})', substituted: `${tex(pathErr)}`, value: pathErr, unit: 'mm', verdict: pathErr < 1e-9 * sweep.model.lc ? 'pass' : 'fail', source: 'geometry of inversion (Coxeter, Introduction to Geometry, §6.1)' },
  )
  const slugs = caseSlugs(sweep.cases.map((c) => c.name))
  sweep.cases.forEach((c, i) => steps.push(...caseSteps(ctx, i, slugs[i])))
  return steps
}

function caseSteps(ctx: ReportContext, i: number, slug: string): Step[] {
  const sweep = ctx.sweep!
  const c = sweep.cases[i]
  const load = ctx.loads[i]
  const env = ctx.envelopes[i]
  const f = Math.hypot(load.fx, load.fy)
  const steps: Step[] = [
    {
      id: `stat.load.${slug}`,
      section: 'statics',
      title: `Load at the tracer, case “${c.name}”`,
      formula: 'F = \\sqrt{F_x^2 + F_y^2}',
      substituted: `F = \\sqrt{${tex(load.fx)}^2 + ${tex(load.fy)}^2} = ${tex(f)}`,
      value: f,
      unit: 'N',
      source: 'input',
    },
  ]
  for (const [name, l] of Object.entries(env.links)) {
    const gov = l.maxTension.value >= -l.maxCompression.value ? l.maxTension : l.maxCompression
    steps.push({
      id: `stat.envelope.${slug}.${name}`,
      section: 'statics',
      title: `Axial force in ${name}, case “${c.name}” (tension positive)`,
      formula: `N_{\\mathrm{${name}}} = \\max |N(\\theta)|`,
      substituted: `N_{\\mathrm{${name}}} = ${tex(gov.value)} \\text{ at } \\theta = ${tex(gov.crankDeg, 4)}^\\circ`,
      value: gov.value,
      unit: 'N',
      note: `Largest tension ${plain(l.maxTension.value)} N at ${plain(l.maxTension.crankDeg)}°, largest compression ${plain(l.maxCompression.value)} N at ${plain(l.maxCompression.crankDeg)}°.`,
      source: EQUILIBRIUM,
    })
    if (l.maxMoment) {
      steps.push({ id: `stat.envelope.${slug}.${name}.moment`, section: 'statics', title: `Largest bending moment along ${name}, case “${c.name}”`, formula: `M_{\\mathrm{${name}}} = \\max |M(x, \\theta)|`, substituted: `M_{\\mathrm{${name}}} = ${tex(l.maxMoment.value)} \\text{ at } \\theta = ${tex(l.maxMoment.crankDeg, 4)}^\\circ`, value: l.maxMoment.value, unit: 'N·mm', source: EQUILIBRIUM })
    }
  }
  for (const [j, p] of Object.entries(env.pins)) {
    steps.push({ id: `stat.envelope.${slug}.pin.${j}`, section: 'statics', title: `Largest force on pin ${j} from one link, case “${c.name}”`, formula: `F_{${j}} = \\max |\\mathbf{F}_{${j}}|`, substituted: `F_{${j}} = ${tex(p.value)} \\text{ at } \\theta = ${tex(p.crankDeg, 4)}^\\circ`, value: p.value, unit: 'N', source: EQUILIBRIUM })
  }
  steps.push({ id: `stat.envelope.${slug}.torque`, section: 'statics', title: `Largest drive torque, case “${c.name}” (counter-clockwise positive)`, formula: '\\tau = \\max |\\tau(\\theta)|', substituted: `\\tau = ${tex(env.driveTorque.value)} \\text{ at } \\theta = ${tex(env.driveTorque.crankDeg, 4)}^\\circ`, value: env.driveTorque.value, unit: 'N·mm', source: EQUILIBRIUM })
  const scale = f + (ctx.selfWeight ? ctx.selfWeight.perMm * sweep.model.links.reduce((s, l) => s + l.stations[l.stations.length - 1], 0) : 0)
  const residual = Math.max(0, ...c.samples.map((s) => s.residual)) / (scale || 1)
  steps.push({ id: `ver.equilibrium.${slug}`, section: 'verification', title: `Equilibrium of every body, recomputed from the results, case “${c.name}”`, formula: '\\max \\dfrac{|\\sum \\mathbf{F}|,\\ |\\sum M|/L_c}{F_{\\text{applied}}}', substituted: `${tex(residual)}`, value: residual, unit: '—', verdict: residual < 1e-9 ? 'pass' : 'fail', source: EQUILIBRIUM })
  let worst = c.samples[0]
  for (const s of c.samples) if (s.vwError > worst.vwError) worst = s
  const err = worst ? worst.vwError : 0
  steps.push({
    id: `ver.virtual-work.${slug}`,
    section: 'verification',
    title: `Drive torque by virtual work against equilibrium, case “${c.name}”`,
    formula: '\\tau\\,\\delta\\theta + \\sum_i \\mathbf{F}_i \\cdot \\delta\\mathbf{X}_i = 0',
    substituted: worst ? `\\tau_{\\text{eq}} = ${tex(worst.position.driveTorque)},\\ \\tau_{\\text{vw}} = ${tex(worst.vwTorque)} \\text{ at } \\theta = ${tex(worst.position.crankDeg, 4)}^\\circ` : '\\text{no position}',
    value: err,
    unit: '—',
    verdict: err <= 1e-6 ? 'pass' : 'fail',
    note: 'δX from the solved positions by central differences; the largest relative difference over the sweep is shown.',
    source: 'principle of virtual work',
  })
  return steps
}
