import type { AuditRow } from '@/server/audit-trail'

const detailText = (d: Record<string, unknown>) =>
  Object.entries(d)
    .filter(([k, v]) => v !== null && v !== undefined && !/Id$/.test(k) && !(Array.isArray(v) && v.length === 0))
    .map(([k, v]) => `${k}: ${Array.isArray(v) ? v.join(', ') : String(v)}`)
    .join('; ')

/** The audit trail as a table: when, who, which calc, what. */
export function AuditTable({ rows, csvHref }: { rows: AuditRow[]; csvHref: string }) {
  return (
    <div className="flex flex-col gap-2">
      <a className="self-start text-sm text-accent underline" href={csvHref} download>
        Download as CSV
      </a>
      <div className="panel overflow-x-auto" tabIndex={0} role="region" aria-label="Audit trail">
        <table className="w-full text-sm" data-testid="audit">
          <thead>
            <tr className="border-b border-rule text-left text-xs text-ink/70">
              <th className="px-3 py-1.5">When (UTC)</th>
              <th className="px-3 py-1.5">Who</th>
              <th className="px-3 py-1.5">Calc</th>
              <th className="px-3 py-1.5">What</th>
              <th className="px-3 py-1.5">Detail</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i} className="border-b border-rule last:border-0">
                <td className="px-3 py-1 font-mono text-xs whitespace-nowrap">{r.at.slice(0, 19).replace('T', ' ')}</td>
                <td className="px-3 py-1">{r.who}</td>
                <td className="px-3 py-1 font-mono">{r.calc ?? ''}</td>
                <td className="px-3 py-1">{r.what}</td>
                <td className="px-3 py-1 text-xs text-ink/70">{detailText(r.detail)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  )
}
