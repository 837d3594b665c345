/**
 * The result contract: the shapes every layer agrees on. The linkage engine
 * (lib/linkage), the pin and link checks (lib/checks) and the calc entry
 * (lib/calc) all produce these types; the reports, the API and the CLI read
 * them. A result is an ordered list of steps plus tables and figure data, so
 * nothing is recomputed by another path.
 *
 * This module imports nothing: it sits below every other module of lib/.
 * Units inside: mm, N, N·mm, MPa; angles in degrees at the edges.
 */

/** Id of a registered mechanism (`peaucellier`, `hart`, …); see lib/mechanisms. */
export type MechanismId = string

export type StepVerdict = 'pass' | 'fail' | 'warn' | 'info'

/** One checkable item. `id` is stable: it must not change when numbers change. */
export interface Step {
  /** Stable id, dotted, e.g. `kin.inversion-constant` or `chk.pin.P.shear`. */
  id: string
  /** Section id the step belongs to (`geometry`, `kinematics`, `statics`, `checks`, …). */
  section: string
  title: string
  /** The formula in TeX, symbols only. */
  formula?: string
  /** The same formula with values substituted, in TeX. */
  substituted?: string
  /** The result. Numbers are in `unit`. */
  value?: number | string | boolean
  /** Plain-text unit: `mm`, `mm²`, `N`, `N·mm`, `MPa`, `°`, `—` for dimensionless. */
  unit?: string
  /** Where the formula comes from: a clause, a textbook, or "geometry"/"statics". */
  source?: string
  verdict?: StepVerdict
  /** A sentence of explanation shown beside the step. */
  note?: string
  /**
   * Where the step's inputs come from: other steps (by id) whose values it uses. The package prints
   * them with their numbers ("1679 N, step 46"), so every value can be traced back.
   */
  refs?: { stepId: string; what: string }[]
  /**
   * The criterion a verification step is judged by, as TeX (`\\le 10^{-9}`); shown beside its value.
   */
  criterion?: string
  /**
   * Supporting working: printed in the package's appendix rather than its main body (envelopes,
   * the full working of components identical to one shown in full). Numbering puts these last.
   */
  appendix?: boolean
}

export interface TableColumn {
  key: string
  label: string
  unit?: string
  /** Digits after the decimal point when rendering numbers. */
  digits?: number
}

export interface Table {
  id: string
  section: string
  title: string
  columns: TableColumn[]
  rows: Record<string, number | string | boolean | null>[]
}

/** The value and where in the stroke it happens. */
export interface Extreme {
  value: number
  crankDeg: number
}

/** The largest force between a link and any one of its pins (its eyes and holes), over the working range. */
export interface EyeExtreme extends Extreme {
  /** The pin (joint) at which it occurs. */
  joint: string
  /** Largest component across the link's axis at any of its holes over the working range, N (0 for a two-force bar). */
  across: number
}

/** Per load case: the largest demands over the swept stroke. Forces in N, moments in N·mm. */
export interface LoadCaseEnvelope {
  loadCase: string
  /** Step-id fragment of the load case (`stat.envelope.<slug>.…`). */
  slug?: string
  links: Record<
    string,
    {
      /** Distance between the link's end pins, mm. */
      length: number
      maxTension: Extreme
      maxCompression: Extreme
      /** Only for links that carry three or more pins (beams). */
      maxMoment?: Extreme
    }
  >
  /** Resultant pin force per joint name. */
  pins: Record<string, Extreme>
  /** Per link: the largest force any one pin applies to it (the eye or hole it bears on). */
  eyes?: Record<string, EyeExtreme>
  /** Largest ground reaction per fixed pivot. */
  reactions?: Record<string, Extreme>
  /** Largest |drive torque|, signed value kept. */
  driveTorque: Extreme
}

/** One component check as the CLI and API print it. */
export interface CheckItem {
  component: string
  check: string
  basis: string
  clause: string
  /** In N, N·mm or MPa — `unit` says which. */
  demand: number
  capacity: number
  unit: string
  utilisation: number
  pass: boolean
  /** True for the check with the highest utilisation of its component. */
  governing: boolean
  loadCase?: string
  crankDeg?: number
  /** Id of the step that shows the working. */
  stepId: string
  /**
   * `strength`: a resistance check, whose utilisation can govern. `detailing`: a dimensional rule
   * (met or not met), reported in its own table and never the headline utilisation. Absent: strength.
   */
  kind?: 'strength' | 'detailing'
}

export interface Point {
  x: number
  y: number
}

export interface Force extends Point {
  magnitude: number
}

/** One solved position of the mechanism under one load case. */
export interface PositionResult {
  crankDeg: number
  tracer: Point
  joints: Record<string, Point>
  /** Axial force per two-force link, N, tension positive. */
  linkForces: Record<string, number>
  /** Resultant force carried by each pin, N. */
  pinForces: Record<string, Force>
  /** Force the ground applies at each fixed pivot, N. */
  reactions: Record<string, Force>
  /** Torque the drive applies to the crank, N·mm, counter-clockwise positive. */
  driveTorque: number
  /** Largest |bending moment| along each beam link (three or more pins), N·mm. */
  linkMoments?: Record<string, number>
  /** Smallest transmission angle in the cell at this position, degrees. */
  transmissionAngleDeg?: number
  /** Transmission angle at each watched vertex, folded to 0–90° (0° = links in line), degrees. */
  transmissionAngles?: Record<string, number>
}

/** Which joints a link connects; used to draw the mechanism. */
export interface LinkTopology {
  name: string
  joints: string[]
  kind: 'bar' | 'beam' | 'crank'
}

export interface Feasibility {
  ok: boolean
  /** Stable machine-readable kind, e.g. `ok`, `arm-not-longer-than-side`, `crank-cannot-reach`, `split-segment`, `circle-arc`. */
  kind: string
  message: string
}

export interface StrokeLimits {
  half: number
  crankMinDeg: number
  crankMaxDeg: number
}

/** A requested crank angle left without statics: out of reach, or at or near a toggle. */
export interface ToggleFlag {
  crankDeg: number
  reason: 'unreachable' | 'singular' | 'force-amplification'
  /** Largest pin force per newton of load at the tracer, when it could be computed. */
  amplification?: number
}

/** The path the tracer follows: a straight line, or a circle arc when the crank circle misses the pole. */
export type TracerPath =
  | { kind: 'line'; point: Point; direction: Point }
  | { kind: 'arc'; centre: Point; radius: number }

/** What the linkage engine computes for one mechanism (lib/linkage `analyse`). */
/** One position of the full range to the locked positions: kinematics only (no statics). */
export interface KinematicSample {
  crankDeg: number
  tracer: Point
  transmissionAngleDeg: number
}

export interface LinkageResult {
  /** k = |OP|·|OT|, mm². */
  inversionConstant: number
  /** k/(2r), mm: the line's distance from the pole when the crank circle passes through it. */
  lineOffset: number
  feasibility: Feasibility
  /** Between the toggle positions; `usable` after the user's toggle margin. */
  stroke: StrokeLimits & { usable: StrokeLimits }
  /** Null when the geometry is infeasible. */
  line: TracerPath | null
  /** Largest distance of the tracer from the chord through its end positions over the working range, mm. */
  straightness: number
  /** The crank angles statics and checks are solved over (the working range the engineer states). */
  workingRange?: StrokeLimits
  /** The full range to the locked positions, kinematics only: for figures and plots. */
  kinematics?: KinematicSample[]
  /** The criteria of the working range the verdict includes besides the component checks. */
  criteria?: Criterion[]
  /** The load cases as applied at the tracer, N. */
  loads?: { name: string; fx: number; fy: number }[]
  /** Positions under the first load case. */
  positions: PositionResult[]
  loadCases: { name: string; positions: PositionResult[] }[]
  envelope: LoadCaseEnvelope[]
  links: (LinkTopology & { length: number })[]
  groundJoints: string[]
  toggles: ToggleFlag[]
  steps: Step[]
  tables: Table[]
}

/** Result of a straight-line linkage calculation (lib/calc/mechanism.ts): the engine's result, labelled. */
export interface MechanismResult extends LinkageResult {
  mechanism: MechanismId
  engineVersion: string
}

/** A requirement of the calc that is met or not (stroke, straightness, transmission angle, detailing). */
export interface Criterion {
  id: string
  label: string
  /** What is required and what is provided, as plain text with units. */
  required: string
  provided: string
  pass: boolean
  stepId?: string
}

/** The calc's overall answer: every check passes, and which one governs. */
export interface CalcVerdict {
  pass: boolean
  /** Largest utilisation of a strength check (detailing rules are criteria, not utilisations). */
  maxUtilisation: number
  governing: string
  /** Step of the governing strength check. */
  governingStepId?: string
  /** Criteria that are not met, by label (empty when all are met). */
  unmet?: string[]
}

/** A material as the calc used it: one row per material and strength band. */
export interface MaterialUse {
  id: string
  name: string
  /** Which parts use it (`pins`, `plates`, `link bodies`, `eyes`). */
  usedFor: string[]
  /** The band that applied, e.g. `t ≤ 16 mm`. */
  band: string
  fy: number
  fu: number
  E: number
  /** Where the values come from, as stored with the material. */
  source: string
}

/** The design basis in words, generated from the calc's inputs. */
export interface BasisText {
  /** Basis of the checks, e.g. `EN 1993-1-8 §3.13 with EN 1993-1-1, partial factors γM0 1.0 …`. */
  label: string
  statements: string[]
  assumptions: string[]
  /** Codes and books the checks use, in citation form. */
  references: string[]
}

/** A whole calc: the mechanism's result with the component checks, the cautions and the verdict. */
export interface CalcResult extends MechanismResult {
  checks: CheckItem[]
  cautions: string[]
  verdict: CalcVerdict
  materials?: MaterialUse[]
  basis?: BasisText
  /** Unit system the engineer works in; the package prints in it. Absent: SI. */
  units?: 'SI' | 'US'
}

/**
 * Default order in which a package numbers the step sections (a mechanism may
 * declare its own in the registry); sections not listed follow in engine order.
 */
export const STEP_SECTIONS = ['geometry', 'kinematics', 'verification', 'statics', 'checks'] as const
