/**
 * Calc packages built the way the app builds them: the inputs run through the real engine and
 * checks (`calculate`), the inputs table from `inputRowsOf`. For the demo renders and benches
 * (scripts/) and the report tests; nothing here is part of the bundled pipeline (reports/index.ts
 * does not export it).
 */
import { inputRowsOf } from '../lib/calc/input-rows'
import { calculate } from '../lib/calc/run'
import { ENGINE_VERSION } from '../lib/calc/version'
import { DEMO_CALCS, DEMO_PROJECT } from '../lib/demo/calcs'
import { DEMO_USERS } from '../lib/demo/people'
import type { Paper, ReportPackage, RevisionState } from './types'
import { TEMPLATE_VERSION } from './version'

export { DEMO_CALCS }
export type DemoCalc = (typeof DEMO_CALCS)[number]

export interface PackageSpec {
  /** The calc input JSON, as the CLI and the form send it. */
  inputs: unknown
  project: ReportPackage['project']
  calc: { number: string; title: string }
  revision: ReportPackage['revision']
  paper?: Paper
  history?: ReportPackage['history']
  remarks?: ReportPackage['remarks']
  attachments?: ReportPackage['attachments']
  generatedAt: string
}

/** A package whose result is the engine's: throws, naming the fields, when the inputs are refused. */
export function packageFromInputs(spec: PackageSpec): ReportPackage {
  const run = calculate(spec.inputs)
  if (!run.ok) throw new Error(`${spec.calc.number}: inputs refused: ${JSON.stringify(run.fieldErrors)}`)
  return {
    paper: spec.paper ?? 'A4',
    project: spec.project,
    calc: { ...spec.calc, type: run.result.mechanism },
    revision: spec.revision,
    history: spec.history ?? [],
    remarks: spec.remarks ?? [],
    inputRows: inputRowsOf(run.input),
    result: run.result,
    attachments: spec.attachments ?? [],
    generatedAt: spec.generatedAt,
    engineVersion: ENGINE_VERSION,
    templateVersion: TEMPLATE_VERSION,
  }
}

export function demoCalc(number: string): DemoCalc {
  const c = DEMO_CALCS.find((d) => d.number === number)
  if (!c) throw new Error(`no demo calc ${number}`)
  return c
}

/** A demo calc as revision A in its seeded state, signed as far as that state goes. */
export function demoPackage(c: DemoCalc, opts: { paper?: Paper; state?: RevisionState } = {}): ReportPackage {
  const [, engineer, checker, approver] = DEMO_USERS
  const state = opts.state ?? c.state
  const signed = state === 'issued'
  return packageFromInputs({
    inputs: c.inputs,
    paper: opts.paper,
    project: DEMO_PROJECT,
    calc: { number: c.number, title: c.title },
    revision: {
      label: 'A',
      state,
      engineer: { name: engineer.name, date: '2027-03-01' },
      checker: { name: signed ? checker.name : '—', date: signed ? '2027-03-03' : undefined },
      approver: { name: signed ? approver.name : '—', date: signed ? '2027-03-04' : undefined },
    },
    history: [{ label: 'A', state, date: '2027-03-04', note: 'First issue' }],
    generatedAt: '2027-03-04T09:00:00.000Z',
  })
}
