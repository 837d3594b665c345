import { and, asc, desc, eq, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/sqlite-core'
import type { Actor } from '@/lib/review/permissions'
import { db } from './index'
import { calcs, projectMembers, projects, revisions, users } from './schema'

export async function getUserByEmail(email: string) {
  const [user] = await db.select().from(users).where(eq(users.email, email))
  return user ?? null
}

/** Projects the user belongs to; a site admin sees every project. */
export async function listProjectsForUser(userId: string, isAdmin: boolean) {
  const calcCount = sql<number>`(select count(*) from ${calcs} where ${calcs.projectId} = ${projects.id})`
  const base = db
    .select({ id: projects.id, code: projects.code, name: projects.name, client: projects.client, calcCount, role: projectMembers.role })
    .from(projects)
    .leftJoin(projectMembers, and(eq(projectMembers.projectId, projects.id), eq(projectMembers.userId, userId)))
  const rows = await (isAdmin ? base : base.where(eq(projectMembers.userId, userId))).orderBy(asc(projects.code))
  return rows
}

export async function getProject(projectId: string) {
  const [project] = await db.select().from(projects).where(eq(projects.id, projectId))
  return project ?? null
}

/** The actor for permission checks: site admin flag plus the role in this project. */
export async function getActor(user: { id: string; isAdmin: boolean }, projectId: string): Promise<Actor> {
  const [member] = await db
    .select({ role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, user.id)))
  return { userId: user.id, isAdmin: user.isAdmin, role: member?.role ?? null }
}

export async function listMembers(projectId: string) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: projectMembers.role, active: sql<boolean>`${users.passwordHash} is not null` })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .where(eq(projectMembers.projectId, projectId))
    .orderBy(asc(projectMembers.role), asc(users.name))
}

const engineer = alias(users, 'engineer')
const checker = alias(users, 'checker')
const approver = alias(users, 'approver')

/** One row per calc for the register, with the newest revision's label. */
export async function listRegister(projectId: string) {
  const currentRevision = sql<string | null>`(select ${revisions.label} from ${revisions} where ${revisions.calcId} = ${calcs.id} order by ${revisions.createdAt} desc limit 1)`
  return db
    .select({
      id: calcs.id,
      number: calcs.number,
      title: calcs.title,
      calcType: calcs.calcType,
      state: calcs.state,
      currentRevision,
      engineer: engineer.name,
      checker: checker.name,
      approver: approver.name,
      updatedAt: calcs.updatedAt,
    })
    .from(calcs)
    .leftJoin(engineer, eq(engineer.id, calcs.engineerId))
    .leftJoin(checker, eq(checker.id, calcs.checkerId))
    .leftJoin(approver, eq(approver.id, calcs.approverId))
    .where(eq(calcs.projectId, projectId))
    .orderBy(asc(calcs.number))
}

export type RegisterRow = Awaited<ReturnType<typeof listRegister>>[number]

/** A calc, only if it belongs to the given project (ownership in the WHERE clause). */
export async function getCalc(projectId: string, calcId: string) {
  const [calc] = await db
    .select()
    .from(calcs)
    .where(and(eq(calcs.id, calcId), eq(calcs.projectId, projectId)))
  return calc ?? null
}

export async function listRevisions(calcId: string) {
  return db.select().from(revisions).where(eq(revisions.calcId, calcId)).orderBy(desc(revisions.createdAt))
}
