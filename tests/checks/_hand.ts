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

/**
 * The numbers printed in a TeX string, in order: `1.234 \cdot 10^{5}` is one
 * number; exponents `^2` and fractions' parts are numbers of their own.
 */
export function printedNumbers(tex: string): number[] {
  const out: number[] = []
  const re = /(-?\d+(?:\.\d+)?)(?: \\cdot 10\^\{(-?\d+)\})?/g
  for (const m of tex.matchAll(re)) out.push(m[2] === undefined ? Number(m[1]) : Number(m[1]) * 10 ** Number(m[2]))
  return out
}

/** Printed to 4 significant digits: a relative difference up to 5e-4 is rounding. */
export const samePrinted = (printed: number, value: number): boolean =>
  value === 0 ? printed === 0 : Math.abs(printed - value) <= 5.01e-4 * Math.abs(value)

/** Every number of the step's working, in order, against the hand calculation. */
export function expectPrinted(step: StepLike | undefined, expected: number[]): void {
  expect(step, 'step exists').toBeDefined()
  const got = printedNumbers(step!.substituted ?? '')
  expect(got.length, `${step!.id}: ${step!.substituted}`).toBe(expected.length)
  expected.forEach((v, i) => {
    expect(samePrinted(got[i], v), `${step!.id}: number ${i + 1} printed ${got[i]}, hand calculation ${v}\n${step!.substituted}`).toBe(true)
  })
}

/** Relative closeness for hand-calculated values (6 significant digits unless told). */
export function near(actual: number, expected: number, rel = 1e-6): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(rel * Math.abs(expected))
}
