/** Plane vectors as plain objects so results serialise to JSON unchanged. */
export interface Vec {
  x: number
  y: number
}

export const vec = (x: number, y: number): Vec => ({ x, y })
export const add = (a: Vec, b: Vec): Vec => ({ x: a.x + b.x, y: a.y + b.y })
export const sub = (a: Vec, b: Vec): Vec => ({ x: a.x - b.x, y: a.y - b.y })
export const scale = (a: Vec, k: number): Vec => ({ x: a.x * k, y: a.y * k })
export const dot = (a: Vec, b: Vec): number => a.x * b.x + a.y * b.y
/** z-component of a × b: the moment of force b applied at lever a. */
export const cross = (a: Vec, b: Vec): number => a.x * b.y - a.y * b.x
/** Squares in this range neither lose digits to underflow nor overflow. */
const SQUARE_MIN = 1e-290
const SQUARE_MAX = 1e290

/**
 * Length of (x, y): √(x² + y²), the correctly rounded root of the rounded sum (within about an ulp
 * of the exact length), falling back to Math.hypot only where the squares could under- or
 * overflow. Math.hypot is exact but costs some fifteen times as much in V8, and a sweep takes
 * about fifty lengths per position.
 */
export function mag(x: number, y: number): number {
  const q = x * x + y * y
  return q > SQUARE_MIN && q < SQUARE_MAX ? Math.sqrt(q) : Math.hypot(x, y)
}

export const norm = (a: Vec): number => mag(a.x, a.y)
export const dist = (a: Vec, b: Vec): number => mag(a.x - b.x, a.y - b.y)
/** a turned a quarter turn counter-clockwise. */
export const perp = (a: Vec): Vec => ({ x: -a.y, y: a.x })
export const polar = (r: number, rad: number): Vec => ({ x: r * Math.cos(rad), y: r * Math.sin(rad) })

export const DEG = Math.PI / 180
