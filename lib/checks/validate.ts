/**
 * Validation the web form and the CLI share: zod for shape and sign, then the
 * rules that need the resolved description. Every problem comes back as
 * { path, message } so the form can show it at the field.
 */
import type { z } from 'zod'
import { hasControl } from '@/lib/schemas/clean-text'
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

/*
 * Sizes of what one input may hold: text lengths and counts (common practice; numbers have their
 * ranges in lib/bench/ranges.ts). Wide enough for any real cell, small enough that one request
 * cannot fill the store or the package with junk. Checked on new input (`calculate`, the CLI), not
 * by the schema, so a revision stored before these limits still reads.
 */
/** Longest name of a material, joint or link, and longest reference to a material. */
export const MAX_NAME = 60
/** Longest material description (`name`) and source. */
export const MAX_TEXT = 500
/** Most user materials in one input. */
export const MAX_MATERIALS = 50
/** Most joints or links described in one input (the cells here have 6 to 8 joints and 5 to 7 links). */
export const MAX_COMPONENTS = 50
/** Most strength bands of one material (standards list a handful of thickness bands). */
export const MAX_BANDS = 20

const CONTROL_MESSAGE = 'must not hold control characters (tabs, line breaks, NUL)'

/** Text at `path` too long or with control characters; `what` starts the message (`source must …`). */
function textIssue(out: FieldIssue[], path: string, v: unknown, max: number, what: string, why: string) {
  if (typeof v !== 'string') return
  if (v.length > max) out.push({ path, message: `${what}must be at most ${max} characters: ${why}` })
  else if (hasControl(v)) out.push({ path, message: `${what}${CONTROL_MESSAGE}` })
}

const NAME_WHY = "a name is a label in the package's tables"
const TEXT_WHY = "it is printed in the package's materials table"

function recordIssues(out: FieldIssue[], path: string, o: unknown, max: number, what: string): [string, Record<string, unknown>][] {
  if (!o || typeof o !== 'object' || Array.isArray(o)) return []
  const entries = Object.entries(o as Record<string, unknown>)
  if (entries.length > max) {
    out.push({ path, message: `must hold at most ${max} ${what}: more than any one cell needs` })
    return []
  }
  for (const [k] of entries) textIssue(out, `${path}.${k}`, k, MAX_NAME, 'name ', NAME_WHY)
  return entries.filter(([, v]) => v && typeof v === 'object') as [string, Record<string, unknown>][]
}

function partIssues(out: FieldIssue[], path: string, part: unknown) {
  if (!part || typeof part !== 'object') return
  const p = part as Record<string, unknown>
  textIssue(out, `${path}.material`, p.material, MAX_NAME, 'material ', NAME_WHY)
  textIssue(out, `${path}.pinMaterial`, p.pinMaterial, MAX_NAME, 'pin material ', NAME_WHY)
  for (const k of ['middle', 'outer', 'plate1', 'plate2', 'eye']) {
    const sub = p[k] as Record<string, unknown> | undefined
    if (sub && typeof sub === 'object') textIssue(out, `${path}.${k}.material`, sub.material, MAX_NAME, 'material ', NAME_WHY)
  }
}

/**
 * Counts and text lengths of the pin and link part of a raw input, keyed by dotted path: materials,
 * joints and links described, names, sources and strength bands.
 */
export function sizeIssues(raw: unknown): FieldIssue[] {
  const out: FieldIssue[] = []
  if (!raw || typeof raw !== 'object') return out
  const r = raw as Record<string, unknown>
  for (const [name, m] of recordIssues(out, 'materials', r.materials, MAX_MATERIALS, 'materials')) {
    textIssue(out, `materials.${name}.name`, m.name, MAX_TEXT, 'name ', TEXT_WHY)
    textIssue(out, `materials.${name}.source`, m.source, MAX_TEXT, 'source ', TEXT_WHY)
    if (Array.isArray(m.bands) && m.bands.length > MAX_BANDS) out.push({ path: `materials.${name}.bands`, message: `must hold at most ${MAX_BANDS} bands: standards list a handful of thickness bands` })
  }
  for (const [name, j] of recordIssues(out, 'joints', r.joints, MAX_COMPONENTS, 'joints')) partIssues(out, `joints.${name}`, j)
  for (const [name, l] of recordIssues(out, 'links', r.links, MAX_COMPONENTS, 'links')) partIssues(out, `links.${name}`, l)
  const d = r.defaults as Record<string, unknown> | undefined
  if (d && typeof d === 'object') {
    partIssues(out, 'defaults.joint', d.joint)
    partIssues(out, 'defaults.link', d.link)
  }
  const c = r.component as Record<string, unknown> | undefined
  if (c && typeof c === 'object') {
    textIssue(out, 'component.joint', c.joint, MAX_NAME, '', NAME_WHY)
    textIssue(out, 'component.link', c.link, MAX_NAME, '', NAME_WHY)
  }
  return out
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
