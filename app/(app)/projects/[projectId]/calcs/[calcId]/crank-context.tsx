'use client'

import { createContext, useContext, useState, type ReactNode } from 'react'

/**
 * The crank angle the drawing, the plots' cursor and the positions table share. It lives in its own
 * provider so that turning the crank re-renders those three only, never the form.
 */
const Ctx = createContext<{ crankDeg: number; setCrankDeg(deg: number): void }>({ crankDeg: 0, setCrankDeg: () => {} })

export function CrankProvider({ children }: { children: ReactNode }) {
  const [crankDeg, setCrankDeg] = useState(0)
  return <Ctx.Provider value={{ crankDeg, setCrankDeg }}>{children}</Ctx.Provider>
}

export const useCrank = () => useContext(Ctx)
