/**
 * Forces at operating speed as one more load case beside each static one (lib/dynamics): the
 * links' masses from the check inputs' sections and materials (or, without checks, the self-weight's
 * area and density), the tool's mass at the tracer, the crank at constant speed. The cases at speed
 * join the envelope, so the component checks take their design forces over all cases.
 */
import type { ChecksInput } from '@/lib/checks'
import { DEFAULT_PLATE_MATERIAL, mergedLink } from '@/lib/checks/resolve'
import { findMaterial } from '@/lib/checks/resolve-material'
import type { MechanismResult, Step } from '@/lib/contract'
import { bodyFromSection, dynamicEnvelope, mechanismDynamics, type LinkBody } from '@/lib/dynamics'
import { weightPerMmOf } from '@/lib/linkage/analyse'
import { getMechanism, type Geometry } from '@/lib/mechanisms'

export interface OperatingSpeed {
  /** Crank speed, rev/min, constant over the stroke. */
  rpm: number
  /** Tool and carriage carried at the tracer, kg (its weight belongs in the static load cases). */
  toolMass?: number
}

interface Inputs {
  mechanism: string
  geometry: Geometry
  loads: { name: string; fx: number; fy: number }[]
  selfWeight?: { density: number; area: number; g: number; directionDeg: number }
  amplificationLimit: number
  operatingSpeed?: OperatingSpeed
}

type Outcome = { ok: true; result: MechanismResult } | { ok: false; fieldErrors: Record<string, string> }

/** Section area and density of each link: from its section and material in the checks, else the self-weight's. */
function bodiesOf(links: string[], checks: ChecksInput | null, selfWeight: Inputs['selfWeight']): Record<string, LinkBody> | string {
  const out: Record<string, LinkBody> = {}
  for (const name of links) {
    const l = checks ? mergedLink(checks, name) : null
    if (l?.section) {
      const found = findMaterial(l.material ?? DEFAULT_PLATE_MATERIAL, checks!)
      if (!found.ok) return `link ${name}: ${found.message}`
      out[name] = bodyFromSection(l.section, found.material.density, found.material.sources.density)
    } else if (selfWeight) {
      out[name] = { area: selfWeight.area, density: selfWeight.density, densitySource: 'self-weight inputs' }
    } else {
      return `link ${name} has no mass: give the link sections (checks) or a self-weight area and density`
    }
  }
  return out
}

/**
 * Supporting steps go to the appendix: every moment of inertia, the added mass (an input), and a link's
 * mass identical to an earlier link's (same section, material and length).
 */
function repeatsToAppendix(steps: Step[]): Step[] {
  const seen = new Set<string>()
  return steps.map((s) => {
    if (/^dyn\.(inertia|added-mass)\./.test(s.id)) return { ...s, appendix: true }
    const kind = /^dyn\.(mass)\./.exec(s.id)?.[1]
    if (!kind || typeof s.value !== 'number') return s
    const key = `${kind}:${s.value}`
    if (!seen.has(key)) {
      seen.add(key)
      return s
    }
    return { ...s, appendix: true }
  })
}

/** The mechanism's result with a case at speed beside every static case, or why it cannot be run. */
export function withOperatingSpeed(mech: MechanismResult, input: Inputs, checks: ChecksInput | null): Outcome {
  const speed = input.operatingSpeed
  if (!speed || !mech.feasibility.ok || mech.loadCases.length === 0) return { ok: true, result: mech }
  const bodies = bodiesOf(
    mech.links.map((l) => l.name),
    checks,
    input.selfWeight,
  )
  if (typeof bodies === 'string') return { ok: false, fieldErrors: { 'operatingSpeed.rpm': bodies } }
  const { cell, crank, offset } = getMechanism(input.mechanism).model(input.geometry)
  // The same weight per mm as the static cases, so gravity is not counted twice.
  const weightPerMm = weightPerMmOf(input.selfWeight)
  const d = mechanismDynamics({
    cell,
    crank,
    offset,
    loads: input.loads,
    weightPerMm,
    anglesDeg: mech.loadCases[0].positions.map((p) => p.crankDeg),
    motion: { kind: 'constant', rpm: speed.rpm },
    bodies,
    addedMasses: speed.toolMass ? [{ joint: 'T', mass: speed.toolMass, label: 'tool and carriage' }] : [],
    amplificationLimit: input.amplificationLimit,
  })
  const cases = d.cases.map((c) => ({ c, env: dynamicEnvelope(d.model, c).atSpeed }))
  return {
    ok: true,
    result: {
      ...mech,
      loadCases: [...mech.loadCases, ...cases.map(({ c }) => ({ name: c.name, positions: c.samples.map((s) => s.position) }))],
      envelope: [...mech.envelope, ...cases.map(({ env }) => env)],
      steps: [...mech.steps, ...repeatsToAppendix(d.steps)],
      tables: [...mech.tables, ...d.tables],
    },
  }
}
