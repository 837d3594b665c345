import { describe, expect, it } from 'vitest'
import { AppError } from '@/lib/errors'
import { assertCan, can, type Actor, type Permission } from '@/lib/review/permissions'
import type { ProjectRole } from '@/lib/review/roles'

const actor = (role: ProjectRole | null, isAdmin = false): Actor => ({ userId: 'u', isAdmin, role })

// Who may do what, written out as a matrix so a change to the table is a visible change here.
// Separation of duties (engineer ≠ checker ≠ approver) is common practice for signed calcs.
const MATRIX: [Permission, { engineer: boolean; checker: boolean; approver: boolean; admin: boolean; outsider: boolean }][] = [
  ['project.view', { engineer: true, checker: true, approver: true, admin: true, outsider: false }],
  ['calc.create', { engineer: true, checker: false, approver: false, admin: false, outsider: false }],
  ['calc.edit', { engineer: true, checker: false, approver: false, admin: false, outsider: false }],
  ['remark.create', { engineer: false, checker: true, approver: false, admin: false, outsider: false }],
  ['calc.check', { engineer: false, checker: true, approver: false, admin: false, outsider: false }],
  ['calc.approve', { engineer: false, checker: false, approver: true, admin: false, outsider: false }],
  ['calc.issue', { engineer: false, checker: false, approver: true, admin: false, outsider: false }],
  ['member.manage', { engineer: false, checker: false, approver: false, admin: true, outsider: false }],
  ['project.create', { engineer: false, checker: false, approver: false, admin: true, outsider: false }],
  ['mail.view', { engineer: false, checker: false, approver: false, admin: true, outsider: false }],
  ['pdf.download', { engineer: true, checker: true, approver: true, admin: true, outsider: false }],
]

describe('permission table', () => {
  it.each(MATRIX)('%s is allowed exactly for the expected roles', (permission, expected) => {
    expect(can(actor('engineer'), permission)).toBe(expected.engineer)
    expect(can(actor('checker'), permission)).toBe(expected.checker)
    expect(can(actor('approver'), permission)).toBe(expected.approver)
    expect(can(actor(null, true), permission)).toBe(expected.admin)
    expect(can(actor(null), permission)).toBe(expected.outsider)
  })

  it('an admin who is also a project engineer keeps the engineer rights', () => {
    expect(can(actor('engineer', true), 'calc.create')).toBe(true)
  })

  it('assertCan throws a forbidden AppError that names the permission', () => {
    expect(() => assertCan(actor('checker'), 'calc.create')).toThrowError(AppError)
    try {
      assertCan(actor('checker'), 'calc.create')
    } catch (err) {
      expect((err as AppError).code).toBe('forbidden')
      expect((err as AppError).message).toContain('calc.create')
    }
  })
})
