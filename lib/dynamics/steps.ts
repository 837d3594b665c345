/**
 * Steps and tables of the forces at operating speed, in the contract's shapes (lib/contract Step,
 * Table) so the package prints them like the engine's: masses and inertias per link, the crank's
 * motion, peak accelerations, peak drive torque at speed against the static one, the largest pin
 * forces at speed, and the two independent checks (equilibrium recomputed, virtual power).
 *
 * Step ids (section `dynamics`, checks in `verification`): `dyn.motion`, `dyn.mass.<link>`,
 * `dyn.inertia.<link>`, `dyn.added-mass.<joint>`, `dyn.accel.tracer`, `dyn.accel.<link>`,
 * `dyn.torque.<case>`, `dyn.envelope.<case>.pin.<joint>`, `ver.equilibrium-at-speed.<case>`,
 * `ver.virtual-power.<case>`; table `tab.dynamics.<case>` (`<case>` is the slug of the case at speed).
 */
import type { Step, Table } from '@/lib/contract'
import { plain, tex, texp } from '@/lib/linkage/tex'
import type { DynamicsResult } from './types'

const SECTION = 'dynamics'
const BAR = 'slender uniform bar between its end pins (any machine-design text — common practice)'
const DALEMBERT = "d'Alembert's principle: inertia forces −m a_G and couples −I_G α added to the static loads; joint equilibrium as the statics"
const KINEMATICS = 'kinematics: velocity and acceleration equations of the loop closure (Jacobian of the constraint equations)'
export const VP_TOLERANCE = 1e-6
export const EQ_TOLERANCE = 1e-9

type Result = Omit<DynamicsResult, 'steps' | 'tables'>

const nm = '\\ \\text{N}{\\cdot}\\text{mm}'
const at = (deg: number) => `\\ \\text{at } \\theta = ${tex(deg)}^\\circ`

function motionStep(r: Result): Step {
  const peak = r.peaks.crankSpeed
  const m = r.motion
  if (m.kind === 'constant' && m.rpm !== undefined) {
    const w = (2 * Math.PI * m.rpm) / 60
    return {
      id: 'dyn.motion',
      section: SECTION,
      title: 'Crank speed',
      formula: '\\omega = \\dfrac{2\\pi\\,n}{60},\\quad \\alpha = 0',
      substituted: `\\omega = \\dfrac{2\\pi \\cdot ${tex(m.rpm)}}{60} = ${tex(w)}\\ \\text{rad/s}`,
      value: w,
      unit: 'rad/s',
      source: 'input: constant crank speed n, rpm',
    }
  }
  if (m.kind === 'harmonic' && m.cyclesPerMinute !== undefined) {
    const W = (2 * Math.PI * m.cyclesPerMinute) / 60
    return {
      id: 'dyn.motion',
      section: SECTION,
      title: 'Crank motion: harmonic swing between the end stops',
      formula: '\\theta(t) = \\theta_m - \\Delta\\cos\\Omega t,\\quad \\Omega = \\dfrac{2\\pi\\,n}{60},\\quad \\omega = \\Omega\\sqrt{\\Delta^2 - (\\theta - \\theta_m)^2},\\quad \\alpha = -\\Omega^2 (\\theta - \\theta_m)',
      substituted: `\\Omega = \\dfrac{2\\pi \\cdot ${tex(m.cyclesPerMinute)}}{60} = ${tex(W)}\\ \\text{rad/s},\\quad \\omega_{\\max} = ${tex(Math.abs(peak.value))}\\ \\text{rad/s}`,
      value: Math.abs(peak.value),
      unit: 'rad/s',
      note: `${m.description}. The return swing has −ω and the same inertia loads.`,
      source: 'input: cycles per minute n and end stops; simple harmonic motion',
    }
  }
  return { id: 'dyn.motion', section: SECTION, title: 'Crank motion', value: Math.abs(peak.value), unit: 'rad/s', note: `${m.description}; largest crank speed at θ = ${plain(peak.crankDeg)}°.`, source: 'input' }
}

function massSteps(r: Result): Step[] {
  const steps: Step[] = []
  for (const m of r.masses) {
    steps.push({
      id: `dyn.mass.${m.link}`,
      section: SECTION,
      title: `Mass of ${m.link}`,
      formula: 'm = \\rho\\,A\\,L',
      substituted: `m = ${tex(m.density)} \\cdot ${tex(m.area)} \\cdot ${tex(m.length)} \\cdot 10^{-9} = ${tex(m.mass)}\\ \\text{kg}`,
      value: m.mass,
      unit: 'kg',
      note: `${m.section ? `Section ${m.section}` : `Section area ${plain(m.area)} mm²`}, pin-to-pin length ${plain(m.length)} mm, density ${plain(m.density)} kg/m³${m.densitySource ? ` (${m.densitySource})` : ''}.`,
      source: BAR,
    })
    steps.push({
      id: `dyn.inertia.${m.link}`,
      section: SECTION,
      title: `Moment of inertia of ${m.link} about its centroid`,
      formula: 'I_G = \\dfrac{m\\,L^2}{12}',
      substituted: `I_G = \\dfrac{${tex(m.mass)} \\cdot ${tex(m.length)}^2}{12} = ${tex(m.inertia)}\\ \\text{kg}{\\cdot}\\text{mm}^2`,
      value: m.inertia,
      unit: 'kg·mm²',
      refs: [{ stepId: `dyn.mass.${m.link}`, what: 'm' }],
      source: BAR,
    })
  }
  for (const a of r.addedMasses) {
    steps.push({
      id: `dyn.added-mass.${a.joint}`,
      section: SECTION,
      title: `Added mass at ${a.joint}${a.label ? ` (${a.label})` : ''}`,
      formula: `m_{${a.joint}}`,
      substituted: `m_{${a.joint}} = ${tex(a.mass)}\\ \\text{kg}`,
      value: a.mass,
      unit: 'kg',
      note: 'A particle at the pin: inertia force −m a at the joint, no inertia couple.',
      source: 'input',
    })
  }
  return steps
}

function accelerationSteps(r: Result): Step[] {
  const t = r.peaks.tracerAcceleration
  const steps: Step[] = [
    {
      id: 'dyn.accel.tracer',
      section: SECTION,
      title: 'Largest acceleration of the tracer',
      formula: 'a_T = \\max_\\theta \\left|\\omega^2 \\mathbf{X}_T\'\' + \\alpha\\,\\mathbf{X}_T\'\\right|',
      substituted: `a_T = ${tex(t.value)}\\ \\text{mm/s}^2${at(t.crankDeg)}`,
      value: t.value,
      unit: 'mm/s²',
      note: `${plain(t.value / 9806.65)} g. ′ = d/dθ, from the velocity and acceleration equations of the loop closure.`,
      source: KINEMATICS,
    },
  ]
  for (const [link, p] of Object.entries(r.peaks.links)) {
    steps.push({
      id: `dyn.accel.${link}`,
      section: SECTION,
      title: `Largest centroid and angular acceleration of ${link}`,
      formula: 'a_G = \\max_\\theta |\\mathbf{a}_G|,\\quad \\alpha_{\\max} = \\max_\\theta |\\alpha|',
      substituted: `a_G = ${tex(p.acceleration.value)}\\ \\text{mm/s}^2${at(p.acceleration.crankDeg)},\\quad \\alpha_{\\max} = ${tex(Math.abs(p.angular.value))}\\ \\text{rad/s}^2${at(p.angular.crankDeg)}`,
      value: p.acceleration.value,
      unit: 'mm/s²',
      source: KINEMATICS,
      appendix: true,
    })
  }
  return steps
}

function caseSteps(r: Result, i: number): Step[] {
  const c = r.cases[i]
  const tq = r.peaks.torque[i]
  const steps: Step[] = []
  const ratio = tq.static.value !== 0 ? Math.abs(tq.atSpeed.value / tq.static.value) : null
  steps.push({
    id: `dyn.torque.${c.slug}`,
    section: SECTION,
    title: `Largest drive torque at speed against the static one, case “${c.staticName}”`,
    formula: '\\tau_\\omega = \\max_\\theta |\\tau(\\theta)|\\ \\text{with inertia},\\quad \\tau_0 = \\max_\\theta |\\tau(\\theta)|\\ \\text{without}',
    substituted: `\\tau_\\omega = ${tex(tq.atSpeed.value)}${nm}${at(tq.atSpeed.crankDeg)};\\quad \\tau_0 = ${tex(tq.static.value)}${nm}${at(tq.static.crankDeg)}${ratio !== null ? `;\\quad |\\tau_\\omega/\\tau_0| = ${tex(ratio)}` : ''}`,
    value: tq.atSpeed.value,
    unit: 'N·mm',
    note: 'Counter-clockwise positive; signed values at the positions of the largest magnitude.',
    source: DALEMBERT,
  })
  if (c.samples.length) {
    const joints = Object.keys(c.samples[0].position.pinForces)
    for (const j of joints) {
      let dyn = { value: 0, crankDeg: c.samples[0].position.crankDeg }
      let sta = { value: 0, crankDeg: dyn.crankDeg }
      c.samples.forEach((s, k) => {
        const d = s.position.pinForces[j]?.magnitude ?? 0
        const z = c.withoutInertia[k].position.pinForces[j]?.magnitude ?? 0
        if (d > dyn.value) dyn = { value: d, crankDeg: s.position.crankDeg }
        if (z > sta.value) sta = { value: z, crankDeg: s.position.crankDeg }
      })
      steps.push({
        id: `dyn.envelope.${c.slug}.pin.${j}`,
        section: SECTION,
        title: `Largest force on pin ${j} from one link at speed, case “${c.staticName}”`,
        formula: `F_{${j},\\omega} = \\max_\\theta |\\mathbf{F}_{${j}}|`,
        substituted: `F_{${j},\\omega} = ${tex(dyn.value)}\\ \\text{N}${at(dyn.crankDeg)};\\quad F_{${j},0} = ${tex(sta.value)}\\ \\text{N}${at(sta.crankDeg)}`,
        value: dyn.value,
        unit: 'N',
        source: DALEMBERT,
        appendix: true,
      })
    }
  }
  let eq = 0
  for (const s of c.samples) eq = Math.max(eq, s.applied > 0 ? s.residual / s.applied : s.residual)
  steps.push({
    id: `ver.equilibrium-at-speed.${c.slug}`,
    section: 'verification',
    title: `Equilibrium of every body at speed, recomputed from the results with the inertia loads distributed along the links, case “${c.staticName}”`,
    formula: '\\max \\dfrac{|\\sum \\mathbf{F}|,\\ |\\sum M|/L_c}{F_{\\text{ref}}} \\le 10^{-9}',
    substituted: `${tex(eq)} \\le 10^{-9}`,
    value: eq,
    unit: '—',
    criterion: '\\le 10^{-9}',
    verdict: eq <= EQ_TOLERANCE ? 'pass' : 'fail',
    note: 'F_ref: the sum of the magnitudes of the loads, weights and inertia forces applied at the position.',
    source: `${DALEMBERT}; tolerance 10⁻⁹`,
  })
  let worst = c.samples.find((s) => s.power) ?? null
  for (const s of c.samples) if (s.power && worst?.power && s.power.relative > worst.power.relative) worst = s
  const checked = c.samples.filter((s) => s.power).length
  const err = worst?.power?.relative ?? 0
  const p = worst?.power
  steps.push({
    id: `ver.virtual-power.${c.slug}`,
    section: 'verification',
    title: `Drive torque at speed by virtual power against the kinetostatics, case “${c.staticName}”`,
    formula: '\\tau\\,\\omega + \\sum_i \\mathbf{F}_i \\cdot \\mathbf{v}_i = \\dfrac{dT}{dt} = \\sum_j \\left(m_j\\,\\mathbf{a}_{G,j} \\cdot \\mathbf{v}_{G,j} + I_{G,j}\\,\\alpha_j\\,\\omega_j\\right),\\quad \\dfrac{|\\tau - \\tau_{\\text{vp}}|}{\\tau_{\\text{ref}}} \\le 10^{-6}',
    substituted: worst && p
      ? `\\tau = ${tex(worst.position.driveTorque)}${nm},\\ \\tau_{\\text{vp}} = ${tex(p.torque)}${nm}${at(worst.position.crankDeg)};\\ \\tau\\omega = ${tex(p.drive)},\\ \\sum \\mathbf{F}\\cdot\\mathbf{v} = ${texp(p.loads)},\\ \\dfrac{dT}{dt} = ${tex(p.kineticRate)}\\ \\text{N}{\\cdot}\\text{mm/s};\\ ${tex(err)} \\le 10^{-6}`
      : '\\text{no position}',
    value: err,
    unit: '—',
    criterion: '\\le 10^{-6}',
    verdict: checked === 0 ? 'warn' : err <= VP_TOLERANCE ? 'pass' : 'fail',
    note: `Velocities and accelerations for this check come from the closed-form positions by fourth-order central differences in the crank angle, not from the kinematics used for the forces. Compared per unit crank speed (virtual velocities dX/dθ), which also holds where the crank stops; τ_ref is the sum of the magnitudes of the terms. ${checked} of ${c.samples.length} positions checked; the largest relative difference is shown.`,
    source: 'principle of virtual power (power balance of the drive, the loads and the kinetic energy); tolerance 10⁻⁶ relative',
  })
  return steps
}

export function dynamicsSteps(r: Result): Step[] {
  const steps = [motionStep(r), ...massSteps(r)]
  if (r.kinematics.length) steps.push(...accelerationSteps(r))
  r.cases.forEach((_, i) => steps.push(...caseSteps(r, i)))
  return steps
}

export function dynamicsTables(r: Result): Table[] {
  return r.cases.map((c) => ({
    id: `tab.dynamics.${c.slug}`,
    section: SECTION,
    title: `Drive torque with and without inertia over the sweep, case “${c.staticName}”`,
    columns: [
      { key: 'crankDeg', label: 'θ', unit: '°', digits: 1 },
      { key: 'omega', label: 'ω', unit: 'rad/s', digits: 3 },
      { key: 'alpha', label: 'α', unit: 'rad/s²', digits: 2 },
      { key: 'tracerAcc', label: '|a_T|', unit: 'mm/s²', digits: 0 },
      { key: 'torqueStatic', label: 'τ without inertia', unit: 'N·mm', digits: 1 },
      { key: 'torque', label: 'τ at speed', unit: 'N·mm', digits: 1 },
      { key: 'vp', label: 'virtual-power error', unit: '—' },
    ],
    rows: c.samples.map((s) => {
      const a = r.kinematics.find((q) => q.crankDeg === s.position.crankDeg)?.joints[r.tracer]?.a
      return {
        crankDeg: s.position.crankDeg,
        omega: s.omega,
        alpha: s.alpha,
        tracerAcc: a ? Math.hypot(a.x, a.y) : null,
        torqueStatic: s.staticTorque,
        torque: s.position.driveTorque,
        vp: s.power ? s.power.relative : null,
      }
    }),
  }))
}
