import { inversionError, linkLengthError, pathError } from '../kinematic-checks'
import { plain, tex, texp } from '../tex'
import type { Step } from '@/lib/contract'
import { caseSlugs, type ReportContext } from './context'

const EQUILIBRIUM = 'statics: equilibrium of pin-jointed bodies'

/** Steps that read the solved sweep: straightness, toggles, envelopes and the independent checks. */
export function sweepSteps(ctx: ReportContext): Step[] {
  const sweep = ctx.sweep
  if (!sweep || !ctx.verdict.path || !ctx.working) return []
  const first = sweep.cases[0]?.samples ?? []
  const w = ctx.working
  const how = {
    positions: 'the crank angles the inputs list',
    'end-stops': 'the end stops the inputs state',
    'required-stroke': `the crank angles that give the required stroke of ${plain(2 * w.half)} mm, symmetric about the mid position`,
    usable: 'the usable stroke: no working range is stated, so the full stroke short of the toggles by the margin is used',
  }[w.source]
  const line = ctx.verdict.path.kind === 'line'
  const tol = ctx.straightnessTolerance
  const steps: Step[] = [
    {
      id: 'kin.working-range',
      section: 'kinematics',
      title: 'Working range: the crank angles statics and the checks are solved over',
      formula: '\\theta_1 \\le \\theta \\le \\theta_2,\\quad h_w = \\max |y_T(\\theta)|',
      substituted: `${tex(w.crankMinDeg)}^\\circ \\le \\theta \\le ${tex(w.crankMaxDeg)}^\\circ,\\quad h_w = ${tex(w.half)}\\ \\text{mm}`,
      value: w.half,
      unit: 'mm',
      source: `inputs: ${how}`,
      note: `${sweep.cases[0]?.samples.length ?? 0} positions are solved per load case. The full range to the locked positions (±${plain(ctx.verdict.limitDeg)}°) is drawn as kinematics only.`,
    },
    {
      id: 'kin.straightness',
      section: 'kinematics',
      title: line ? 'Straightness of the tracer over the working range' : 'Straightness of the tracer over the working range (circle arc: e ≠ r)',
      formula: '\\delta = \\max_\\theta \\operatorname{dist}\\left(T(\\theta),\\ \\overline{T(\\theta_1)\\,T(\\theta_2)}\\right) \\le \\delta_{\\text{tol}}',
      substituted: `\\delta = ${tex(ctx.straightness)}\\ \\text{mm} ${ctx.straightness <= tol ? '\\le' : '>'} ${tex(tol)}\\ \\text{mm}`,
      value: ctx.straightness,
      unit: 'mm',
      criterion: `\\le ${tex(tol)}\\ \\text{mm}`,
      verdict: ctx.straightness <= tol ? 'pass' : 'fail',
      source: `geometry, over 201 positions of the working range; tolerance δ_tol from the inputs`,
      note: line ? undefined : 'The crank pivot offset e differs from the crank r: the tracer runs on a circle arc and δ is the sagitta of the arc over the working range.',
    },
  ]
  if (first.length) {
    const gmin = ctx.minTransmissionWorking
    steps.push({
      id: 'kin.transmission-angle',
      section: 'kinematics',
      title: 'Smallest transmission angle over the working range (0° = links in line)',
      formula: '\\gamma_{\\min} = \\min_\\theta \\min(\\gamma,\\ 180^\\circ - \\gamma) \\ge \\gamma_{\\text{req}}',
      substituted: `\\gamma_{\\min} = ${tex(gmin)}^\\circ ${gmin >= ctx.minTransmissionDeg ? '\\ge' : '<'} ${tex(ctx.minTransmissionDeg)}^\\circ`,
      value: gmin,
      unit: '°',
      criterion: `\\ge ${tex(ctx.minTransmissionDeg)}^\\circ`,
      verdict: gmin >= ctx.minTransmissionDeg ? 'pass' : 'fail',
      note: 'Angles at the joints the cell watches; close to 0° the cell is near a toggle and link forces grow without bound.',
      source: `geometry; γ_req from the inputs (default 30°, common practice)`,
    })
  }
  const t = sweep.toggles
  steps.push({
    id: 'kin.toggles',
    section: 'kinematics',
    title: 'Requested positions left out: out of reach or at or near a toggle',
    formula: 'n_{\\text{left out}} = 0',
    substituted: `n_{\\text{left out}} = ${t.length}`,
    value: t.length,
    unit: '—',
    criterion: '= 0',
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
  const lenTol = 1e-9 * sweep.model.lc
  steps.push(
    { id: 'ver.link-lengths', section: 'verification', title: 'Link lengths kept in every solved position', formula: '\\max_{i,j} \\left|\\,|X_i X_j| - L_{ij}\\,\\right| \\le 10^{-9} L_c', substituted: `${tex(lenErr)}\\ \\text{mm} \\le ${tex(lenTol)}\\ \\text{mm}`, value: lenErr, unit: 'mm', criterion: `\\le ${tex(lenTol)}\\ \\text{mm}`, verdict: lenErr < lenTol ? 'pass' : 'fail', source: 'geometry; tolerance 10⁻⁹ of the largest link length L_c' },
    { id: 'ver.inversion', section: 'verification', title: 'Inversion property in every solved position', formula: '\\max \\left| \\dfrac{|OP|\\,|OT|}{k} - 1 \\right| \\le 10^{-9}', substituted: `${tex(invErr)} \\le 10^{-9}`, value: invErr, unit: '—', criterion: '\\le 10^{-9}', verdict: invErr < 1e-9 ? 'pass' : 'fail', source: ctx.cell.source },
    { id: 'ver.path', section: 'verification', title: 'Tracer on its predicted line or circle in every solved position', formula: '\\max \\operatorname{dist}(T_i,\\ \\text{path}) \\le 10^{-9} L_c', substituted: `${tex(pathErr)}\\ \\text{mm} \\le ${tex(lenTol)}\\ \\text{mm}`, value: pathErr, unit: 'mm', criterion: `\\le ${tex(lenTol)}\\ \\text{mm}`, verdict: pathErr < lenTol ? 'pass' : 'fail', source: 'geometry of inversion (Coxeter, Introduction to Geometry, §6.1)' },
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
      substituted: `F = \\sqrt{${texp(load.fx)}^2 + ${texp(load.fy)}^2} = ${tex(f)}\\ \\text{N}`,
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
      substituted: `N_{\\mathrm{${name}}} = ${tex(gov.value)}\\ \\text{N at } \\theta = ${tex(gov.crankDeg)}^\\circ`,
      value: gov.value,
      unit: 'N',
      note: `Largest tension ${plain(l.maxTension.value)} N at ${plain(l.maxTension.crankDeg)}°, largest compression ${plain(l.maxCompression.value)} N at ${plain(l.maxCompression.crankDeg)}°.`,
      source: EQUILIBRIUM,
      appendix: true,
    })
    const eye = env.eyes?.[name]
    if (eye) {
      steps.push({
        id: `stat.envelope.${slug}.${name}.eye`,
        section: 'statics',
        title: `Largest force between ${name} and one of its pins, case “${c.name}”`,
        formula: `F_{\\mathrm{eye,${name}}} = \\max_{\\theta,\\,J} |\\mathbf{F}_{J \\to \\mathrm{${name}}}|`,
        substituted: `F_{\\mathrm{eye,${name}}} = ${tex(eye.value)}\\ \\text{N at } ${eye.joint},\\ \\theta = ${tex(eye.crankDeg)}^\\circ`,
        value: eye.value,
        unit: 'N',
        note: eye.across > 0 ? `The force turns across the link: up to ${plain(eye.across)} N at right angles to its axis.` : 'Along the link axis at every position (two-force member).',
        source: EQUILIBRIUM,
        appendix: true,
      })
    }
    if (l.maxMoment) {
      steps.push({ id: `stat.envelope.${slug}.${name}.moment`, section: 'statics', title: `Largest bending moment along ${name}, case “${c.name}”`, formula: `M_{\\mathrm{${name}}} = \\max |M(x, \\theta)|`, substituted: `M_{\\mathrm{${name}}} = ${tex(l.maxMoment.value)}\\ \\text{N}{\\cdot}\\text{mm at } \\theta = ${tex(l.maxMoment.crankDeg)}^\\circ`, value: l.maxMoment.value, unit: 'N·mm', source: EQUILIBRIUM, appendix: true })
    }
  }
  for (const [j, p] of Object.entries(env.pins)) {
    steps.push({ id: `stat.envelope.${slug}.pin.${j}`, section: 'statics', title: `Largest force on pin ${j} from one link, case “${c.name}”`, formula: `F_{${j}} = \\max |\\mathbf{F}_{${j}}|`, substituted: `F_{${j}} = ${tex(p.value)}\\ \\text{N at } \\theta = ${tex(p.crankDeg)}^\\circ`, value: p.value, unit: 'N', source: EQUILIBRIUM, appendix: true })
  }
  steps.push({ id: `stat.envelope.${slug}.torque`, section: 'statics', title: `Largest drive torque, case “${c.name}” (counter-clockwise positive)`, formula: '\\tau = \\max |\\tau(\\theta)|', substituted: `\\tau = ${tex(env.driveTorque.value)}\\ \\text{N}{\\cdot}\\text{mm at } \\theta = ${tex(env.driveTorque.crankDeg)}^\\circ`, value: env.driveTorque.value, unit: 'N·mm', source: EQUILIBRIUM, appendix: true })
  const scale = f + (ctx.selfWeight ? ctx.selfWeight.perMm * sweep.model.links.reduce((s, l) => s + l.stations[l.stations.length - 1], 0) : 0)
  const residual = Math.max(0, ...c.samples.map((s) => s.residual)) / (scale || 1)
  steps.push({ id: `ver.equilibrium.${slug}`, section: 'verification', title: `Equilibrium of every body, recomputed from the results, case “${c.name}”`, formula: '\\max \\dfrac{|\\sum \\mathbf{F}|,\\ |\\sum M|/L_c}{F_{\\text{applied}}} \\le 10^{-9}', substituted: `${tex(residual)} \\le 10^{-9}`, value: residual, unit: '—', criterion: '\\le 10^{-9}', verdict: residual < 1e-9 ? 'pass' : 'fail', source: `${EQUILIBRIUM}; tolerance 10⁻⁹ of the applied load` })
  let worst = c.samples[0]
  for (const s of c.samples) if (s.vwError > worst.vwError) worst = s
  const err = worst ? worst.vwError : 0
  steps.push({
    id: `ver.virtual-work.${slug}`,
    section: 'verification',
    title: `Drive torque by virtual work against equilibrium, case “${c.name}”`,
    formula: '\\tau\\,\\delta\\theta + \\sum_i \\mathbf{F}_i \\cdot \\delta\\mathbf{X}_i = 0,\\quad \\dfrac{|\\tau_{\\text{eq}} - \\tau_{\\text{vw}}|}{\\tau_{\\text{ref}}} \\le 10^{-6}',
    substituted: worst ? `\\tau_{\\text{eq}} = ${tex(worst.position.driveTorque)}\\ \\text{N}{\\cdot}\\text{mm},\\ \\tau_{\\text{vw}} = ${tex(worst.vwTorque)}\\ \\text{N}{\\cdot}\\text{mm at } \\theta = ${tex(worst.position.crankDeg)}^\\circ;\\ ${tex(err)} \\le 10^{-6}` : '\\text{no position}',
    value: err,
    unit: '—',
    criterion: '\\le 10^{-6}',
    verdict: err <= 1e-6 ? 'pass' : 'fail',
    note: 'δX from the solved positions by central differences; the largest relative difference over the working range is shown.',
    source: 'principle of virtual work; tolerance 10⁻⁶ relative',
  })
  return steps
}
