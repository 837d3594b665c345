import type { Permission } from './permissions'

/*
 * The revision workflow as data: every state and every transition, read by the services (who may
 * move what, where to), the revision panel (buttons, confirmations), the package (watermark), the
 * demo seed and the test of the SQL triggers. Adding a state is a row here plus a migration that
 * teaches the triggers about it.
 */

export const REVISION_STATES = ['draft', 'in-check', 'checked', 'approved', 'issued', 'superseded'] as const
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
  draft: { label: 'Draft', watermark: 'DRAFT', sealed: false, open: true, badge: 'border-dashed border-ink/40 text-ink/70' },
  'in-check': { label: 'In check', watermark: 'IN CHECK', sealed: false, open: true, badge: 'border-caution text-caution bg-caution-soft' },
  checked: { label: 'Checked', watermark: 'CHECKED — NOT APPROVED', sealed: false, open: true, badge: 'border-accent text-accent' },
  approved: { label: 'Approved', watermark: 'APPROVED — NOT ISSUED', sealed: false, open: true, badge: 'border-accent bg-accent text-white' },
  issued: { label: 'Issued', watermark: null, sealed: true, open: false, badge: 'border-pass bg-pass text-white' },
  superseded: { label: 'Superseded', watermark: 'SUPERSEDED', sealed: true, open: false, badge: 'border-ink/30 text-ink/50 line-through' },
}

/** Who a notice goes to when a transition happens. */
export type Addressee = 'checker' | 'engineer' | 'approver' | 'members'

export interface TransitionSpec {
  /** Stable name, used by the API (`POST …/transitions { action }`) and the CLI. */
  action: 'check' | 'approve' | 'issue'
  from: RevisionState
  to: RevisionState
  permission: Permission
  /** The signature slot the acting person fills; the same person never signs one revision twice. */
  signs: 'checker' | 'approver' | null
  button: string
  /** Asked before the action is sent. */
  confirm: string
  /** The acting person re-enters their password to sign. */
  password: boolean
  /** Moving to `to` also moves the calc's other revisions in these states to `superseded`. */
  supersedes: readonly RevisionState[]
  notice: Addressee
  done: string
}

export const TRANSITIONS: readonly TransitionSpec[] = [
  {
    action: 'check',
    from: 'in-check',
    to: 'checked',
    permission: 'calc.check',
    signs: 'checker',
    button: 'Mark as checked',
    confirm: 'Sign this revision as checked?',
    password: false,
    supersedes: [],
    notice: 'approver',
    done: 'Revision marked as checked.',
  },
  {
    action: 'approve',
    from: 'checked',
    to: 'approved',
    permission: 'calc.approve',
    signs: 'approver',
    button: 'Approve',
    confirm: 'Sign this revision as approved?',
    password: false,
    supersedes: [],
    notice: 'engineer',
    done: 'Revision approved.',
  },
  {
    action: 'issue',
    from: 'approved',
    to: 'issued',
    permission: 'calc.issue',
    signs: null,
    button: 'Issue',
    confirm: 'Issue this revision? The package becomes the record and the previous issue is superseded.',
    password: false,
    supersedes: ['issued'],
    notice: 'members',
    done: 'Revision issued.',
  },
]

export type TransitionAction = TransitionSpec['action']
export const TRANSITION_ACTIONS = TRANSITIONS.map((t) => t.action) as [TransitionAction, ...TransitionAction[]]

/** Saving the working inputs as a new revision: it starts in this state and replaces the open ones. */
export const SUBMIT = { to: 'in-check', permission: 'calc.submit', supersedes: REVISION_STATES.filter((s) => STATES[s].open) } as const satisfies {
  to: RevisionState
  permission: Permission
  supersedes: readonly RevisionState[]
}

export function transitionOf(action: string): TransitionSpec | undefined {
  return TRANSITIONS.find((t) => t.action === action)
}

/** The transitions that leave a state (what the revision panel offers). */
export function transitionsFrom(state: RevisionState): TransitionSpec[] {
  return TRANSITIONS.filter((t) => t.from === state)
}

export function stateLabel(state: RevisionState): string {
  return STATES[state].label
}

/** State names by state, read from the table. */
export const STATE_LABELS = Object.fromEntries(REVISION_STATES.map((s) => [s, STATES[s].label])) as Record<RevisionState, string>
