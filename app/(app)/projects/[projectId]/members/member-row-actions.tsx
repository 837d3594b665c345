'use client'

import { useActionState } from 'react'
import { PROJECT_ROLES, ROLE_LABELS, type ProjectRole } from '@/lib/review/roles'
import { changeRoleAction, removeMemberAction } from '../actions'

/** Role change and removal for one member row; each form posts to a guarded server action. */
export function MemberRowActions({ projectId, userId, role, name }: { projectId: string; userId: string; role: ProjectRole; name: string }) {
  const [roleState, changeRole] = useActionState(changeRoleAction, {})
  const [removeState, remove] = useActionState(removeMemberAction, {})
  const message = (roleState.ok ? undefined : roleState.message) ?? (removeState.ok ? undefined : removeState.message)
  return (
    <div className="flex items-center gap-2">
      <form action={changeRole} className="flex items-center gap-1">
        <input type="hidden" name="projectId" value={projectId} />
        <input type="hidden" name="userId" value={userId} />
        <label htmlFor={`role-${userId}`} className="sr-only">
          Role of {name}
        </label>
        <select id={`role-${userId}`} name="role" defaultValue={role} className="field w-auto py-0.5 text-xs">
          {PROJECT_ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
        <button type="submit" className="btn-quiet py-0.5 text-xs">
          Change
        </button>
      </form>
      <form action={remove}>
        <input type="hidden" name="projectId" value={projectId} />
        <input type="hidden" name="userId" value={userId} />
        <button type="submit" className="btn-quiet py-0.5 text-xs text-fail" aria-label={`Remove ${name} from the project`}>
          Remove
        </button>
      </form>
      {message && (
        <span role="alert" className="text-xs text-fail">
          {message}
        </span>
      )}
    </div>
  )
}
