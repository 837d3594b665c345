import { REVISION_STATES, STATES, type RevisionState } from './workflow'

export const PROJECT_ROLES = ['engineer', 'checker', 'approver'] as const
export type ProjectRole = (typeof PROJECT_ROLES)[number]

export const ROLE_LABELS: Record<ProjectRole, string> = {
  engineer: 'Design engineer',
  checker: 'Checker',
  approver: 'Approver',
}

export { REVISION_STATES, type RevisionState }

/** State names, read from the workflow table. */
export const STATE_LABELS = Object.fromEntries(REVISION_STATES.map((s) => [s, STATES[s].label])) as Record<RevisionState, string>
