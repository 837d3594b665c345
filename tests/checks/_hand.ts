/**
 * Helpers for the hand-calculation tests: run one component through the public
 * entry (`checkComponent`) with round-number test materials, and read back the
 * checks and steps by the last part of their step id. The numbers the tests
 * compare with are worked out in each test's comment, not here.
 */
import { expect } from 'vitest'
import { checkComponent, checksInputSchema } from '@/lib/checks'

/** Test materials with round values, so the hand calculations stay readable. */
export const HAND_MATERIALS = {
  Pin400: { fy: 400, fu: 600, E: 200000, source: 'hand-calculation test material' },
  Plate250: { fy: 250, fu: 400, E: 200000, source: 'hand-calculation test material' },
  Bar300: { fy: 300, fu: 450, E: 210000, source: 'hand-calculation test material' },
}

export interface Item {
  stepId: string
  component: string
  basis: string
  check: string
  clause: string
  demand: number
  capacity: number
  unit: string
  utilisation: number
  pass: boolean
  governing: boolean
  loadCase?: string
  crankDeg?: number
  kind?: 'strength' | 'detailing'
}
export interface StepLike {
  id: string
  title?: string
  substituted?: string
  formula?: string
  source?: string
  note?: string
  value: unknown
  verdict?: string
}

export interface Checked {
  c: Record<string, Item>
  s: Record<string, StepLike>
  all: { checks: Item[]; steps: StepLike[] }
}

const last = (id: string) => id.split('.').pop() as string

function index(r: { checks: Item[]; steps: StepLike[] }): Checked {
  return {
    c: Object.fromEntries(r.checks.map((x) => [last(x.stepId), x])),
    s: Object.fromEntries(r.steps.map((x) => [last(x.id), x])),
    all: r,
  }
}

type Obj = Record<string, unknown>

export function pinCase(basis: Obj, joint: Obj, force: number, factors: Obj = { load: 1, dynamic: 1 }): Checked {
  const input = checksInputSchema.parse({ basis, factors, materials: HAND_MATERIALS, joints: { J: joint } })
  return index(checkComponent(input, 'J', { kind: 'joint', force }) as never)
}

export function linkCase(
  basis: Obj,
  link: Obj,
  forces: { tension?: number; compression?: number; moment?: number },
  factors: Obj = { load: 1, dynamic: 1 },
): Checked {
  const input = checksInputSchema.parse({ basis, factors, materials: HAND_MATERIALS, links: { L: link } })
  return index(checkComponent(input, 'L', { kind: 'link', ...forces }) as never)
}

const SUPERSCRIPT: Record<string, string> = { '⁻': '-', '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9' }

/**
 * The numbers printed in a TeX string or a message, in order: `1.234 \cdot 10^{5}`,
 * `1.2 \times 10^{-5}` and `1.2×10⁻⁵` are one number each, a true minus (U+2212) is a
 * minus, thin-space digit groups (`18 900`) are one number; exponents such as `^2` and
 * the parts of fractions are numbers of their own.
 */
export function printedNumbers(tex: string): number[] {
  const out: number[] = []
  const re = /([-\u2212]?(?:\d{1,3}(?:\u2009\d{3})+|\d+)(?:\.\d+)?)(?:\s*\\(?:cdot|times)\s*10\^\{([-\u2212]?\d+)\}|×10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+))?/g
  for (const m of tex.matchAll(re)) {
    const mant = Number(m[1].replace(/\u2009/g, '').replace('\u2212', '-'))
    const exp = m[2] !== undefined ? Number(m[2].replace('\u2212', '-')) : m[3] !== undefined ? Number([...m[3]].map((c) => SUPERSCRIPT[c]).join('')) : 0
    out.push(mant * 10 ** exp)
  }
  return out
}

/**
 * Printed to 4 significant figures (3 below 10⁻³, where a power of ten is written),
 * rounded to nearest or away from the limit: a difference up to one unit in the last
 * figure is rounding (relative 10⁻³, 10⁻² below 10⁻³).
 */
export const samePrinted = (printed: number, value: number): boolean =>
  value === 0 ? printed === 0 : Math.abs(printed - value) <= (Math.abs(value) < 1e-3 ? 1.001e-2 : 1.001e-3) * Math.abs(value)

/**
 * Every number of the hand calculation is printed in the text (to the 4 figures printed),
 * each matched to its own printed number; the order of the working and any extra figures
 * (units, exponents) are left to the report's layout.
 */
export function expectNumbers(text: string, expected: number[], what = ''): void {
  const got = printedNumbers(text)
  const used = new Set<number>()
  const missing = expected.filter((v) => {
    const i = got.findIndex((p, k) => !used.has(k) && samePrinted(p, v))
    if (i < 0) return true
    used.add(i)
    return false
  })
  expect(missing, `${what}: hand-calculated ${missing.join(', ')} not printed in\n${text}`).toEqual([])
}

/** Every number of the step's working, in order, against the hand calculation. */
export function expectPrinted(step: StepLike | undefined, expected: number[]): void {
  expect(step, 'step exists').toBeDefined()
  expectNumbers(step!.substituted ?? '', expected, step!.id)
}

/** Relative closeness for hand-calculated values (6 significant digits unless told). */
export function near(actual: number, expected: number, rel = 1e-6): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(rel * Math.abs(expected))
}
