import { checksInputSchema, ChecksInputError, runChecks, type ChecksInput } from '@/lib/checks'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { GENERAL_CAUTION } from '@/lib/cautions'
import { rangeErrors } from '@/lib/bench/ranges'
import { sizeIssues } from '@/lib/checks/validate'
import { analyseParsed, mechanismBoundErrors, mechanismInputSchema, type AnyMechanismInput } from './mechanism'
import { formatNumber, texNumber } from '@/lib/units/format'
import type { CalcResult, CalcVerdict, CheckItem, Criterion, MaterialUse, MechanismResult, Step } from '@/lib/contract'
import { basisText } from './basis-text'
import { withOperatingSpeed } from './at-speed'
import { withTolerances } from './tolerances'
import { mechanismComparison } from './comparison'

export type { CalcResult, CalcVerdict }

/** A linkage calc: the mechanism and its loads, plus the pin and link descriptions and the design basis. */
export interface CalcInput {
  mechanism: AnyMechanismInput
  checks: ChecksInput | null
}

export type ParsedCalcInput = { ok: true; input: CalcInput } | { ok: false; fieldErrors: Record<string, string> }

/**
 * The bounds of new input beyond the schema, keyed by dotted path: every number in its range
 * (lib/bench/ranges; the geometry by the ranges its mechanism declares), the number and names of load
 * cases, the positions solved, and the counts and text lengths of the pin and link part. Inside them
 * the engine gives finite numbers and one request does bounded work (tests/security/input-bounds.test.ts).
 */
export function inputBoundErrors(raw: unknown): Record<string, string> {
  return {
    ...rangeErrors(raw, { skipGeometry: true }),
    ...Object.fromEntries(sizeIssues(raw).map((i) => [i.path, i.message])),
    ...mechanismBoundErrors(raw),
  }
}

/**
 * Reads one JSON object holding both parts (the keys of docs/engine.md and docs/checks.md side by side).
 * A missing `basis` means "kinematics and forces only". Errors are keyed by dotted field path: the
 * schema's (shape, sign) and, for new input, the bounds (`inputBoundErrors`), whose message wins
 * where both speak of one field. `{ stored: true }` reads inputs a revision already holds by the
 * schema alone, so a record stored before a bound was added still prints as it was signed.
 */
export function parseCalcInput(raw: unknown, opts: { stored?: boolean } = {}): ParsedCalcInput {
  const mech = mechanismInputSchema.safeParse(raw)
  const hasBasis = typeof raw === 'object' && raw !== null && 'basis' in raw
  const checks = hasBasis ? checksInputSchema.safeParse(raw) : null
  const fieldErrors = {
    ...(mech.success ? {} : fieldErrorsOf(mech.error)),
    ...(checks && !checks.success ? fieldErrorsOf(checks.error) : {}),
    ...(opts.stored ? {} : inputBoundErrors(raw)),
  }
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors }
  return { ok: true, input: { mechanism: raw as AnyMechanismInput, checks: checks?.data ?? null } }
}

/** The machine's stroke against what the cell gives short of its toggles (symmetric about the mid position). */
function strokeRequirement(result: MechanismResult, required: number): Step {
  const usable = 2 * result.stroke.usable.half
  const ok = result.feasibility.ok && usable >= required
  return {
    id: 'kin.required-stroke',
    section: 'kinematics',
    title: 'Usable stroke covers the stroke the machine needs',
    formula: 's_{req} \\le 2\\,h_u',
    substituted: `${texNumber(required)}\\ \\text{mm} ${ok ? '\\le' : '>'} 2 \\cdot ${texNumber(result.stroke.usable.half)} = ${texNumber(usable)}\\ \\text{mm}`,
    value: usable,
    unit: 'mm',
    criterion: `\\ge ${texNumber(required)}\\ \\text{mm}`,
    source: 'design requirement (inputs); h_u from the usable-stroke step',
    verdict: ok ? 'pass' : 'fail',
    note: ok ? undefined : 'The cell cannot give the required stroke short of its toggle positions: lengthen the arms or change the crank.',
    refs: [{ stepId: 'kin.usable-stroke', what: `h_u = ${formatNumber(result.stroke.usable.half)} mm` }],
  }
}

/** Working range inside the usable stroke: end stops stated beyond the toggle margin are refused by the verdict. */
function marginCriterion(result: MechanismResult, marginDeg: number): Criterion | null {
  const w = result.workingRange
  if (!w || !result.feasibility.ok) return null
  const u = result.stroke.usable
  const ok = w.crankMinDeg >= u.crankMinDeg - 1e-9 && w.crankMaxDeg <= u.crankMaxDeg + 1e-9
  return {
    id: 'toggle-margin',
    label: `Working range keeps ${formatNumber(marginDeg)}° of crank angle from the locked positions`,
    required: `${formatNumber(u.crankMinDeg)}° ≤ θ ≤ ${formatNumber(u.crankMaxDeg)}°`,
    provided: `${formatNumber(w.crankMinDeg)}° … ${formatNumber(w.crankMaxDeg)}°`,
    pass: ok,
    stepId: 'kin.working-range',
  }
}

function verdictOf(result: MechanismResult, checks: CheckItem[], criteria: Criterion[]): CalcVerdict {
  if (!result.feasibility.ok) return { pass: false, maxUtilisation: 0, governing: result.feasibility.message, unmet: [result.feasibility.message] }
  const unmet = criteria.filter((c) => !c.pass).map((c) => c.label)
  const failedRules = checks.filter((c) => c.kind === 'detailing' && !c.pass).map((c) => `${c.component}: ${c.check}`)
  const strength = checks.filter((c) => c.kind !== 'detailing')
  const worst = strength.reduce<CheckItem | null>((w, c) => (!w || c.utilisation > w.utilisation ? c : w), null)
  const all = [...unmet, ...failedRules]
  if (!worst) return { pass: all.length === 0, maxUtilisation: 0, governing: 'no component checks requested', unmet: all }
  return {
    pass: all.length === 0 && strength.every((c) => c.pass),
    maxUtilisation: worst.utilisation,
    governing: `${worst.component} — ${worst.check}`,
    governingStepId: worst.stepId,
    unmet: all,
  }
}

/**
 * Runs the mechanism, then the checks on its force envelope. Bad component descriptions come back
 * as field errors (`joints.P.holeDiameter`), not as exceptions.
 */
/** What a caller may follow while a calc runs: the Monte Carlo run reports samples done of total. */
export interface RunOptions {
  onProgress?: (done: number, total: number) => void
}

export function runCalc(input: CalcInput, opts: RunOptions = {}): { ok: true; result: CalcResult } | { ok: false; fieldErrors: Record<string, string> } {
  // A case at speed joins each static case when an operating speed is given (lib/calc/at-speed.ts).
  // So do the straightness under tolerances and clearance when asked for (lib/calc/tolerances.ts).
  const parsed = mechanismInputSchema.parse(input.mechanism)
  const speed = withOperatingSpeed(analyseParsed(parsed), parsed, input.checks)
  if (!speed.ok) return speed
  const toleranced = withTolerances(speed.result, parsed, input.checks, opts.onProgress)
  if (!toleranced.ok) return toleranced
  const mech = toleranced.result
  let checks: CheckItem[] = []
  let cautions = [GENERAL_CAUTION]
  let materials: MaterialUse[] = []
  const steps = [...mech.steps]
  const tables = [...mech.tables]
  if (input.checks && mech.feasibility.ok && mech.envelope.length > 0) {
    try {
      const c = runChecks(input.checks, mech.envelope)
      checks = c.checks
      steps.push(...c.steps)
      tables.push(...c.tables)
      materials = c.materials
      cautions = [...new Set([GENERAL_CAUTION, ...c.cautions])]
    } catch (err) {
      if (err instanceof ChecksInputError) return { ok: false, fieldErrors: Object.fromEntries(err.issues.map((i) => [i.path, i.message])) }
      throw err
    }
  }
  const required = input.mechanism.requiredStroke
  const strokeStep = required ? strokeRequirement(mech, required) : null
  if (strokeStep) steps.splice(steps.findLastIndex((s) => s.section === 'kinematics') + 1, 0, strokeStep)
  const criteria: Criterion[] = [...(mech.criteria ?? [])]
  if (strokeStep) {
    criteria.unshift({
      id: 'required-stroke',
      label: 'Stroke the machine needs, short of the locked positions',
      required: `s ≥ ${formatNumber(required!)} mm`,
      provided: `2 h_u = ${formatNumber(2 * mech.stroke.usable.half)} mm`,
      pass: strokeStep.verdict === 'pass',
      stepId: strokeStep.id,
    })
  }
  const margin = input.mechanism.workingRange ? marginCriterion(mech, input.mechanism.toggleMarginDeg ?? 5) : null
  if (margin) criteria.unshift(margin)
  // The approximate four-bars for the same stroke beside this cell, to justify the choice (lib/calc/comparison.ts).
  const choice = mechanismComparison({ ...mech, steps }, input.mechanism.loads[0], required)
  steps.push(...choice.steps)
  tables.push(...choice.tables)
  const units = input.checks?.units ?? 'SI'
  return {
    ok: true,
    result: {
      ...mech,
      steps,
      tables,
      checks,
      cautions,
      criteria,
      verdict: verdictOf(mech, checks, criteria),
      materials,
      basis: basisText(input, mech, materials),
      ...(units === 'US' ? { units } : {}),
    },
  }
}

export type Calculated = { ok: true; input: CalcInput; result: CalcResult } | { ok: false; fieldErrors: Record<string, string> }

/** The path of the first number in a result that is NaN or ±Infinity (canonicalJson and JSON cannot carry them). */
export function firstNonFinite(node: unknown, path = ''): string | null {
  if (typeof node === 'number') return Number.isFinite(node) ? null : path || '(result)'
  if (Array.isArray(node)) {
    for (let i = 0; i < node.length; i++) {
      const p = firstNonFinite(node[i], `${path}[${i}]`)
      if (p) return p
    }
  } else if (node && typeof node === 'object') {
    for (const [k, v] of Object.entries(node)) {
      const p = firstNonFinite(v, path ? `${path}.${k}` : k)
      if (p) return p
    }
  }
  return null
}

/**
 * Parse and run in one step: what every caller with raw JSON (form, revision, CLI, preview) needs.
 * The answer is a result of finite numbers or field errors: a non-finite number (which the ranges
 * are there to prevent, tests/security/input-bounds.test.ts) is reported, never passed on.
 */
export function calculate(raw: unknown, opts: RunOptions = {}): Calculated {
  const parsed = parseCalcInput(raw)
  if (!parsed.ok) return parsed
  const run = runCalc(parsed.input, opts)
  if (!run.ok) return run
  const bad = firstNonFinite(run.result)
  if (bad) return { ok: false, fieldErrors: { _form: `these inputs could not be calculated: the result holds a value that is not a finite number (${bad}); change the inputs, and report them if they look ordinary` } }
  return { ok: true, input: parsed.input, result: run.result }
}
