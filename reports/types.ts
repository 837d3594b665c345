/**
 * What a calc package is made of when it is rendered. The result is the
 * contract's CalcResult (lib/contract), the same object the engine and the
 * checks produce; every piece but the steps may be missing (an infeasible
 * geometry has no positions, a kinematics-only calc no checks), and a missing
 * piece only omits its section.
 */
import type {
  CalcResult,
  CalcVerdict,
  CheckItem,
  Feasibility,
  LinkTopology,
  LoadCaseEnvelope,
  MechanismId,
  Point,
  PositionResult,
  Step,
  StrokeLimits,
  Table,
} from '../lib/contract'
import type { InputRowChange, ResultChanges } from '../lib/review/compare'

export type { CalcResult, CheckItem, Feasibility, LinkTopology, LoadCaseEnvelope, MechanismId, Point, PositionResult, Step, Table }

export type Paper = 'A4' | 'LETTER'
/** A calc's type is the id of its mechanism in the registry (lib/mechanisms). */
export type CalcType = MechanismId
export type { RevisionState } from '../lib/review/workflow'
import type { RevisionState } from '../lib/review/workflow'

export interface Signatory {
  name: string
  /** ISO date (YYYY-MM-DD) the person signed; absent while unsigned. */
  date?: string
}

export interface HistoryEntry {
  label: string
  state: RevisionState
  date: string
  note: string
}

export interface Remark {
  /** The step the remark is about; null for a remark on the package as a whole. */
  stepId: string | null
  /** The step's number in this package, when known. */
  stepNumber?: number | null
  author: string
  role: string
  text: string
  status: string
  date: string
}

/** What sign-off adds to a package; stamped onto the stored body by finishPdf, never rendered into it. */
export interface SignOff {
  /** Every transition of the revision, oldest first, with the server's signature where it was signed. */
  events: { what: string; by: string; at: string; reason?: string | null; signature?: string | null }[]
  ticks: { stepId: string; number: number | null; by: string; date: string }[]
  confirmations: { value: string; by: string; date: string }[]
  issue?: { approver: string; date: string; contentHash: string; code: string }
}

export interface InputRow {
  group: string
  label: string
  value: number | string
  unit: string
}

export interface Attachment {
  name: string
  bytes: Uint8Array
}

export type StrokeInfo = StrokeLimits & { usable?: StrokeLimits }

export interface LoadCasePositions {
  name: string
  positions: PositionResult[]
}

export type Verdict = CalcVerdict

/** The result a package renders: the contract's CalcResult, where everything but the steps may be absent. */
export type ReportResult = Pick<CalcResult, 'steps'> & Partial<Omit<CalcResult, 'steps'>>

export interface ReportPackage {
  paper: Paper
  project: { code: string; name: string; client: string }
  calc: { number: string; title: string; type: CalcType }
  revision: {
    label: string
    state: RevisionState
    engineer: Signatory
    checker: Signatory
    approver: Signatory
  }
  history: HistoryEntry[]
  remarks: Remark[]
  inputRows: InputRow[]
  result: ReportResult
  attachments: Attachment[]
  /** ISO timestamp fixed per revision: the PDF's dates come from it, so output is reproducible. */
  generatedAt: string
  engineVersion: string
  templateVersion: string
  /** Present once the revision has been submitted: the record of its sign-off. */
  signOff?: SignOff
  /** Units the values print in; the working stays in SI. Absent: SI. */
  units?: 'SI' | 'US'
  /** What changed since the calc's revision before this one; absent for the first. */
  changes?: RevisionChanges
}

export interface RevisionChanges extends ResultChanges {
  /** Label of the earlier revision. */
  since: string
  inputs: InputRowChange[]
}

export interface RenderOptions {
  /** Repository root: templates and fonts are resolved from it. Defaults to `process.cwd()`. */
  rootDir?: string
  /** Overrides `<rootDir>/fonts`. */
  fontsDir?: string
  /** Overrides `<rootDir>/reports/mechanisms` (templates at `<dir>/<id>/template.mdx`). */
  templatesDir?: string
}
