/**
 * The report side of the mechanism registry (lib/mechanisms), keyed by mechanism id. A mechanism's
 * report parts live in `reports/mechanisms/<id>/`: its MDX template (`template.mdx`, read at run time
 * from `rootDir`, so it works inside the bundled .reports/index.mjs) and, when the generic drawing
 * does not suit it, its own diagram builder. Found by convention, so a new mechanism needs no row here;
 * `registerReportParts` overrides the parts of one id (tests, plug-ins).
 */
import { isAbsolute, join, resolve } from 'node:path'
import type { MechanismId } from '../../lib/contract'
import type { DiagramAt } from '../model/diagram'
import type { Scene } from '../model/scene'
import type { RenderOptions, ReportResult } from '../types'

/** Draws the mechanism at the picked positions, `width` points wide; null when there is nothing to draw. */
export type DiagramBuilder = (result: ReportResult, at: DiagramAt[], width: number) => Scene | null

export interface ReportParts {
  /** The MDX template file: absolute, or relative to `rootDir`. Default `reports/mechanisms/<id>/template.mdx`. */
  template?: string
  /** Replaces the generic mechanism drawing (`<Figure>`). */
  diagram?: DiagramBuilder
}

const overrides = new Map<MechanismId, ReportParts>()

export function registerReportParts(id: MechanismId, parts: ReportParts): void {
  overrides.set(id, { ...overrides.get(id), ...parts })
}

export function reportPartsOf(id: MechanismId): ReportParts {
  return overrides.get(id) ?? {}
}

/** Where the template of mechanism `id` is read from. */
export function templatePath(id: MechanismId, opts: RenderOptions = {}): string {
  const root = opts.rootDir ?? process.cwd()
  const own = overrides.get(id)?.template
  if (own) return isAbsolute(own) ? own : resolve(root, own)
  if (!/^[a-z][a-z0-9-]*$/.test(id)) throw new Error(`not a mechanism id: "${id}"`)
  return join(opts.templatesDir ?? join(root, 'reports', 'mechanisms'), id, 'template.mdx')
}
