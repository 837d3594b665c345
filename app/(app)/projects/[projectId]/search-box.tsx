'use client'

import Link from 'next/link'
import { useEffect, useState } from 'react'
import useSWR from 'swr'

interface Hit {
  calcId: string
  number: string
  title: string
  kind: 'number' | 'title' | 'mechanism' | 'input' | 'step' | 'remark'
  text: string
  stepId?: string
  revisionId?: string
}

const KIND = { number: 'number', title: 'title', mechanism: 'mechanism', input: 'input', step: 'step', remark: 'remark' } as const

async function fetchJson<T>(url: string): Promise<T> {
  const res = await fetch(url)
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { error?: { message?: string } } | null)?.error?.message ?? `The server answered ${res.status}.`)
  return res.json() as Promise<T>
}

/** Search across every calc of the project: numbers, titles, input names, step titles and remarks. */
export function ProjectSearch({ projectId }: { projectId: string }) {
  const [q, setQ] = useState('')
  const [debounced, setDebounced] = useState('')
  useEffect(() => {
    const t = setTimeout(() => setDebounced(q.trim()), 250)
    return () => clearTimeout(t)
  }, [q])
  const key = debounced.length >= 2 ? `/api/v1/projects/${projectId}/calcs/search?q=${encodeURIComponent(debounced)}` : null
  const { data, error, isLoading } = useSWR(key, fetchJson<{ items: Hit[] }>)
  const href = (h: Hit) =>
    `/projects/${projectId}/calcs/${h.calcId}${h.kind === 'remark' && h.revisionId ? `?view=${h.revisionId}` : h.kind === 'step' ? '?view=working' : ''}${h.stepId && (h.kind === 'step' || h.kind === 'remark') ? `#step-${h.stepId}` : ''}`
  return (
    <section className="panel flex flex-col gap-2 p-4" aria-labelledby="search-title" data-testid="project-search">
      <h2 id="search-title" className="h2">
        Search the calcs
      </h2>
      <input type="search" className="field max-w-xl" placeholder="Calc number, title, load case, step title, remark…" aria-label="Search the calcs of this project" value={q} onChange={(e) => setQ(e.target.value)} />
      {error && (
        <p role="alert" className="text-sm text-fail">
          Search failed: {String(error.message)}
        </p>
      )}
      {key && !error && (
        <div aria-live="polite">
          {isLoading ? (
            <p className="text-xs text-ink/80">Searching…</p>
          ) : data && data.items.length > 0 ? (
            <ul className="flex flex-col gap-1 text-sm" data-testid="search-hits">
              {data.items.map((h, i) => (
                <li key={i}>
                  <Link href={href(h)} className="text-accent underline">
                    <span className="font-mono">{h.number}</span> {h.title}
                  </Link>{' '}
                  <span className="text-xs text-ink/80">
                    — {KIND[h.kind]}: {h.text.length > 140 ? `${h.text.slice(0, 139)}…` : h.text}
                  </span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-xs text-ink/80">Nothing found for “{debounced}”.</p>
          )}
        </div>
      )}
    </section>
  )
}
