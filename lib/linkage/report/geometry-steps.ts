import { tex } from '../tex'
import type { Step } from '@/lib/contract'
import type { ReportContext } from './context'

const INVERSION = 'geometry of inversion (Coxeter, Introduction to Geometry, §6.1)'

/** Geometry and kinematics steps: what the cell is, and where the tracer goes. */
export function geometrySteps(ctx: ReportContext): Step[] {
  const { cell, verdict: v, crank: r, offset: e } = ctx
  const steps: Step[] = [
    { id: 'geo.inversion-constant', section: 'geometry', title: 'Inversion constant', ...cell.tex.k, value: cell.k, unit: 'mm²', source: cell.source },
  ]
  if (cell.invalid) return [...steps, feasibilityStep(ctx)]
  steps.push(
    { id: 'geo.ring-inner', section: 'geometry', title: 'Closest reach of P to the pole (cell flat)', ...cell.tex.rhoMin, value: cell.rhoMin, unit: 'mm', source: 'geometry' },
    { id: 'geo.ring-outer', section: 'geometry', title: 'Farthest reach of P from the pole (cell flat or folded)', ...cell.tex.rhoMax, value: cell.rhoMax, unit: 'mm', source: 'geometry' },
    {
      id: 'geo.crank-reach',
      section: 'geometry',
      title: 'Reach of the crank: P between |e − r| and e + r from the pole',
      formula: '|e - r| \\le \\rho \\le e + r',
      substituted: `${tex(Math.abs(e - r))} \\le \\rho \\le ${tex(e + r)}`,
      value: e + r,
      unit: 'mm',
      source: 'geometry',
    },
    feasibilityStep(ctx),
    {
      id: 'kin.line-offset',
      section: 'kinematics',
      title: 'Offset of the straight line from the pole (crank circle through the pole)',
      formula: 'x_T = \\dfrac{k}{2r}',
      substituted: `x_T = \\dfrac{${tex(cell.k)}}{2 \\cdot ${tex(r)}} = ${tex(v.lineOffset)}`,
      value: v.lineOffset,
      unit: 'mm',
      source: INVERSION,
    },
  )
  if (v.path?.kind === 'arc') {
    const den = e * e - r * r
    steps.push(
      {
        id: 'kin.arc-centre',
        section: 'kinematics',
        title: 'Centre of the circle arc the tracer follows (e ≠ r)',
        formula: 'x_c = \\dfrac{k\\,e}{e^2 - r^2}',
        substituted: `x_c = \\dfrac{${tex(cell.k)} \\cdot ${tex(e)}}{${tex(e)}^2 - ${tex(r)}^2} = ${tex(v.path.centre.x)}`,
        value: v.path.centre.x,
        unit: 'mm',
        source: INVERSION,
      },
      {
        id: 'kin.arc-radius',
        section: 'kinematics',
        title: 'Radius of the circle arc the tracer follows (e ≠ r)',
        formula: 'R = \\dfrac{k\\,r}{\\left|e^2 - r^2\\right|}',
        substituted: `R = \\dfrac{${tex(cell.k)} \\cdot ${tex(r)}}{${tex(Math.abs(den))}} = ${tex(v.path.radius)}`,
        value: v.path.radius,
        unit: 'mm',
        source: INVERSION,
      },
    )
  }
  if (!v.path) return steps
  return [...steps, ...strokeSteps(ctx)]
}

function feasibilityStep(ctx: ReportContext): Step {
  const f = ctx.verdict.feasibility
  return {
    id: 'geo.feasibility',
    section: 'geometry',
    title: 'Feasibility of the geometry',
    value: f.kind,
    unit: '—',
    verdict: !f.ok ? 'fail' : f.kind === 'ok' ? 'pass' : 'warn',
    note: f.message,
    source: 'geometry',
  }
}

function strokeSteps(ctx: ReportContext): Step[] {
  const { cell, verdict: v, crank: r, offset: e } = ctx
  const full = v.reach === 'full'
  const c = (cell.rhoMin ** 2 - e * e - r * r) / (2 * e * r)
  const steps: Step[] = [
    {
      id: 'kin.crank-limit',
      section: 'kinematics',
      title: full ? 'Crank limit: P never reaches the flat cell, the crank turns fully' : 'Crank angle at the toggle (|OP| = ρ_min)',
      formula: '\\theta_{\\lim} = \\arccos\\dfrac{\\rho_{\\min}^2 - e^2 - r^2}{2\\,e\\,r}',
      substituted: full ? `\\theta_{\\lim} = 180^\\circ` : `\\theta_{\\lim} = \\arccos\\dfrac{${tex(cell.rhoMin)}^2 - ${tex(e)}^2 - ${tex(r)}^2}{2 \\cdot ${tex(e)} \\cdot ${tex(r)}} = \\arccos(${tex(c)}) = ${tex(v.limitDeg)}^\\circ`,
      value: v.limitDeg,
      unit: '°',
      source: 'geometry (law of cosines in triangle O C P)',
    },
  ]
  const line = v.path?.kind === 'line'
  steps.push({
    id: 'kin.stroke',
    section: 'kinematics',
    title: 'Half stroke between the toggle positions',
    formula: line ? 'h = \\sqrt{\\left(\\dfrac{k}{\\rho_{\\min}}\\right)^2 - x_T^2}' : 'h = \\max_{|\\theta| \\le \\theta_{\\lim}} |y_T|',
    substituted: line
      ? `h = \\sqrt{\\left(\\dfrac{${tex(cell.k)}}{${tex(cell.rhoMin)}}\\right)^2 - ${tex(v.lineOffset)}^2} = ${tex(v.stroke.half)}`
      : `h = ${tex(v.stroke.half)}`,
    value: v.stroke.half,
    unit: 'mm',
    source: INVERSION,
  })
  if (v.feasibility.ok) {
    steps.push({
      id: 'kin.usable-stroke',
      section: 'kinematics',
      title: 'Usable half stroke, stopping short of the toggle by the margin',
      formula: '\\theta_u = \\theta_{\\lim} - \\Delta\\theta,\\quad h_u = |y_T(\\theta_u)|',
      substituted: `\\theta_u = ${tex(v.limitDeg)}^\\circ - ${tex(full ? 0 : ctx.marginDeg)}^\\circ = ${tex(v.usable.crankMaxDeg)}^\\circ,\\quad h_u = ${tex(v.usable.half)}`,
      value: v.usable.half,
      unit: 'mm',
      source: 'common practice: keep a margin from toggle positions',
    })
  }
  return steps
}
