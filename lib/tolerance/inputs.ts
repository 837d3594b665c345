/**
 * Inputs of the tolerance analysis taken from the rest of the calc: the pin force on every link eye
 * under one load case (from the engine's statics at the nominal positions) and the clearances
 * hole − pin from the checks input (lib/checks schema: joints' and link eyes' hole and pin diameters).
 */
import { DEFAULT_CLEARANCE, mergedJoint } from '@/lib/checks/resolve'
import type { ChecksInput } from '@/lib/checks/schema'
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import { buildModel, pointsFromJoints } from '@/lib/linkage/model'
import { solveStatics } from '@/lib/linkage/statics'
import { DEG, type Vec } from '@/lib/linkage/vec'
import { anglesOver, type MechanismModelLike } from './kinematics'
import { DEFAULT_POSITIONS } from './setup'

/**
 * The force each pin applies to each link's eye (`joint@link` → N) at the positions the tolerance
 * analysis uses, under a force (fx, fy) at the tracer, from the engine's statics (lib/linkage
 * statics, the load taken on the tracer pin). Null at a position where the statics is singular.
 */
export function eyeForcesFromLoad(
  model: MechanismModelLike,
  workingRange: { crankMinDeg: number; crankMaxDeg: number },
  load: { fx: number; fy: number },
  positions = DEFAULT_POSITIONS,
  weightPerMm: Vec | null = null,
): Record<string, Vec>[] {
  const { cell, crank: r, offset: e } = model
  const lm = buildModel(linkageOf(cell, e, r))
  const cases = [{ name: 'tolerance', pointLoads: [{ joint: 'T', force: { x: load.fx, y: load.fy } }], weightPerMm }]
  return anglesOver(workingRange.crankMinDeg, workingRange.crankMaxDeg, positions).map((deg) => {
    const joints = placeAt(cell, e, r, deg * DEG)
    const out: Record<string, Vec> = {}
    if (!joints) return out
    const st = solveStatics(lm, pointsFromJoints(lm, joints), cases, 1)
    if (!st.ok) return out
    const f = st.cases[0].endForces
    lm.links.forEach((l, b) => {
      l.points.forEach((j, k) => {
        const i = 2 * (lm.offset[b] + k)
        out[`${j}@${l.name}`] = { x: f[i], y: f[i + 1] }
      })
    })
    return out
  })
}

/**
 * Clearances hole − pin, mm, from a checks input in SI units: per pin from `joints.<name>` (or
 * `defaults.joint`), the hole defaulting to pin + DEFAULT_CLEARANCE as the checks take it; a link
 * whose `eye` states its own hole or pin diameter gives `joint@link` entries for both its eyes.
 * Pins without a pin diameter are left out (no clearance known).
 */
export function clearancesFromChecks(checks: ChecksInput, model: MechanismModelLike): Record<string, number> {
  const def = linkageOf(model.cell, model.offset, model.crank)
  const out: Record<string, number> = {}
  const joints = new Set(def.links.flatMap((l) => l.points))
  for (const j of joints) {
    const m = mergedJoint(checks, j)
    if (m.pinDiameter === undefined) continue
    out[j] = Math.max(0, (m.holeDiameter ?? m.pinDiameter + DEFAULT_CLEARANCE) - m.pinDiameter)
  }
  for (const l of def.links) {
    const eye = checks.links[l.name]?.eye
    if (!eye || (eye.holeDiameter === undefined && eye.pinDiameter === undefined)) continue
    const dj = mergedJoint(checks, '')
    const d = eye.pinDiameter ?? dj.pinDiameter
    if (d === undefined) continue
    const c = Math.max(0, (eye.holeDiameter ?? dj.holeDiameter ?? d + DEFAULT_CLEARANCE) - d)
    for (const j of l.points) out[`${j}@${l.name}`] = c
  }
  return out
}
