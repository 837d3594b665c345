/**
 * Page geometry and the PDF's type scale; one place so every block lines up. The sheet frame (the
 * title block at the foot, the calc number along the outer margin) is described here as data and
 * drawn twice from it: by react-pdf on the body pages (frame.tsx) and by pdf-lib on the sign-off
 * record and appendix pages (finish.ts `drawFrame`); finish.ts stamps the signed fields into the
 * same cells.
 */
import { StyleSheet } from '@react-pdf/renderer'
import type { Paper } from '../types'
import { MONO, TEXT_STACK } from './fonts'

export const PAGE_SIZE: Record<Paper, [number, number]> = { A4: [595.28, 841.89], LETTER: [612, 792] }
export const MARGIN_X = 44
/** Top of the body: a hairline at HEAD_RULE, text from BODY_TOP. */
export const HEAD_RULE = 26
export const BODY_TOP = 38

export function contentWidth(paper: Paper): number {
  return PAGE_SIZE[paper][0] - 2 * MARGIN_X
}

/**
 * The title block at the foot of every sheet, in points: its bottom edge sits TITLE_BLOCK.bottom
 * above the paper's edge. Cells are [x0, x1) as shares of the text width, row 0 the upper row.
 * `label` is printed small in the cell's corner; `stamp` cells are filled by finishPdf.
 */
export const TITLE_BLOCK = {
  bottom: 16,
  rowHeight: 21,
  rows: 2,
  /** Width of the accent bar at the block's left edge. */
  bar: 3,
  cells: [
    { id: 'project', row: 0, x0: 0, x1: 0.44, label: 'project' },
    { id: 'calc', row: 0, x0: 0.44, x1: 0.62, label: 'calc' },
    { id: 'rev', row: 0, x0: 0.62, x1: 0.68, label: 'rev' },
    { id: 'state', row: 0, x0: 0.68, x1: 0.86, label: 'state', stamp: true },
    { id: 'sheet', row: 0, x0: 0.86, x1: 1, label: 'sheet', stamp: true },
    { id: 'title', row: 1, x0: 0, x1: 0.44, label: 'title' },
    { id: 'prepared', row: 1, x0: 0.44, x1: 0.62, label: 'prepared', stamp: true },
    { id: 'checked', row: 1, x0: 0.62, x1: 0.81, label: 'checked', stamp: true },
    { id: 'approved', row: 1, x0: 0.81, x1: 1, label: 'approved', stamp: true },
  ],
  labelSize: 5.4,
  valueSize: 7.4,
  /** Value baseline below the top of its row. */
  valueBaseline: 16.2,
  /** Label baseline below the top of its row. */
  labelBaseline: 6.2,
  padX: 4,
} as const

export type TitleCellId = (typeof TITLE_BLOCK.cells)[number]['id']

export const TITLE_BLOCK_HEIGHT = TITLE_BLOCK.rowHeight * TITLE_BLOCK.rows
/** Space kept free for the title block below the body. */
export const BODY_BOTTOM = TITLE_BLOCK.bottom + TITLE_BLOCK_HEIGHT + 14

/** Where a title-block cell is, in PDF user space (origin bottom left): its left x, its row's top y. */
export function titleCellAt(paper: Paper, id: TitleCellId): { x: number; top: number; width: number } {
  const c = TITLE_BLOCK.cells.find((x) => x.id === id)!
  const cw = contentWidth(paper)
  const blockTop = TITLE_BLOCK.bottom + TITLE_BLOCK_HEIGHT
  return { x: MARGIN_X + cw * c.x0, top: blockTop - c.row * TITLE_BLOCK.rowHeight, width: cw * (c.x1 - c.x0) }
}

/** The calc number and revision along the outer (right) margin, reading upward. */
export const OUTER_MARK = { fromEdge: 16, size: 7 }

/** The roles whose names and dates sign-off stamps, and the title-block cell each goes in. */
export const SIGN_OFF_ROLES = ['Engineer', 'Checker', 'Approver'] as const
export const SIGN_OFF_CELLS: Record<(typeof SIGN_OFF_ROLES)[number], TitleCellId> = { Engineer: 'prepared', Checker: 'checked', Approver: 'approved' }

export const BODY_SIZE = 9
export const LINE = 1.42

/** Ink and greys, and one accent colour: section numbers, the verdict bar, marks that need attention. */
export const C = {
  ink: '#1b1f23',
  muted: '#5f676e',
  rule: '#b9c0c6',
  hair: '#d9dde0',
  faint: '#f3f4f5',
  accent: '#a8431f',
}

export const s = StyleSheet.create({
  page: { fontFamily: TEXT_STACK, fontSize: BODY_SIZE, color: C.ink, paddingTop: BODY_TOP, paddingBottom: BODY_BOTTOM, paddingHorizontal: MARGIN_X, lineHeight: LINE },
  sectionHead: { flexDirection: 'row', alignItems: 'baseline', marginBottom: 8 },
  sectionNum: { fontSize: 13, fontWeight: 700, color: C.accent, width: 24, lineHeight: 1.2 },
  sectionTitle: { fontSize: 13, fontWeight: 700, lineHeight: 1.2, flex: 1, borderBottomWidth: 0.5, borderBottomColor: C.rule, paddingBottom: 2 },
  h3: { fontSize: 9.8, fontWeight: 700, marginTop: 6, marginBottom: 3 },
  h4: { fontSize: 9.2, fontWeight: 700, marginTop: 5, marginBottom: 2 },
  p: { marginBottom: 5 },
  em: { fontStyle: 'italic' },
  strong: { fontWeight: 700 },
  code: { fontFamily: MONO, fontSize: BODY_SIZE * 0.9 },
  list: { marginBottom: 5 },
  li: { flexDirection: 'row', marginBottom: 2 },
  bullet: { width: 11, color: C.accent },
  liBody: { flex: 1 },
  small: { fontSize: 7, color: C.muted },
  mono: { fontFamily: MONO, fontSize: 6.8, color: C.muted },
  caption: { fontSize: 7.6, color: C.muted, marginTop: 3, marginBottom: 8 },
  captionLabel: { fontWeight: 700, color: C.ink },
})
