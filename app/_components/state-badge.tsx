import { STATES, type RevisionState } from '@/lib/review/workflow'

// Shape and text carry the state, not colour alone; both come from the workflow table.
export function StateBadge({ state }: { state: RevisionState }) {
  const s = STATES[state]
  return <span className={`inline-block rounded-sm border px-1.5 py-0.5 text-[11px] font-semibold ${s.badge}`}>{s.label}</span>
}
