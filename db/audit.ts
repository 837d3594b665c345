import { db } from './index'
import { auditEvents } from './schema'

export interface AuditInput {
  userId: string | null
  action: string
  projectId?: string | null
  calcId?: string | null
  detail?: Record<string, unknown>
}

/** Everything that changes what a project holds is written here, with who and when. */
export async function audit(event: AuditInput): Promise<void> {
  await db.insert(auditEvents).values({
    userId: event.userId,
    action: event.action,
    projectId: event.projectId ?? null,
    calcId: event.calcId ?? null,
    detail: event.detail ?? null,
  })
}
