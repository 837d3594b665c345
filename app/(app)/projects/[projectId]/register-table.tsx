'use client'

import Link from 'next/link'
import { useMemo, useState } from 'react'
import useSWR from 'swr'
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table'
import { StateBadge } from '@/app/_components/state-badge'
import { CALC_TYPE_LABELS, type CalcType } from '@/lib/schemas/project'
import type { RevisionState } from '@/lib/review/workflow'

interface Row {
  id: string
  number: string
  title: string
  mechanism: CalcType
  state: RevisionState
  currentRevision: string | null
  engineer: string | null
  checker: string | null
  approver: string | null
  updatedAt: string
  verdict: 'pass' | 'fail' | 'infeasible' | null
  maxUtilisation: number | null
  governing: string | null
  openRemarks: number
}

const VERDICT = {
  pass: { label: 'PASS', style: 'border-pass text-pass' },
  fail: { label: 'FAIL', style: 'border-fail text-fail' },
  infeasible: { label: 'INFEASIBLE', style: 'border-fail text-fail' },
} as const

async function fetchJson<T>(url: string): Promise<T> {
  const res = await fetch(url)
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? `HTTP ${res.status}`)
  return res.json() as Promise<T>
}

const col = createColumnHelper<Row>()

/** The calc register: sortable by any column, filtered by one search box over every text column. */
export function RegisterTable({ projectId }: { projectId: string }) {
  const { data, error, isLoading } = useSWR(`/api/v1/projects/${projectId}/calcs`, fetchJson<{ items: Row[] }>)
  const [sorting, setSorting] = useState<SortingState>([{ id: 'number', desc: false }])
  const [filter, setFilter] = useState('')
  const columns = useMemo(
    () => [
      col.accessor('number', {
        header: 'Number',
        cell: (c) => (
          <Link href={`/projects/${projectId}/calcs/${c.row.original.id}`} className="font-mono text-accent underline">
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor('title', { header: 'Title' }),
      col.accessor((r) => CALC_TYPE_LABELS[r.mechanism], { id: 'type', header: 'Type' }),
      col.accessor('currentRevision', { header: 'Rev.', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('state', { header: 'State', cell: (c) => <StateBadge state={c.getValue()} /> }),
      col.accessor('verdict', {
        header: 'Verdict',
        cell: (c) => {
          const v = c.getValue()
          return v ? (
            <span className={`rounded-sm border px-1.5 py-0.5 text-[11px] font-semibold ${VERDICT[v].style}`} title={c.row.original.governing ?? undefined}>
              {VERDICT[v].label}
            </span>
          ) : (
            '—'
          )
        },
      }),
      col.accessor('maxUtilisation', { header: 'Utilisation', cell: (c) => (c.getValue() === null ? '—' : (c.getValue() as number).toFixed(2)), sortUndefined: 'last' }),
      col.accessor('openRemarks', { header: 'Open remarks', cell: (c) => (c.getValue() ? <strong className="text-fail">{c.getValue()}</strong> : '0') }),
      col.accessor('engineer', { header: 'Engineer', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('checker', { header: 'Checker', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('approver', { header: 'Approver', cell: (c) => c.getValue() ?? '—' }),
      col.accessor('updatedAt', { header: 'Last change', cell: (c) => new Date(c.getValue()).toISOString().slice(0, 16).replace('T', ' ') }),
    ],
    [projectId],
  )
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  })

  if (error) return <p role="alert" className="panel bg-fail-soft p-4 text-fail">Could not load the register: {String(error.message)}</p>
  return (
    <div className="panel">
      <div className="flex items-center gap-3 border-b border-rule px-3 py-2">
        <input
          type="search"
          placeholder="Filter by number, title, person, state…"
          aria-label="Filter the register"
          className="field max-w-sm"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
        />
        <span className="text-xs text-ink/80">{isLoading ? 'Loading…' : `${table.getRowModel().rows.length} of ${data?.items.length ?? 0} calcs`}</span>
      </div>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Calc register (scrolls sideways)">
      <table className="w-full text-left text-sm" data-testid="register">
        <thead className="bg-paper text-xs text-ink/80">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const dir = h.column.getIsSorted()
                return (
                  <th key={h.id} className="px-3 py-2 font-semibold" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : 'none'}>
                    <button type="button" className="flex items-center gap-1 hover:text-accent" onClick={h.column.getToggleSortingHandler()}>
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span aria-hidden="true">{dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : ''}</span>
                    </button>
                  </th>
                )
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-t border-rule hover:bg-accent-soft/40">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-3 py-1.5 whitespace-nowrap">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
          {!isLoading && table.getRowModel().rows.length === 0 && (
            <tr>
              <td colSpan={columns.length} className="px-3 py-6 text-center text-ink/80">
                {data?.items.length ? 'No calc matches the filter.' : 'No calcs yet.'}
              </td>
            </tr>
          )}
        </tbody>
      </table>
      </div>
    </div>
  )
}
