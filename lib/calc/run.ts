import { checksInputSchema, ChecksInputError, runChecks, type ChecksInput } from '@/lib/checks'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { GENERAL_CAUTION } from '@/lib/cautions'
import { mechanismInputSchema, runMechanism, type AnyMechanismInput } from './mechanism'
import { tex as texNumber } from '@/lib/linkage/tex'
import type { CalcResult, CalcVerdict, CheckItem, MechanismResult, Step } from '@/lib/contract'

export type { CalcResult, CalcVerdict }

/** A linkage calc: the mechanism and its loads, plus the pin and link descriptions and the design basis. */
export interface CalcInput {
  mechanism: AnyMechanismInput
  checks: ChecksInput | null
}

export type ParsedCalcInput = { ok: true; input: CalcInput } | { ok: false; fieldErrors: Record<string, string> }

/**
 * Reads one JSON object holding both parts (the keys of docs/engine.md and docs/checks.md side by side).
 * A missing `basis` means "kinematics and forces only". Errors are keyed by dotted field path.
 */
export function parseCalcInput(raw: unknown): ParsedCalcInput {
  const mech = mechanismInputSchema.safeParse(raw)
  const hasBasis = typeof raw === 'object' && raw !== null && 'basis' in raw
  const checks = hasBasis ? checksInputSchema.safeParse(raw) : null
  const fieldErrors = {
    ...(mech.success ? {} : fieldErrorsOf(mech.error)),
    ...(checks && !checks.success ? fieldErrorsOf(checks.error) : {}),
  }
  if (!mech.success || (checks && !checks.success)) return { ok: false, fieldErrors }
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
    formula: 's_{req} \\le 2 h_u',
    substituted: `${texNumber(required)} \\le 2 \\cdot ${texNumber(result.stroke.usable.half)} = ${texNumber(usable)}`,
    value: usable,
    unit: 'mm',
    source: 'design requirement (inputs)',
    verdict: ok ? 'pass' : 'fail',
    note: ok ? undefined : 'The cell cannot give the required stroke short of its toggle positions: lengthen the arms or change the crank.',
  }
}

function verdictOf(result: MechanismResult, checks: CheckItem[], strokeStep: Step | null): CalcVerdict {
  if (!result.feasibility.ok) return { pass: false, maxUtilisation: 0, governing: result.feasibility.message }
  if (strokeStep?.verdict === 'fail') return { pass: false, maxUtilisation: 0, governing: `${strokeStep.title}: no (${strokeStep.substituted})` }
  const worst = checks.reduce<CheckItem | null>((w, c) => (!w || c.utilisation > w.utilisation ? c : w), null)
  if (!worst) return { pass: true, maxUtilisation: 0, governing: 'no component checks requested' }
  return {
    pass: checks.every((c) => c.pass),
    maxUtilisation: worst.utilisation,
    governing: `${worst.component} — ${worst.check} (${worst.clause})`,
  }
}

/**
 * Runs the mechanism, then the checks on its force envelope. Bad component descriptions come back
 * as field errors (`joints.P.holeDiameter`), not as exceptions.
 */
export function runCalc(input: CalcInput): { ok: true; result: CalcResult } | { ok: false; fieldErrors: Record<string, string> } {
  const mech = runMechanism(input.mechanism)
  let checks: CheckItem[] = []
  let cautions = [GENERAL_CAUTION]
  const steps = [...mech.steps]
  const tables = [...mech.tables]
  if (input.checks && mech.feasibility.ok && mech.envelope.length > 0) {
    try {
      const c = runChecks(input.checks, mech.envelope)
      checks = c.checks
      steps.push(...c.steps)
      tables.push(...c.tables)
      cautions = [...new Set([GENERAL_CAUTION, ...c.cautions])]
    } catch (err) {
      if (err instanceof ChecksInputError) return { ok: false, fieldErrors: Object.fromEntries(err.issues.map((i) => [i.path, i.message])) }
      throw err
    }
  }
  const required = input.mechanism.requiredStroke
  const strokeStep = required ? strokeRequirement(mech, required) : null
  if (strokeStep) steps.splice(steps.findLastIndex((s) => s.section === 'kinematics') + 1, 0, strokeStep)
  return { ok: true, result: { ...mech, steps, tables, checks, cautions, verdict: verdictOf(mech, checks, strokeStep) } }
}

export type Calculated = { ok: true; input: CalcInput; result: CalcResult } | { ok: false; fieldErrors: Record<string, string> }

/** Parse and run in one step: what every caller with raw JSON (form, revision, CLI, preview) needs. */
export function calculate(raw: unknown): Calculated {
  const parsed = parseCalcInput(raw)
  if (!parsed.ok) return parsed
  const run = runCalc(parsed.input)
  return run.ok ? { ok: true, input: parsed.input, result: run.result } : run
}
