export const PROJECT_ROLES = ['engineer', 'checker', 'approver'] as const
export type ProjectRole = (typeof PROJECT_ROLES)[number]

export const ROLE_LABELS: Record<ProjectRole, string> = {
  engineer: 'Design engineer',
  checker: 'Checker',
  approver: 'Approver',
}

/** A revision moves draft → in-check → checked → approved → issued; a newer issue supersedes it. */
export const REVISION_STATES = ['draft', 'in-check', 'checked', 'approved', 'issued', 'superseded'] as const
export type RevisionState = (typeof REVISION_STATES)[number]

export const STATE_LABELS: Record<RevisionState, string> = {
  draft: 'Draft',
  'in-check': 'In check',
  checked: 'Checked',
  approved: 'Approved',
  issued: 'Issued',
  superseded: 'Superseded',
}

/** States whose stored inputs, result and PDF may no longer change. */
export const FROZEN_STATES: readonly RevisionState[] = ['approved', 'issued', 'superseded']
