/**
 * Cuts a section body into page-sized segments at step boundaries, so that
 * react-pdf never paginates a long run of steps inside one <Page> (its cost
 * there grows with the square of the pages; see measure.ts). Only step lists
 * longer than a page are cut; everything else flows as before.
 */
import { Children, isValidElement, type ReactElement, type ReactNode } from 'react'
import type { ReportContext } from '../model/context'
import { stepView } from '../model/views'
import { BASELINE_DEPTH, MATH_SCALE } from './math'
import { texToShape } from './math-shape'
import { cutPoints, lineCount, pageBudget, stepHeight } from './measure'
import { H2, H3, MathInline, OL, P, UL } from './prose'
import { MathBlock } from './math'
import { columnWeights } from '../model/table-widths'
import { PdfSteps } from './steps'
import { PdfTable, tableRowHeight, tableHeadHeight } from './table'
import type { TableView } from '../model/views'
import { BODY_SIZE, LINE, contentWidth } from './styles'
import { SANS } from './fonts'

type StepsProps = { section: string; from?: number; to?: number; appendix?: boolean }
type TableProps = { view: TableView; size?: number; title?: boolean; from?: number; to?: number }
type WithChildren = { children?: ReactNode }

/** Section heading as laid out (s.sectionHead), with the space above it when it follows other content. */
export const HEAD = 13 * 1.2 + 2 + 8
export const HEAD_GAP = 14

/** Plain words of a paragraph, with inline math as a placeholder of its width. */
function words(node: ReactNode, out: string[]): void {
  Children.forEach(node, (c) => {
    if (typeof c === 'string' || typeof c === 'number') out.push(String(c))
    else if (isValidElement<{ tex?: string }>(c) && c.type === MathInline && c.props.tex) {
      // A run of 'm's about as wide as the formula: one unbreakable word.
      const w = texToShape(c.props.tex, false).width * MATH_SCALE
      out.push(` ${'m'.repeat(Math.ceil(w / 0.8))} `)
    } else if (isValidElement<WithChildren>(c)) words(c.props.children, out)
  })
}

const lineH = BODY_SIZE * Math.max(LINE, LINE + BASELINE_DEPTH - 0.3)

function paragraphHeight(k: ReactElement<WithChildren>, width: number, extra = 5): number {
  const text: string[] = []
  words(k.props.children, text)
  return lineCount([{ text: text.join(''), size: BODY_SIZE, face: { family: SANS } }], width) * lineH + extra
}

/** Rows of a table as drawn: cells wrap at their column's share of the width. */
function tableHeight(view: TableView, size: number, title: boolean, width: number): number {
  const weights = columnWeights(view)
  const total = weights.reduce((a, b) => a + b, 0)
  let h = tableHeadHeight(view, size, title)
  for (const row of view.rows) {
    let lines = 1
    row.forEach((cell, i) => {
      const w = (width * weights[i]) / total - 6
      lines = Math.max(lines, lineCount([{ text: cell ?? '', size, face: { family: SANS } }], w))
    })
    h += tableRowHeight(size) + (lines - 1) * size * 1.3
  }
  return h + 2
}

/**
 * Height of one top-level block of a section, estimated as drawn, or null when it is not known (the
 * wrapper then starts what follows on a page of its own rather than guess).
 */
export function blockHeight(k: ReactNode, ctx: ReportContext): number | null {
  const width = contentWidth(ctx.pkg.paper)
  if (!isValidElement(k)) return 0
  const el = k as ReactElement<Record<string, unknown> & WithChildren>
  const t = el.type
  const h = BLOCK_HEIGHTS.get(t as never)
  if (h) return h(el, ctx, width)
  if (t === P) return paragraphHeight(el, width)
  if (t === H2) return 9.8 * 1.2 + 9 + 2
  if (t === H3) return 9.2 * 1.2 + 7 + 2
  if (t === UL || t === OL) {
    let sum = 5
    Children.forEach(el.props.children, (li) => {
      if (isValidElement<WithChildren>(li)) sum += paragraphHeight(li, width - 11, 2)
    })
    return sum
  }
  if (t === MathBlock) {
    const m = texToShape(String(el.props.tex ?? ''), true)
    return (m.ascent + m.descent) * BODY_SIZE * 1.1 + 10
  }
  if (t === PdfTable) return tableHeight(el.props.view as TableView, (el.props.size as number) ?? 7.4, el.props.title !== false, width)
  if (isSteps(k)) {
    const list = (k.props.appendix ? ctx.appendixBySection : ctx.bySection).get(k.props.section) ?? []
    return list.reduce((a, { n, step }) => a + stepHeight(stepView(n, step, ctx), ctx.pkg.paper), 0)
  }
  return null
}

/** Heights of the report blocks (blocks.tsx), registered there to keep this module free of them. */
export const BLOCK_HEIGHTS = new Map<unknown, (el: ReactElement<Record<string, unknown>>, ctx: ReportContext, width: number) => number | null>()

/** Blocks that stand for several (tables one after another): the wrapper places each on its own. */
export const BLOCK_EXPAND = new Map<unknown, (el: ReactElement<Record<string, unknown>>, ctx: ReportContext) => ReactNode[]>()

export function registerBlockExpand(component: unknown, fn: (el: ReactElement<Record<string, unknown>>, ctx: ReportContext) => ReactNode[]): void {
  BLOCK_EXPAND.set(component, fn)
}

function expand(kids: ReactNode[], ctx: ReportContext): ReactNode[] {
  return kids.flatMap((k) => {
    const fn = isValidElement(k) ? BLOCK_EXPAND.get(k.type) : undefined
    return fn ? fn(k as ReactElement<Record<string, unknown>>, ctx) : [k]
  })
}

export function registerBlockHeight(component: unknown, fn: (el: ReactElement<Record<string, unknown>>, ctx: ReportContext, width: number) => number | null): void {
  BLOCK_HEIGHTS.set(component, fn)
}

export { tableHeight }

function isSteps(k: ReactNode): k is ReactElement<StepsProps> {
  return isValidElement<StepsProps>(k) && k.type === PdfSteps && k.props.from === undefined
}

function isTable(k: ReactNode): k is ReactElement<TableProps> {
  return isValidElement<TableProps>(k) && k.type === PdfTable && k.props.from === undefined && k.props.view.rows.length > 12
}

/** How much of the page a block needs to start there: a step list or a long table only its head and first items (it is cut across pages). */
function startHeight(kid: ReactNode, ctx: ReportContext): number | null {
  if (isTable(kid)) {
    const size = kid.props.size ?? 7.4
    return tableHeadHeight(kid.props.view, size, kid.props.title !== false) + 5 * tableRowHeight(size)
  }
  if (isSteps(kid)) {
    const { section, appendix } = kid.props
    const [one] = (appendix ? ctx.appendixBySection : ctx.bySection).get(section) ?? []
    return one ? stepHeight(stepView(one.n, one.step, ctx), ctx.pkg.paper) : 0
  }
  return blockHeight(kid, ctx)
}

/**
 * How much of the page a section body needs to start below its heading: its first block's start, and
 * with a heading or lead-in paragraph the start of what follows too (segmentBody keeps them together).
 */
export function leadHeight(body: ReactNode[], ctx: ReportContext): number | null {
  const kids = expand(body, ctx)
  if (!kids.length) return 0
  const h = startHeight(kids[0], ctx)
  const leads = isValidElement(kids[0]) && (kids[0].type === P || kids[0].type === H2 || kids[0].type === H3) && kids.length > 1
  if (!leads) return h
  const next = startHeight(kids[1], ctx)
  return h === null || next === null ? null : h + Math.min(next, 200)
}

/**
 * The body as segments, each a page: the first continues the page in progress, whose height already
 * used is `used` (null: unknown), every later one starts a new page. Step lists and long tables are cut
 * between items; any other block that does not fit what is left of the page starts the next one, so
 * react-pdf never breaks a page by itself. Returns the segments and the height used on the last page.
 */
export function segmentBody(body: ReactNode, ctx: ReportContext, used: number | null): { segments: ReactNode[][]; used: number | null } {
  const paper = ctx.pkg.paper
  const budget = pageBudget(paper)
  const segments: ReactNode[][] = [[]]
  let fill = used
  const newPage = () => {
    segments.push([])
    fill = 0
  }
  const kids = expand(Children.toArray(body), ctx)
  kids.forEach((kid, at) => {
    if (!isSteps(kid) && !isTable(kid)) {
      const h = blockHeight(kid, ctx)
      // A heading or a lead-in paragraph stays with what follows: the next block's start counts with it.
      const leads = isValidElement(kid) && (kid.type === H2 || kid.type === H3 || (kid.type === P && at + 1 < kids.length && (isSteps(kids[at + 1]) || isTable(kids[at + 1]))))
      const next = leads && at + 1 < kids.length ? (isSteps(kids[at + 1]) || isTable(kids[at + 1]) ? 60 : blockHeight(kids[at + 1], ctx)) : 0
      const need = h === null || next === null ? null : h + Math.min(next, 200)
      if (need !== null && fill !== null && fill > 0 && fill + need > budget) newPage()
      segments[segments.length - 1].push(kid)
      fill = h === null || fill === null ? null : fill + h
      return
    }
    // Items of the list and how each slice is drawn: step boxes, or table rows under a repeated head.
    let heights: number[]
    let slice: (from: number, to: number) => ReactNode
    let head = 0
    if (isSteps(kid)) {
      const { section, appendix } = kid.props
      const list = (appendix ? ctx.appendixBySection : ctx.bySection).get(section) ?? []
      heights = list.map(({ n, step }) => stepHeight(stepView(n, step, ctx), paper))
      slice = (from, to) => <PdfSteps key={`${section}-${from}`} section={section} appendix={appendix} from={from} to={to} />
    } else {
      const p = kid.props
      const size = p.size ?? 7.4
      head = tableHeadHeight(p.view, size, p.title !== false)
      heights = p.view.rows.map(() => tableRowHeight(size))
      slice = (from, to) => <PdfTable key={`${p.view.id}-${from}`} {...p} from={from} to={to} />
    }
    if (!heights.length) return
    const total = heights.reduce((a, b) => a + b, 0) + head
    const room = fill === null ? 0 : budget - fill
    if (total <= room) {
      segments[segments.length - 1].push(kid)
      fill = (fill ?? 0) + total
      return
    }
    const cuts = cutPoints(heights, room - head, budget - head)
    const bounds = [0, ...cuts, heights.length]
    bounds.slice(0, -1).forEach((from, i) => {
      const to = bounds[i + 1]
      if (to <= from) return
      if (i > 0 || (cuts[0] === 0 && fill !== 0)) newPage()
      segments[segments.length - 1].push(slice(from, to))
      fill = (fill ?? 0) + head + heights.slice(from, to).reduce((a, b) => a + b, 0)
    })
  })
  return { segments: segments.filter((sg, i) => i === 0 || sg.length > 0), used: fill }
}
