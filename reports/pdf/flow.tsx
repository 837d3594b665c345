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
import { MathInline, P } from './prose'
import { PdfSteps } from './steps'
import { BODY_SIZE, LINE, contentWidth } from './styles'
import { SANS } from './fonts'

type StepsProps = { section: string; from?: number; to?: number }
type WithChildren = { children?: ReactNode }

/** Section heading as laid out on top of a page (s.sectionHead). */
const HEAD = 14 * 1.2 + 4 + 1.2 + 10

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

/** Height of prose that precedes a step list, or null when it is not plain paragraphs. */
function proseHeight(kids: ReactNode[], width: number): number | null {
  let h = 0
  for (const k of kids) {
    if (!isValidElement<WithChildren>(k) || k.type !== P) return null
    const text: string[] = []
    words(k.props.children, text)
    // One line spare: inline math rows stand a little taller than plain lines.
    const lines = lineCount([{ text: text.join(''), size: BODY_SIZE, face: { family: SANS } }], width) + 1
    h += lines * BODY_SIZE * Math.max(LINE, LINE + BASELINE_DEPTH - 0.3) + 6
  }
  return h
}

function isSteps(k: ReactNode): k is ReactElement<StepsProps> {
  return isValidElement<StepsProps>(k) && k.type === PdfSteps && k.props.from === undefined
}

/**
 * The body as segments: the first shares the page with the section heading,
 * every later one starts a new page. `startsPage` is false for a section that
 * continues the previous one's page, where the room left is unknown.
 */
export function segmentBody(body: ReactNode, ctx: ReportContext, startsPage: boolean): ReactNode[][] {
  const paper = ctx.pkg.paper
  const budget = pageBudget(paper)
  const segments: ReactNode[][] = [[]]
  for (const kid of Children.toArray(body)) {
    const current = segments[segments.length - 1]
    if (!isSteps(kid)) {
      current.push(kid)
      continue
    }
    const { section } = kid.props
    const list = ctx.bySection.get(section) ?? []
    const heights = list.map(({ n, step }) => stepHeight(stepView(n, step), paper))
    const total = heights.reduce((a, b) => a + b, 0)
    const before = segments.length === 1 && startsPage ? proseHeight(current, contentWidth(paper)) : null
    const first = before === null ? 0 : budget - HEAD - before
    if (total <= (before === null ? budget : first)) {
      current.push(kid)
      continue
    }
    const cuts = cutPoints(heights, first, budget)
    const bounds = [0, ...cuts, list.length]
    bounds.slice(0, -1).forEach((from, i) => {
      const to = bounds[i + 1]
      if (to <= from) return
      if (i > 0) segments.push([])
      segments[segments.length - 1].push(<PdfSteps key={`${section}-${from}`} section={section} from={from} to={to} />)
    })
  }
  return segments
}
