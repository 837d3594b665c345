/**
 * Runs the checks for a solved mechanism (runChecks) or for one component
 * with a force given directly (checkComponent). Both go through the same
 * resolve → basis → report path, so a single pin checked alone gives exactly
 * the numbers it would get inside a full calc with the same force.
 */
import type { CheckItem, LoadCaseEnvelope, MaterialUse, Step, Table } from '@/lib/contract'
import { aiscBasis } from './bases/aisc360'
import { allowableBasis } from './bases/allowable'
import { en1993Basis } from './bases/en1993'
import type { BasisImpl } from './bases/types'
import { cautionsFor } from './cautions'
import { directJointForces, directLinkForces, jointForces, linkForces, type DirectForce } from './forces'
import type { Material } from './materials'
import { evaluate, forceStep, summaryTable } from './report'
import type { ResolvedJoint, ResolvedLink } from './resolve'
import type { Basis, ChecksInput, Factors } from './schema'
import type { JointForces, LinkForces } from './spec'
import { checksInputToSI } from './to-si'
import { ChecksInputError, resolveAll, type MechanismNames } from './validate'

export interface ChecksResult {
  checks: CheckItem[]
  steps: Step[]
  tables: Table[]
  cautions: string[]
  /** Every material the checks read, one row per material and strength band. */
  materials: MaterialUse[]
}

/** Rows of the materials table: which parts use each material, the band that applied and the source as stored. */
function materialUses(joints: ResolvedJoint[], links: ResolvedLink[]): MaterialUse[] {
  const rows = new Map<string, MaterialUse>()
  const add = (m: Material, band: string, fy: number, fu: number, part: string) => {
    const b = band.includes(', ') ? band.slice(band.indexOf(', ') + 2) : band
    const key = `${m.id}\u0000${b}`
    const row = rows.get(key) ?? { id: m.id, name: m.name, usedFor: [], band: b, fy, fu, E: m.E, source: m.sources.strength }
    if (!row.usedFor.includes(part)) row.usedFor.push(part)
    rows.set(key, row)
  }
  for (const j of joints) {
    add(j.pin.material, j.pin.band, j.pin.fy, j.pin.fu, 'pins')
    for (const p of j.plates) add(p.material, p.band, p.fy, p.fu, 'joint plates')
  }
  for (const l of links) {
    add(l.material, l.band, l.fy, l.fu, 'link bodies')
    add(l.eye.material, l.eye.band, l.eye.fy, l.eye.fu, 'eyes')
  }
  return [...rows.values()]
}

export function basisImpl(b: Basis): BasisImpl {
  switch (b.kind) {
    case 'allowable':
      return allowableBasis(b.factorOfSafety)
    case 'en1993':
      return en1993Basis(b)
    case 'aisc360':
      return aiscBasis(b.method)
  }
}

function used(joints: ResolvedJoint[], links: ResolvedLink[]): Material[] {
  return [
    ...joints.flatMap((j) => [j.pin.material, ...j.plates.map((p) => p.material)]),
    ...links.flatMap((l) => [l.material, l.eye.material]),
  ]
}

function assemble(
  basis: BasisImpl,
  factors: Factors,
  joints: [ResolvedJoint, JointForces][],
  links: [ResolvedLink, LinkForces][],
): ChecksResult {
  const checks: CheckItem[] = []
  const steps: Step[] = []
  for (const [j, f] of joints) {
    steps.push(forceStep(`chk.pin.${j.name}.force`, `pin ${j.name}: design force`, [['F', f.force]], factors))
    const r = evaluate('pin', j.name, basis.label, basis.pin(j, f), `chk.pin.${j.name}.force`)
    checks.push(...r.items)
    steps.push(...r.steps)
  }
  for (const [l, f] of links) {
    const shown: [string, LinkForces['moment']][] = [
      ['T', f.tension],
      ['C', f.compression],
      ['E', f.eye],
      ['M', f.moment],
    ]
    steps.push(forceStep(`chk.link.${l.name}.force`, `link ${l.name}: design forces`, shown, factors))
    const r = evaluate('link', l.name, basis.label, basis.link(l, f), `chk.link.${l.name}.force`)
    checks.push(...r.items)
    steps.push(...r.steps)
  }
  markAppendix(steps, checks, joints.map(([j]) => [`pin ${j.name}`, jointKey(j)]), links.map(([l]) => [`link ${l.name}`, linkKey(l)]))
  const cautions = cautionsFor(
    basis.caution,
    used(
      joints.map((x) => x[0]),
      links.map((x) => x[0]),
    ),
  )
  return {
    checks,
    steps,
    tables: [summaryTable(checks)],
    cautions,
    materials: materialUses(
      joints.map((x) => x[0]),
      links.map((x) => x[0]),
    ),
  }
}

/** What makes two pins identical: everything but the name. */
function jointKey(j: ResolvedJoint): string {
  return JSON.stringify([j.d, j.d0, j.pin.material.id, j.arrangement, j.plates.map((p) => [p.role, p.thickness, p.material.id]), j.gap, j.replaceable])
}

/** What makes two links identical: section, material, eye, length and buckling data. */
function linkKey(l: ResolvedLink): string {
  const e = l.eye
  return JSON.stringify([l.section.label, l.material.id, e.t, e.w, e.d0, e.d, e.a, e.material.id, e.table39Type, Math.round(l.length * 1e6), l.K, l.curve])
}

/**
 * Full working in the body only for one of each group of identical components (the most utilised)
 * and for every component's design forces and governing check; the other steps go to the appendix.
 */
function markAppendix(steps: Step[], checks: CheckItem[], ...groups: [string, string][][]): void {
  const main = new Set<string>()
  for (const list of groups) {
    const byKey = new Map<string, string[]>()
    for (const [component, key] of list) byKey.set(key, [...(byKey.get(key) ?? []), component])
    for (const members of byKey.values()) {
      const worst = (c: string) => Math.max(0, ...checks.filter((x) => x.component === c && x.kind !== 'detailing').map((x) => x.utilisation))
      const rep = members.reduce((a, b) => (worst(b) > worst(a) ? b : a))
      for (const x of checks) {
        if (x.component === rep || (members.includes(x.component) && (x.governing || !x.pass))) main.add(x.stepId)
      }
    }
  }
  for (const s of steps) {
    if (s.id.endsWith('.force')) continue
    if (!main.has(s.id)) s.appendix = true
  }
}

function namesOf(envelopes: LoadCaseEnvelope[]): MechanismNames {
  const joints = new Set<string>()
  const links = new Set<string>()
  const lengths: Record<string, number> = {}
  for (const e of envelopes) {
    Object.keys(e.pins).forEach((n) => joints.add(n))
    for (const [n, l] of Object.entries(e.links)) {
      links.add(n)
      lengths[n] ??= l.length
    }
  }
  return { joints: [...joints], links: [...links], lengths }
}

/** All pins and links of a solved mechanism; throws ChecksInputError with field paths on bad input. */
export function runChecks(input: ChecksInput, envelopes: LoadCaseEnvelope[]): ChecksResult {
  const si = checksInputToSI(input)
  const r = resolveAll(si, namesOf(envelopes))
  if (r.issues.length) throw new ChecksInputError(r.issues)
  return assemble(
    basisImpl(si.basis),
    si.factors,
    r.joints.map((j) => [j, jointForces(envelopes, j.name, si.factors)]),
    r.links.map((l) => [l, linkForces(envelopes, l.name, si.factors)]),
  )
}

export type ComponentTarget = ({ kind: 'joint' } & { force: number }) | ({ kind: 'link' } & DirectForce)

/**
 * One pin or link with its design force given directly (N, N·mm; already SI).
 * The component is `input.joints[name]` / `input.links[name]` merged with the defaults.
 */
export function checkComponent(input: ChecksInput, name: string, target: ComponentTarget): ChecksResult {
  const si = checksInputToSI(input)
  const only: ChecksInput =
    target.kind === 'joint'
      ? { ...si, joints: { [name]: si.joints[name] ?? {} }, links: {} }
      : { ...si, links: { [name]: si.links[name] ?? {} }, joints: {} }
  // Naming the one component makes a missing link length an error at links.NAME.length.
  const r = resolveAll(only, target.kind === 'joint' ? { joints: [name], links: [] } : { joints: [], links: [name], lengths: {} })
  if (r.issues.length) throw new ChecksInputError(r.issues)
  const basis = basisImpl(si.basis)
  const bad = Object.entries(target).find(([k, v]) => k !== 'kind' && typeof v === 'number' && !Number.isFinite(v))
  if (bad) throw new ChecksInputError([{ path: bad[0], message: `${bad[0]} must be a finite number` }])
  if (target.kind === 'joint') return assemble(basis, si.factors, [[r.joints[0], directJointForces(target.force, si.factors)]], [])
  return assemble(basis, si.factors, [], [[r.links[0], directLinkForces(target, si.factors)]])
}
