'use client'

import { createContext, useContext, useState, type ReactNode } from 'react'

/** The step picked in the package (by clicking it), which a new remark is anchored to. */
interface Review {
  step: { id: string; label: string } | null
  pick(step: { id: string; label: string } | null): void
}

const ReviewCtx = createContext<Review>({ step: null, pick: () => {} })

export function ReviewProvider({ children }: { children: ReactNode }) {
  const [step, pick] = useState<Review['step']>(null)
  return <ReviewCtx.Provider value={{ step, pick }}>{children}</ReviewCtx.Provider>
}

export const useReview = () => useContext(ReviewCtx)
