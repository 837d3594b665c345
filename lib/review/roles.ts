export const PROJECT_ROLES = ['engineer', 'checker', 'approver'] as const
export type ProjectRole = (typeof PROJECT_ROLES)[number]

export const ROLE_LABELS: Record<ProjectRole, string> = {
  engineer: 'Design engineer',
  checker: 'Checker',
  approver: 'Approver',
}
