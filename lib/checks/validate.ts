/**
 * Validation the web form and the CLI share: zod for shape and sign, then the
 * rules that need the resolved description. Every problem comes back as
 * { path, message } so the form can show it at the field.
 */
import type { z } from 'zod'
import { MATERIALS } from './materials'
import { resolveJoint, resolveLink, type FieldIssue, type ResolvedJoint, type ResolvedLink } from './resolve'
import { checksInputSchema, type ChecksInput } from './schema'
import { checksInputToSI } from './to-si'

export type { FieldIssue } from './resolve'

export class ChecksInputError extends Error {
  constructor(public readonly issues: FieldIssue[]) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join('\n'))
    this.name = 'ChecksInputError'
  }
}

export function zodIssues(err: z.ZodError, prefix = ''): FieldIssue[] {
  return err.issues.map((i) => ({ path: prefix + i.path.map(String).join('.'), message: i.message }))
}

export type Parsed = { ok: true; input: ChecksInput } | { ok: false; issues: FieldIssue[] }

export function parseChecksInput(raw: unknown): Parsed {
  const r = checksInputSchema.safeParse(raw)
  return r.success ? { ok: true, input: r.data } : { ok: false, issues: zodIssues(r.error) }
}

export interface MechanismNames {
  joints: string[]
  links: string[]
  /** Pin-to-pin lengths from the engine, mm. */
  lengths?: Record<string, number>
}

export interface Resolved {
  joints: ResolvedJoint[]
  links: ResolvedLink[]
  issues: FieldIssue[]
}

/**
 * Resolves every component to be checked: those in the mechanism (when known)
 * and those described. Steel-only bases reject aluminium at the material field.
 */
export function resolveAll(input: ChecksInput, names?: MechanismNames): Resolved {
  const issues: FieldIssue[] = []
  for (const id of Object.keys(input.materials)) {
    if (MATERIALS[id]) issues.push({ path: `materials.${id}`, message: `"${id}" is a library material; give your material another name` })
  }
  if (names) {
    for (const j of Object.keys(input.joints)) {
      if (!names.joints.includes(j)) issues.push({ path: `joints.${j}`, message: `joint "${j}" is not in the mechanism (its joints: ${names.joints.join(', ')})` })
    }
    for (const l of Object.keys(input.links)) {
      if (!names.links.includes(l)) issues.push({ path: `links.${l}`, message: `link "${l}" is not in the mechanism (its links: ${names.links.join(', ')})` })
    }
  }
  const jointNames = names ? names.joints : Object.keys(input.joints)
  const linkNames = names ? names.links : Object.keys(input.links)
  const joints: ResolvedJoint[] = []
  const links: ResolvedLink[] = []
  for (const n of jointNames) {
    const r = resolveJoint(input, n, issues)
    if (r) joints.push(r)
  }
  for (const n of linkNames) {
    // Without the engine the length is unknown; an infinite placeholder skips only the too-short rule.
    const r = resolveLink(input, n, names?.lengths?.[n] ?? (names ? undefined : Number.POSITIVE_INFINITY), issues)
    if (r) links.push(r)
  }
  if (input.basis.kind !== 'allowable') {
    const code = input.basis.kind === 'en1993' ? 'EN 1993' : 'AISC 360'
    const msg = (id: string) => `${id} is an aluminium alloy; ${code} covers steel only — use the allowable-stress basis (aluminium design codes are not implemented)`
    for (const j of joints) {
      if (j.pin.material.kind === 'aluminium') issues.push({ path: `joints.${j.name}.pinMaterial`, message: msg(j.pin.material.id) })
      for (const p of j.plates) {
        if (p.material.kind === 'aluminium') issues.push({ path: `joints.${j.name}.${p.role.startsWith('plate') ? p.role.replace(' ', '') : p.role.split(' ')[0]}.material`, message: msg(p.material.id) })
      }
    }
    for (const l of links) {
      if (l.material.kind === 'aluminium') issues.push({ path: `links.${l.name}.material`, message: msg(l.material.id) })
      else if (l.eye.material.kind === 'aluminium') issues.push({ path: `links.${l.name}.eye.material`, message: msg(l.eye.material.id) })
    }
  }
  return { joints, links, issues }
}

/** For the form: all problems of a raw input, zod and semantic, keyed by field path. */
export function validateChecksInput(raw: unknown, names?: MechanismNames): FieldIssue[] {
  const p = parseChecksInput(raw)
  if (!p.ok) return p.issues
  return resolveAll(checksInputToSI(p.input), names).issues
}
