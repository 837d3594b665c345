import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { calcs, projects } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { PERMISSIONS, type Permission } from '@/lib/review/permissions'
import type { Caller } from '@/server/access'
import { addAttachment } from '@/server/attachments'
import { createCalc, listCalcs, saveInputs } from '@/server/calcs'
import { caughtMail } from '@/server/mail-inbox'
import { addMaterial } from '@/server/materials'
import { changeMemberRole } from '@/server/members'
import { createProject } from '@/server/projects'
import { addRemark, closeRemark, replyToRemark } from '@/server/remarks'
import { revisionPdf, saveRevision, transitionRevision, type RevisionDeps } from '@/server/revisions'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

/*
 * Every row of the permission table, asked through the service that needs it, by every role, a
 * site admin, a person from another project and nobody. Each probe is built so that a permitted
 * call stops at a harmless later check (an unknown revision, invalid inputs), never changing
 * anything that another probe needs. Separation of duties (engineer ≠ checker ≠ approver, admins
 * manage people but do not sign) is common practice for signed calcs.
 */

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let people: Record<DemoRole, Caller>
let projectId = ''
const calcId = 'c-probe'
const outsider: Caller = { id: 'u-outsider', email: 'someone@elsewhere.example', name: 'Someone Else', isAdmin: false }
// Never called for real: every probe that reaches it is refused or stops at an unknown id first.
const deps: RevisionDeps = { renderer: { renderBody: async () => new Uint8Array(), finishPdf: async () => new Uint8Array() }, store: { put: async () => {}, get: async () => new Uint8Array() } }

beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people, projectId } = await seededDemo())
  // A calc whose inputs cannot be saved as a revision, so a permitted submit stops at validation.
  await db.insert(calcs).values({ id: calcId, projectId, number: 'PROBE-1', title: 'Permission probe', calcType: 'peaucellier', draftInputs: { mechanism: 'peaucellier' } })
  await db.insert(projects).values({ id: 'p-outsider', code: 'OUT-1', name: 'Another firm’s project' })
}, 60_000)
afterAll(() => env.close())

let n = 0
const PROBES: Record<Permission, (c: Caller | null) => Promise<unknown>> = {
  'project.view': (c) => listCalcs(c, projectId),
  'project.create': (c) => createProject(c, { code: `PRB-${++n}`, name: 'Probe project', client: '' }),
  'member.manage': (c) => changeMemberRole(c, projectId, 'no-such-user', 'checker'),
  'mail.view': async (c) => caughtMail(c),
  'calc.create': (c) => createCalc(c, projectId, { number: `PRB-${++n}`, title: 'Probe calc', calcType: 'hart' }),
  'calc.edit': (c) => saveInputs(c, projectId, calcId, { mechanism: 'peaucellier' }),
  'calc.submit': (c) => saveRevision(c, projectId, calcId, deps),
  'material.create': (c) => addMaterial(c, projectId, 'S355', {}),
  'remark.create': (c) => addRemark(c, projectId, calcId, { revisionId: 'no-such-revision', stepId: 'x', severity: 'note', text: 'probe' }),
  'remark.respond': (c) => replyToRemark(c, projectId, calcId, 'no-such-remark', 'probe'),
  'remark.close': (c) => closeRemark(c, projectId, calcId, 'no-such-remark'),
  'calc.check': (c) => transitionRevision(c, projectId, calcId, 'no-such-revision', 'check', deps),
  'calc.approve': (c) => transitionRevision(c, projectId, calcId, 'no-such-revision', 'approve', deps),
  'calc.issue': (c) => transitionRevision(c, projectId, calcId, 'no-such-revision', 'issue', deps),
  'pdf.download': (c) => revisionPdf(c, projectId, calcId, 'no-such-revision', 'A4', deps),
}

/** What the caller met: refused at the gate (as HTTP would say it), or let through to the work. */
async function outcome(call: Promise<unknown>): Promise<'allowed' | 401 | 403 | 404> {
  try {
    await call
    return 'allowed'
  } catch (err) {
    if (!(err instanceof AppError)) throw err
    if (err.code === 'unauthenticated') return 401
    if (err.code === 'forbidden' && !/two roles/.test(err.message)) return 403
    if (err.code === 'not_found' && err.message === 'No such project.') return 404
    return 'allowed'
  }
}

const SITE_WIDE: Permission[] = ['project.create', 'mail.view']
/** Site admins manage people and projects and may read any project; they do not write or sign calcs. */
const ADMIN: Permission[] = ['project.view', 'project.create', 'member.manage', 'mail.view', 'pdf.download']

describe('every service checks its permission', () => {
  it('has a probe for every row of the permission table', () => {
    expect(Object.keys(PROBES).sort()).toEqual(Object.keys(PERMISSIONS).sort())
  })

  const rows = Object.keys(PERMISSIONS) as Permission[]
  it.each(rows)('%s: allowed for exactly its roles; 403 for the others, 404 for an outsider, 401 for nobody', async (permission) => {
    const probe = PROBES[permission]
    const roles: readonly string[] = PERMISSIONS[permission]
    for (const role of ['engineer', 'checker', 'approver'] as const) {
      expect(await outcome(probe(people[role])), `${role} → ${permission}`).toBe(roles.includes(role) ? 'allowed' : 403)
    }
    expect(await outcome(probe(people.admin)), `admin → ${permission}`).toBe(ADMIN.includes(permission) ? 'allowed' : 403)
    expect(await outcome(probe(outsider)), `outsider → ${permission}`).toBe(SITE_WIDE.includes(permission) ? 403 : 404)
    expect(await outcome(probe(null)), `nobody → ${permission}`).toBe(401)
  })

  it('an upload is checked like any write (calc.edit)', async () => {
    const file = { name: 'x.pdf', bytes: new Uint8Array([37, 80, 68, 70, 45]) }
    const store = { put: async () => {}, get: async () => new Uint8Array() }
    expect(await outcome(addAttachment(people.checker, projectId, calcId, file, store))).toBe(403)
    expect(await outcome(addAttachment(outsider, projectId, calcId, file, store))).toBe(404)
  })
})
