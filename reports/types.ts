/**
 * What a calc package is made of when it is rendered. The report reads the
 * engine's result structurally (not by importing the engine) so this module
 * compiles and renders on its own; every engine-specific piece is optional and
 * a missing piece only omits its section.
 */
import type {
  CheckItem,
  Feasibility,
  LinkTopology,
  LoadCaseEnvelope,
  Point,
  PositionResult,
  Step,
  Table,
} from '../lib/calc/types'

export type { CheckItem, Feasibility, LinkTopology, LoadCaseEnvelope, Point, PositionResult, Step, Table }

export type Paper = 'A4' | 'LETTER'
export type CalcType = 'peaucellier' | 'hart'
export type RevisionState = 'draft' | 'in-check' | 'checked' | 'approved' | 'issued' | 'superseded'

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
  stepId: string
  author: string
  role: string
  text: string
  status: string
  date: string
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

export interface StrokeInfo {
  half: number
  crankMinDeg: number
  crankMaxDeg: number
  usable?: { half: number; crankMinDeg: number; crankMaxDeg: number }
}

export interface LoadCasePositions {
  name: string
  positions: PositionResult[]
}

export interface Verdict {
  pass: boolean
  maxUtilisation: number
  governing: string
}

/** The slice of the engine's result (plus checks) that the report reads. */
export interface CalcResult {
  inversionConstant?: number
  lineOffset?: number
  feasibility?: Feasibility
  stroke?: StrokeInfo
  /** Engine-defined description of the traced line; shown only through steps. */
  line?: unknown
  straightness?: unknown
  positions?: PositionResult[]
  loadCases?: LoadCasePositions[]
  envelope?: LoadCaseEnvelope[]
  links?: LinkTopology[]
  /** Names of the ground joints, or their positions keyed by name. */
  groundJoints?: string[] | Record<string, Point>
  steps: Step[]
  tables?: Table[]
  checks?: CheckItem[]
  cautions?: string[]
  verdict?: Verdict
}

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
  result: CalcResult
  attachments: Attachment[]
  /** ISO timestamp fixed per revision: the PDF's dates come from it, so output is reproducible. */
  generatedAt: string
  engineVersion: string
  templateVersion: string
}

export interface RenderOptions {
  /** Repository root: templates and fonts are resolved from it. Defaults to `process.cwd()`. */
  rootDir?: string
  /** Overrides `<rootDir>/fonts`. */
  fontsDir?: string
  /** Overrides `<rootDir>/reports/templates`. */
  templatesDir?: string
}
