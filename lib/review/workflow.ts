import type { Permission } from './permissions'

/*
 * The revision workflow as data: every state and every transition, read by the services (who may
 * move what, where to), the revision panel (buttons, confirmations), the package (watermark), the
 * demo seed and the test of the SQL triggers. Adding a state is a row here plus a migration that
 * teaches the triggers about it.
 */

export const REVISION_STATES = ['draft', 'in-check', 'returned', 'checked', 'approved', 'issued', 'superseded', 'withdrawn', 'voided'] as const
export type RevisionState = (typeof REVISION_STATES)[number]

export interface StateSpec {
  label: string
  /** Printed across every page of the package; null where the package may be relied on. */
  watermark: string | null
  /** The signatures and the stored PDF are the record: the database refuses any change to them. */
  sealed: boolean
  /** Still moving through check: a newer revision of the same calc replaces it. */
  open: boolean
  /** Badge look (shape and text carry the state, not colour alone). */
  badge: string
}

export const STATES: Record<RevisionState, StateSpec> = {
  draft: { label: 'Draft', watermark: 'DRAFT', sealed: false, open: true, badge: 'border-dashed border-ink/50 text-ink' },
  'in-check': { label: 'In check', watermark: 'IN CHECK', sealed: false, open: true, badge: 'border-caution text-caution bg-caution-soft' },
  returned: { label: 'Returned', watermark: 'RETURNED TO ENGINEER', sealed: false, open: true, badge: 'border-fail border-dashed text-fail bg-fail-soft' },
  checked: { label: 'Checked', watermark: 'CHECKED — NOT APPROVED', sealed: false, open: true, badge: 'border-accent text-accent' },
  approved: { label: 'Approved', watermark: 'APPROVED — NOT ISSUED', sealed: false, open: true, badge: 'border-accent bg-accent text-white' },
  issued: { label: 'Issued', watermark: null, sealed: true, open: false, badge: 'border-pass bg-pass text-white' },
  superseded: { label: 'Superseded', watermark: 'SUPERSEDED', sealed: true, open: false, badge: 'border-ink/40 text-ink/70 line-through' },
  withdrawn: { label: 'Withdrawn', watermark: 'WITHDRAWN', sealed: false, open: false, badge: 'border-ink/40 text-ink/70 line-through' },
  voided: { label: 'Voided', watermark: 'VOID', sealed: true, open: false, badge: 'border-fail bg-fail text-white line-through' },
}

/** Who a notice goes to when a transition happens. */
export type Addressee = 'checker' | 'engineer' | 'approver' | 'members'

export const TRANSITION_ACTIONS = ['return', 'resubmit', 'check', 'approve', 'issue', 'withdraw', 'void'] as const
export type TransitionAction = (typeof TRANSITION_ACTIONS)[number]

export interface TransitionSpec {
  /** Stable name, used by the API (`POST …/transitions { action }`) and the CLI. */
  action: TransitionAction
  from: readonly RevisionState[]
  to: RevisionState
  permission: Permission
  /** The signature slot the acting person fills; the same person never signs one revision twice. */
  signs: 'checker' | 'approver' | null
  /** Only the person named for this role at submission may take the action (when one was named). */
  named: 'checker' | 'approver' | null
  button: string
  /** Asked before the action is sent; the server signs only what this shows. */
  confirm: string
  /** The acting person re-enters their password (an Ed25519 signature is recorded). */
  password: boolean
  /** A reason must be given (kept in the history and the audit trail). */
  reason: boolean
  /** Refused while remarks of these severities are open on the revision. */
  blockedBy: 'must-resolve' | 'any' | null
  /** Moving to `to` also moves the calc's other revisions in these states to `superseded`. */
  supersedes: readonly RevisionState[]
  notice: Addressee
  /** What the notice asks of the addressee. */
  ask: string
  done: string
}

export const TRANSITIONS: readonly TransitionSpec[] = [
  {
    action: 'return',
    from: ['in-check'],
    to: 'returned',
    permission: 'calc.check',
    signs: null,
    named: 'checker',
    button: 'Return to engineer',
    confirm: 'Return this revision to the engineer? Say what must change.',
    password: false,
    reason: true,
    blockedBy: null,
    supersedes: [],
    notice: 'engineer',
    ask: 'was returned to you: answer the remarks, then resubmit or save a new revision',
    done: 'Revision returned to the engineer.',
  },
  {
    action: 'resubmit',
    from: ['returned'],
    to: 'in-check',
    permission: 'calc.submit',
    signs: null,
    named: null,
    button: 'Resubmit for check',
    confirm: 'Send this revision back to check unchanged (remarks answered)?',
    password: false,
    reason: false,
    blockedBy: null,
    supersedes: [],
    notice: 'checker',
    ask: 'is back in check: review the answers',
    done: 'Revision resubmitted for check.',
  },
  {
    action: 'check',
    from: ['in-check'],
    to: 'checked',
    permission: 'calc.check',
    signs: 'checker',
    named: 'checker',
    button: 'Sign as checked',
    confirm: 'Sign this revision as checked: its content hash is signed with your name and the time.',
    password: true,
    reason: false,
    blockedBy: 'must-resolve',
    supersedes: [],
    notice: 'approver',
    ask: 'is checked and waits for your approval',
    done: 'Revision signed as checked.',
  },
  {
    action: 'approve',
    from: ['checked'],
    to: 'approved',
    permission: 'calc.approve',
    signs: 'approver',
    named: 'approver',
    button: 'Sign as approved',
    confirm: 'Sign this revision as approved: its content hash is signed with your name and the time.',
    password: true,
    reason: false,
    blockedBy: 'any',
    supersedes: [],
    notice: 'approver',
    ask: 'is approved and ready to issue',
    done: 'Revision approved.',
  },
  {
    action: 'issue',
    from: ['approved'],
    to: 'issued',
    permission: 'calc.issue',
    signs: null,
    named: 'approver',
    button: 'Issue',
    confirm: 'Issue this revision? The package becomes the signed record and the previous issue is superseded.',
    password: true,
    reason: false,
    blockedBy: 'any',
    supersedes: ['issued'],
    notice: 'members',
    ask: 'has been issued',
    done: 'Revision issued.',
  },
  {
    action: 'withdraw',
    from: ['in-check', 'returned', 'checked', 'approved'],
    to: 'withdrawn',
    permission: 'calc.submit',
    signs: null,
    named: null,
    button: 'Withdraw',
    confirm: 'Withdraw this revision from check? Say why; it can no longer be signed.',
    password: false,
    reason: true,
    blockedBy: null,
    supersedes: [],
    notice: 'checker',
    ask: 'was withdrawn by the engineer: nothing more to check',
    done: 'Revision withdrawn.',
  },
  {
    action: 'void',
    from: ['issued'],
    to: 'voided',
    permission: 'calc.issue',
    signs: null,
    named: null,
    button: 'Void',
    confirm: 'Void this issued revision? Say why; every copy of its package stops being valid.',
    password: true,
    reason: true,
    blockedBy: null,
    supersedes: [],
    notice: 'members',
    ask: 'has been voided and must not be used',
    done: 'Revision voided.',
  },
]

/** Saving the working inputs as a new revision: it starts in this state and replaces the open ones. */
export const SUBMIT = { to: 'in-check', permission: 'calc.submit', supersedes: ['in-check', 'returned', 'checked', 'approved'], notice: 'checker' } as const satisfies {
  to: RevisionState
  permission: Permission
  supersedes: readonly RevisionState[]
  notice: Addressee
}

export function transitionOf(action: string): TransitionSpec | undefined {
  return TRANSITIONS.find((t) => t.action === action)
}

/** The transitions that leave a state (what the revision panel offers). */
export function transitionsFrom(state: RevisionState): TransitionSpec[] {
  return TRANSITIONS.filter((t) => t.from.includes(state))
}

export function stateLabel(state: RevisionState): string {
  return STATES[state].label
}

/** Remark severities, most severe first (the API's enum keeps this order). */
export const REMARK_SEVERITIES = ['must-resolve', 'please-confirm', 'note'] as const
export type RemarkSeverity = (typeof REMARK_SEVERITIES)[number]
export const SEVERITY_LABELS: Record<RemarkSeverity, string> = {
  'must-resolve': 'Must be resolved',
  'please-confirm': 'Please confirm',
  note: 'Note',
}

/** State names by state, read from the table. */
export const STATE_LABELS = Object.fromEntries(REVISION_STATES.map((s) => [s, STATES[s].label])) as Record<RevisionState, string>
