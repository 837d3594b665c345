'use client'

import { useCallback, useEffect, useRef, useState } from 'react'
import { benchCalculate, type BenchOutcome } from '@/lib/bench/validate'
import type { CalcReply } from './calc.worker'

export interface CalcState {
  outcome: BenchOutcome
  /** The inputs the outcome belongs to. */
  of: unknown
  running: boolean
  /** Share of the Monte Carlo run done, 0…1, while one reports progress. */
  progress: number | null
  /** The last run was stopped by the user; the outcome shown is from the inputs before. */
  cancelled: boolean
  cancel: () => void
}

/** The inputs with the tolerance study reduced to its worst case (no samples). */
function withoutMonteCarlo(payload: unknown): unknown {
  const t = (payload as { tolerances?: object } | null)?.tolerances
  return t ? { ...(payload as object), tolerances: { ...t, samples: 0 } } : payload
}

/**
 * Runs the calc of `payload` in a Web Worker, so a long run (a Monte Carlo study, many positions)
 * never freezes the page: new inputs end the run in progress and start another, Cancel ends it.
 * A first outcome (without the Monte Carlo run) is computed at once, on this thread, so the page never starts empty.
 */
export function useCalc(payload: unknown): CalcState {
  // The first outcome (on the server and on arrival) leaves out the Monte Carlo run, the one part that
  // takes long; the worker then runs the whole calc at once.
  const [state, setState] = useState(() => {
    const quick = withoutMonteCarlo(payload)
    return { outcome: benchCalculate(quick), of: quick === payload ? payload : null, running: false, progress: null as number | null, cancelled: false }
  })
  const worker = useRef<Worker | null>(null)
  const latest = useRef(0)
  const busy = useRef(false)
  const pending = useRef<unknown>(payload)

  const stop = useCallback(() => {
    worker.current?.terminate()
    worker.current = null
    busy.current = false
  }, [])

  const start = useCallback((): Worker | null => {
    if (typeof Worker === 'undefined') return null
    const w = new Worker(new URL('./calc.worker.ts', import.meta.url))
    w.onmessage = (e: MessageEvent<CalcReply>) => {
      if (e.data.id !== latest.current) return
      if ('progress' in e.data) {
        const progress = e.data.progress
        setState((s) => ({ ...s, progress }))
        return
      }
      busy.current = false
      const outcome = e.data.outcome
      setState({ outcome, of: pending.current, running: false, progress: null, cancelled: false })
    }
    return w
  }, [])
  useEffect(() => {
    if (payload === state.of) return
    const id = ++latest.current
    pending.current = payload
    // A run still going is for inputs that are no longer wanted.
    if (busy.current) stop()
    if (!worker.current) worker.current = start()
    if (!worker.current) {
      setState({ outcome: benchCalculate(payload), of: payload, running: false, progress: null, cancelled: false })
      return
    }
    busy.current = true
    setState((s) => ({ ...s, running: true, progress: null, cancelled: false }))
    worker.current.postMessage({ id, payload })
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [payload])

  useEffect(() => () => stop(), [stop])

  const cancel = useCallback(() => {
    latest.current++
    stop()
    setState((s) => ({ ...s, running: false, progress: null, cancelled: true }))
  }, [stop])

  return { ...state, cancel }
}
