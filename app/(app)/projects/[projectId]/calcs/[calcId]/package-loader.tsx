'use client'

import { useCallback, useEffect, useRef, useState, type ComponentProps } from 'react'
import { PackageView } from './package-view'

type ViewProps = Omit<ComponentProps<typeof PackageView>, 'html'>

interface PackageLoaderProps extends ViewProps {
  /** `working` or a revision id. */
  view: string
  /** Fetch at once (a checker reviewing a revision, a link to a step); otherwise on request. */
  auto: boolean
  /** Changes when the package's content may have changed (inputs saved): a shown package is fetched again. */
  version: string
  stepCount: number
}

/**
 * The package, fetched when it is asked for: the calc page stays small and fast, and a failed
 * request is an inline message with a retry, never an error page.
 */
export function PackageLoader({ view, auto, version, stepCount, ...viewProps }: PackageLoaderProps) {
  const [html, setHtml] = useState<string | null>(null)
  const [state, setState] = useState<'idle' | 'loading' | 'error'>('idle')
  const [error, setError] = useState('')
  const [wanted, setWanted] = useState(auto)
  const region = useRef<HTMLDivElement>(null)

  const load = useCallback(async () => {
    setState('loading')
    try {
      const res = await fetch(`/projects/${viewProps.projectId}/calcs/${viewProps.calcId}/package?view=${encodeURIComponent(view)}`, { cache: 'no-store' })
      if (!res.ok) {
        const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null
        throw new Error(body?.error?.message ?? `The server answered ${res.status}.`)
      }
      setHtml(await res.text())
      setState('idle')
    } catch (err) {
      setError(err instanceof Error && err.message !== 'Failed to fetch' ? err.message : 'Could not reach the server.')
      setState('error')
    }
  }, [view, viewProps.projectId, viewProps.calcId])

  useEffect(() => {
    if (typeof location !== 'undefined' && location.hash.startsWith('#step-')) setWanted(true)
  }, [])

  useEffect(() => {
    if (wanted) load()
  }, [wanted, load, version])

  // A link to a step (#step-…) scrolls there once the package is in.
  useEffect(() => {
    if (html && location.hash.startsWith('#step-')) document.getElementById(decodeURIComponent(location.hash.slice(1)))?.scrollIntoView()
  }, [html])

  if (!wanted)
    return (
      <div className="flex flex-wrap items-center gap-3 p-4">
        <button type="button" className="btn" onClick={() => setWanted(true)} data-testid="show-package">
          Show the package
        </button>
        <span className="text-xs text-ink/80">{stepCount} numbered steps with formulas, tables and figures; loaded when you ask for it.</span>
      </div>
    )
  return (
    <div ref={region} aria-busy={state === 'loading'}>
      {state === 'error' && (
        <div role="alert" className="m-4 flex flex-wrap items-center gap-3 rounded bg-fail-soft p-3 text-sm text-fail">
          The package could not be loaded: {error}
          <button type="button" className="btn-quiet" onClick={load}>
            Try again
          </button>
        </div>
      )}
      {state === 'loading' && !html && <p className="p-4 text-sm text-ink/80">Loading the package…</p>}
      {html && <PackageView html={html} {...viewProps} />}
    </div>
  )
}
