/**
 * Shapes shared by every calc type. A result is an ordered list of steps plus
 * tables and figure data; the web view, the PDF, the API and the CLI all read
 * the same object, so nothing is recomputed by another path.
 *
 * Units inside: mm, N, N·mm, MPa; angles in degrees at the edges.
 */

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

/** Per load case: the largest demands over the swept stroke. Forces in N, moments in N·mm. */
export interface LoadCaseEnvelope {
  loadCase: string
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
