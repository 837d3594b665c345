'use client'

import { memo, useMemo, useState } from 'react'
import { createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table'
import type { CalcResult } from '@/lib/calc/run'
import type { PositionResult } from '@/lib/contract'
import { displayUnit, fromSI, kindOfSILabel, type UnitSystem } from '@/lib/units'
import { useCrank } from './crank-context'

interface Row {
  crankDeg: number
  x: number
  y: number
  torque: number
  transmission: number | null
  links: Record<string, number>
  pins: Record<string, number>
  /** What peaks at this position (envelope extremes and the checks' governing angles). */
  governs: string[]
}

const n = (x: number | null | undefined, d = 1) => (x === null || x === undefined || !Number.isFinite(x) ? '' : Number(x.toFixed(d)) === 0 ? (0).toFixed(d) : x.toFixed(d))

/** Per position: the extremes of the envelope and the check demands that occur there. */
function governingAt(result: CalcResult, loadCase: string): Map<number, string[]> {
  const at = new Map<number, string[]>()
  const add = (deg: number | undefined, what: string) => {
    if (deg === undefined) return
    const key = Math.round(deg * 1e6)
    at.set(key, [...(at.get(key) ?? []), what])
  }
  const env = result.envelope.find((e) => e.loadCase === loadCase)
  if (env) {
    for (const [name, l] of Object.entries(env.links)) {
      if (l.maxTension.value > 0) add(l.maxTension.crankDeg, `${name} tension`)
      if (l.maxCompression.value < 0) add(l.maxCompression.crankDeg, `${name} compression`)
    }
    for (const [j, p] of Object.entries(env.pins)) add(p.crankDeg, `pin ${j}`)
    add(env.driveTorque.crankDeg, 'drive torque')
  }
  for (const c of result.checks) if (c.governing && c.loadCase === loadCase) add(c.crankDeg, `check ${c.component}`)
  return at
}

function rowsOf(result: CalcResult, loadCase: string): Row[] {
  const lc = result.loadCases.find((c) => c.name === loadCase) ?? result.loadCases[0]
  if (!lc) return []
  const gov = governingAt(result, lc.name)
  return lc.positions.map((p: PositionResult) => ({
    crankDeg: p.crankDeg,
    x: p.tracer.x,
    y: p.tracer.y,
    torque: p.driveTorque,
    transmission: p.transmissionAngleDeg ?? null,
    links: p.linkForces,
    pins: Object.fromEntries(Object.entries(p.pinForces).map(([k, f]) => [k, f.magnitude])),
    governs: [...new Set(gov.get(Math.round(p.crankDeg * 1e6)) ?? [])],
  }))
}

const col = createColumnHelper<Row>()

function csvOf(headers: string[], rows: (string | number)[][]): string {
  const cell = (v: string | number) => (typeof v === 'number' ? String(v) : /[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v)
  return [headers, ...rows].map((r) => r.map(cell).join(',')).join('\n') + '\n'
}

/** The solved positions: sortable, filterable, exported as CSV; rows where a maximum occurs are marked. */
/** A column's unit and conversion in the person's unit system (the engine's values are SI). */
function unitOf(siUnit: string, system: UnitSystem): { unit: string; show: (v: number) => number } {
  const kind = system === 'US' ? kindOfSILabel(siUnit) : null
  if (!kind) return { unit: siUnit, show: (v) => v }
  const unit = displayUnit('US', kind)
  return { unit, show: (v) => fromSI(v, unit) }
}

export const PositionsTable = memo(function PositionsTable({ result, system = 'SI' }: { result: CalcResult; system?: UnitSystem }) {
  const { crankDeg, setCrankDeg: onCrank } = useCrank()
  const [loadCase, setLoadCase] = useState(result.loadCases[0]?.name ?? '')
  const [sorting, setSorting] = useState<SortingState>([])
  const [filter, setFilter] = useState('')
  const [onlyGoverning, setOnlyGoverning] = useState(false)
  const data = useMemo(() => rowsOf(result, loadCase), [result, loadCase])
  const shown = useMemo(() => (onlyGoverning ? data.filter((r) => r.governs.length) : data), [data, onlyGoverning])
  const linkNames = Object.keys(data[0]?.links ?? {})
  const pinNames = Object.keys(data[0]?.pins ?? {})
  const columns = useMemo(() => {
    const len = unitOf('mm', system)
    const force = unitOf('N', system)
    const moment = unitOf('N·mm', system)
    // Sorting and the CSV read the converted values too, so what is shown is what is exported.
    return [
      col.accessor('crankDeg', { header: 'θ [°]', cell: (c) => n(c.getValue(), 2) }),
      col.accessor((r) => len.show(r.y), { id: 'y', header: `Travel y [${len.unit}]`, cell: (c) => n(c.getValue() as number, system === 'US' ? 4 : 2) }),
      col.accessor((r) => len.show(r.x), { id: 'x', header: `Tracer x [${len.unit}]`, cell: (c) => n(c.getValue() as number, system === 'US' ? 5 : 3) }),
      col.accessor((r) => moment.show(r.torque), { id: 'torque', header: `Drive torque [${moment.unit}]`, cell: (c) => n(c.getValue() as number, 0) }),
      col.accessor('transmission', { header: 'Min. transm. angle [°]', cell: (c) => n(c.getValue(), 1) }),
      ...linkNames.map((l) => col.accessor((r) => force.show(r.links[l]), { id: `link-${l}`, header: `${l} [${force.unit}]`, cell: (c) => n(c.getValue() as number, system === 'US' ? 1 : 0) })),
      ...pinNames.map((j) => col.accessor((r) => force.show(r.pins[j]), { id: `pin-${j}`, header: `Pin ${j} [${force.unit}]`, cell: (c) => n(c.getValue() as number, system === 'US' ? 1 : 0) })),
      col.accessor((r) => r.governs.join(', '), { id: 'governs', header: 'Maximum here', enableSorting: false }),
    ]
    // The columns follow the mechanism's links and pins and the unit system.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [linkNames.join(), pinNames.join(), system])
  const table = useReactTable({
    data: shown,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    globalFilterFn: (row, _id, value: string) => {
      const q = value.trim().toLowerCase()
      if (!q) return true
      return row.getAllCells().some((c) => String(c.getValue() ?? '').toLowerCase().includes(q))
    },
  })
  const nearest = data.reduce<Row | null>((b, r) => (!b || Math.abs(r.crankDeg - crankDeg) < Math.abs(b.crankDeg - crankDeg) ? r : b), null)
  const download = () => {
    const visible = table.getRowModel().rows
    const headers = table.getAllLeafColumns().map((c) => String(c.columnDef.header))
    const rows = visible.map((r) => r.getAllCells().map((c) => (c.getValue() ?? '') as string | number))
    const url = URL.createObjectURL(new Blob([csvOf(headers, rows)], { type: 'text/csv' }))
    const a = document.createElement('a')
    a.href = url
    a.download = `positions-${loadCase.replace(/[^A-Za-z0-9_-]+/g, '-')}.csv`
    a.click()
    URL.revokeObjectURL(url)
  }
  return (
    <section className="panel flex flex-col" aria-labelledby="positions-heading" data-testid="positions">
      <div className="flex flex-wrap items-center gap-3 border-b border-rule px-4 py-2">
        <h2 id="positions-heading" className="h2">
          Positions
        </h2>
        {result.loadCases.length > 1 && (
          <label className="flex items-center gap-1 text-xs text-ink/80">
            Load case
            <select className="field w-auto py-0.5" value={loadCase} onChange={(e) => setLoadCase(e.target.value)}>
              {result.loadCases.map((lc) => (
                <option key={lc.name}>{lc.name}</option>
              ))}
            </select>
          </label>
        )}
        <input type="search" className="field max-w-xs" placeholder="Filter rows…" aria-label="Filter the positions" value={filter} onChange={(e) => setFilter(e.target.value)} />
        <label className="flex items-center gap-1 text-xs text-ink/80">
          <input type="checkbox" checked={onlyGoverning} onChange={(e) => setOnlyGoverning(e.target.checked)} /> Only rows with a maximum
        </label>
        <span className="text-xs text-ink/80">
          {table.getRowModel().rows.length} of {data.length}
        </span>
        <button type="button" className="btn-quiet ml-auto" onClick={download}>
          Download CSV
        </button>
      </div>
      <div className="max-h-96 overflow-auto" tabIndex={0} role="region" aria-label="Positions table (scrolls)">
        <table className="w-full text-right font-mono text-xs" data-testid="positions-table">
          <thead className="sticky top-0 bg-paper text-ink/80">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const dir = h.column.getIsSorted()
                  return (
                    <th key={h.id} className="px-2 py-1 font-sans font-semibold whitespace-nowrap" aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : undefined}>
                      {h.column.getCanSort() ? (
                        <button type="button" className="hover:text-accent" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">{dir === 'asc' ? ' ▲' : dir === 'desc' ? ' ▼' : ''}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  )
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => {
              const r = row.original
              const current = r === nearest
              return (
                <tr
                  key={row.id}
                  className={`cursor-pointer border-t border-rule ${current ? 'bg-accent-soft' : r.governs.length ? 'bg-caution-soft' : 'hover:bg-paper'}`}
                  onClick={() => onCrank(r.crankDeg)}
                  data-governing={r.governs.length ? 'true' : undefined}
                  aria-current={current ? 'true' : undefined}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className={`px-2 py-0.5 whitespace-nowrap ${cell.column.id === 'governs' ? 'text-left font-sans text-caution' : ''}`}>
                      {cell.column.id === 'governs' && r.governs.length ? <strong>{flexRender(cell.column.columnDef.cell, cell.getContext())}</strong> : flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              )
            })}
          </tbody>
        </table>
      </div>
    </section>
  )
})
