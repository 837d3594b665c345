import { STATE_LABELS, type RevisionState } from '@/lib/review/roles'

// Shape and text carry the state, not colour alone.
const STYLE: Record<RevisionState, string> = {
  draft: 'border-dashed border-ink/40 text-ink/70',
  'in-check': 'border-caution text-caution bg-caution-soft',
  checked: 'border-accent text-accent',
  approved: 'border-accent bg-accent-soft text-accent',
  issued: 'border-pass bg-pass text-white',
  superseded: 'border-ink/30 text-ink/50 line-through',
}

export function StateBadge({ state }: { state: RevisionState }) {
  return <span className={`inline-block rounded-sm border px-1.5 py-0.5 text-[11px] font-semibold ${STYLE[state]}`}>{STATE_LABELS[state]}</span>
}
