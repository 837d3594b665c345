import { and, eq, sql } from 'drizzle-orm'
import { db } from '@/db'
import { calcs, checkRemarks, remarkReplies, revisions } from '@/db/schema'
import { mechanismLabel } from '@/lib/mechanisms'
import { authorise, type Caller } from './access'

export type SearchHitKind = 'number' | 'title' | 'mechanism' | 'input' | 'step' | 'remark'

export interface SearchHit {
  calcId: string
  number: string
  title: string
  kind: SearchHitKind
  /** What matched, as shown. */
  text: string
  /** The step the hit is about (steps, remarks on a step). */
  stepId?: string
  /** The revision a remark was made on. */
  revisionId?: string
}

/** `%q%` for LIKE with its wildcards escaped, lower case. */
const like = (q: string) => `%${q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`

const MAX_HITS = 200

/**
 * Finds calcs of a project by number, title, mechanism, the names in their working inputs (load
 * cases, materials), the titles of their working steps and the text of remarks and replies on any
 * of their revisions. Case-insensitive substring match; at most 200 hits, calcs in number order.
 */
export async function searchProject(caller: Caller | null, projectId: string, query: string): Promise<SearchHit[]> {
  await authorise(caller, projectId, 'project.view')
  const q = query.trim()
  if (q.length < 2) return []
  const pattern = like(q)
  const inProject = eq(calcs.projectId, projectId)
  const [own, loads, materials, steps, remarks, replies] = await Promise.all([
    db.select({ id: calcs.id, number: calcs.number, title: calcs.title, calcType: calcs.calcType }).from(calcs).where(inProject),
    db.all<{ id: string; name: string }>(
      sql`select c.id as id, json_extract(l.value, '$.name') as name from ${calcs} c, json_each(c.draft_inputs, '$.loads') l
          where c.project_id = ${projectId} and lower(json_extract(l.value, '$.name')) like ${pattern} escape '\\'`,
    ),
    db.all<{ id: string; name: string }>(
      sql`select c.id as id, m.key as name from ${calcs} c, json_each(c.draft_inputs, '$.materials') m
          where c.project_id = ${projectId} and lower(m.key) like ${pattern} escape '\\'`,
    ),
    db.all<{ id: string; stepId: string; title: string }>(
      sql`select c.id as id, json_extract(s.value, '$.id') as stepId, json_extract(s.value, '$.title') as title from ${calcs} c, json_each(c.draft_result, '$.steps') s
          where c.project_id = ${projectId} and lower(json_extract(s.value, '$.title')) like ${pattern} escape '\\'`,
    ),
    db
      .select({ id: calcs.id, revisionId: revisions.id, stepId: checkRemarks.stepId, text: checkRemarks.text })
      .from(checkRemarks)
      .innerJoin(revisions, eq(revisions.id, checkRemarks.revisionId))
      .innerJoin(calcs, eq(calcs.id, revisions.calcId))
      .where(and(inProject, sql`lower(${checkRemarks.text}) like ${pattern} escape '\\'`)),
    db
      .select({ id: calcs.id, revisionId: revisions.id, stepId: checkRemarks.stepId, text: remarkReplies.text })
      .from(remarkReplies)
      .innerJoin(checkRemarks, eq(checkRemarks.id, remarkReplies.remarkId))
      .innerJoin(revisions, eq(revisions.id, checkRemarks.revisionId))
      .innerJoin(calcs, eq(calcs.id, revisions.calcId))
      .where(and(inProject, sql`lower(${remarkReplies.text}) like ${pattern} escape '\\'`)),
  ])
  const byId = new Map(own.map((c) => [c.id, c]))
  const lower = q.toLowerCase()
  const hits: SearchHit[] = []
  const add = (id: string, kind: SearchHitKind, text: string, extra: Partial<SearchHit> = {}) => {
    const c = byId.get(id)
    if (c) hits.push({ calcId: id, number: c.number, title: c.title, kind, text, ...extra })
  }
  for (const c of own) {
    if (c.number.toLowerCase().includes(lower)) add(c.id, 'number', c.number)
    if (c.title.toLowerCase().includes(lower)) add(c.id, 'title', c.title)
    const label = mechanismLabel(c.calcType)
    if (label.toLowerCase().includes(lower)) add(c.id, 'mechanism', label)
  }
  for (const l of loads) add(l.id, 'input', `Load case “${l.name}”`)
  for (const m of materials) add(m.id, 'input', `Material ${m.name}`)
  for (const s of steps) add(s.id, 'step', s.title, { stepId: s.stepId })
  // A remark carried to the next revision repeats its text: one hit per calc, step and text.
  const seen = new Set<string>()
  for (const r of [...remarks, ...replies]) {
    const key = `${r.id}|${r.stepId}|${r.text}`
    if (seen.has(key)) continue
    seen.add(key)
    add(r.id, 'remark', r.text, { stepId: r.stepId ?? undefined, revisionId: r.revisionId })
  }
  const order: SearchHitKind[] = ['number', 'title', 'mechanism', 'input', 'step', 'remark']
  hits.sort((a, b) => a.number.localeCompare(b.number) || order.indexOf(a.kind) - order.indexOf(b.kind))
  return hits.slice(0, MAX_HITS)
}
