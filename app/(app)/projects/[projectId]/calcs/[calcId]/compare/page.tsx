import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import { loadProjectContext } from '@/app/_lib/project-context'
import { listRevisions } from '@/db/queries'
import { formatNumber } from '@/reports/model/format'
import { AppError } from '@/lib/errors'
import { compareRevisions } from '@/server/compare'

export const metadata: Metadata = { title: 'Compare revisions' }

type Props = { params: Promise<{ projectId: string; calcId: string }>; searchParams: Promise<{ from?: string; to?: string }> }

const show = (v: unknown) => (v === undefined ? '—' : typeof v === 'number' ? formatNumber(v) : String(v))
const pct = (p: number | null) => (p === null ? '—' : `${p > 0 ? '+' : ''}${p.toFixed(1)} %`)

export default async function ComparePage({ params, searchParams }: Props) {
  const [{ projectId, calcId }, q] = await Promise.all([params, searchParams])
  const { user } = await loadProjectContext(projectId)
  const revisions = await listRevisions(calcId)
  if (revisions.length < 2) notFound()
  const from = q.from ?? revisions[1].id
  const to = q.to ?? revisions[0].id
  let diff: Awaited<ReturnType<typeof compareRevisions>>
  try {
    diff = await compareRevisions(user, projectId, calcId, from, to)
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound()
    throw err
  }
  const base = `/projects/${projectId}/calcs/${calcId}`
  return (
    <div className="flex flex-col gap-5">
      <Link href={base} className="font-mono text-xs text-accent underline">
        back to the calc
      </Link>
      <h1 className="h1">
        Changes from rev {diff.from.label} to rev {diff.to.label}
      </h1>
      <form className="flex flex-wrap items-end gap-3 text-sm" action="">
        {(['from', 'to'] as const).map((k) => (
          <label key={k} className="flex flex-col">
            <span className="label">{k === 'from' ? 'From' : 'To'}</span>
            <select name={k} defaultValue={k === 'from' ? from : to} className="field">
              {revisions.map((r) => (
                <option key={r.id} value={r.id}>
                  Rev {r.label}
                </option>
              ))}
            </select>
          </label>
        ))}
        <button className="btn-quiet">Compare</button>
      </form>
      <section className="panel p-4" data-testid="verdict-change">
        <h2 className="h2">Verdict</h2>
        <p className="mt-1">
          {diff.verdict.changed ? 'Changed: ' : 'Unchanged: '}
          {(diff.verdict.from as { pass: boolean }).pass ? 'PASS' : 'FAIL'} → {(diff.verdict.to as { pass: boolean }).pass ? 'PASS' : 'FAIL'}; governing {(diff.verdict.to as { governing: string }).governing}
        </p>
      </section>
      <Table
        title={`Inputs (${diff.inputRows.length} changed)`}
        head={['Input', 'Unit', `Rev ${diff.from.label}`, `Rev ${diff.to.label}`]}
        rows={diff.inputRows.map((c) => [c.input, c.unit || '—', show(c.from ?? undefined), show(c.to ?? undefined)])}
      />
      <Table
        title={`Results (${diff.values.length} changed)`}
        head={['Step', 'Unit', `Rev ${diff.from.label}`, `Rev ${diff.to.label}`, 'Change', '%']}
        rows={diff.values.map((v) => [`${v.title} (${v.id})`, v.unit, show(v.from ?? undefined), show(v.to ?? undefined), show(v.change ?? undefined), pct(v.percent)])}
      />
      <Table
        title={`Checks (${diff.checks.length} changed)`}
        head={['Check', `Rev ${diff.from.label}`, `Rev ${diff.to.label}`, 'Change', '%', 'Verdict']}
        rows={diff.checks.map((c) => [c.id, show(c.from ?? undefined), show(c.to ?? undefined), show(c.change ?? undefined), pct(c.percent), `${c.fromPass === null ? '—' : c.fromPass ? 'pass' : 'fail'} → ${c.toPass === null ? '—' : c.toPass ? 'pass' : 'fail'}`])}
      />
    </div>
  )
}

function Table({ title, head, rows }: { title: string; head: string[]; rows: string[][] }) {
  return (
    <section className="flex flex-col gap-2">
      <h2 className="h2">{title}</h2>
      {rows.length === 0 ? (
        <p className="text-ink/70">No change.</p>
      ) : (
        <div className="panel overflow-x-auto" tabIndex={0} role="region" aria-label={title}>
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b border-rule text-left text-xs text-ink/70">
                {head.map((h) => (
                  <th key={h} className="px-3 py-1.5">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => (
                <tr key={i} className="border-b border-rule last:border-0">
                  {r.map((c, j) => (
                    <td key={j} className={`px-3 py-1 ${j > 0 ? 'font-mono' : ''}`}>
                      {c}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  )
}
