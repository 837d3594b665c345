/** Hands the render context to every report component in either rendering. */
import { createContext, useContext } from 'react'
import type { ReportContext } from './context'

export const ReportCtx = createContext<ReportContext | null>(null)

export function useReport(): ReportContext {
  const ctx = useContext(ReportCtx)
  if (!ctx) throw new Error('Report components must render inside <ReportCtx.Provider>')
  return ctx
}
