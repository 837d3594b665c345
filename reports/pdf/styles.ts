/** Page geometry and the PDF's type scale; one place so every block lines up. */
import { StyleSheet } from '@react-pdf/renderer'
import type { Paper } from '../types'
import { MONO, TEXT_STACK } from './fonts'

export const PAGE_SIZE: Record<Paper, [number, number]> = { A4: [595.28, 841.89], LETTER: [612, 792] }
export const MARGIN_X = 44
export const HEADER_TOP = 22
export const BODY_TOP = 86
export const BODY_BOTTOM = 58

export function contentWidth(paper: Paper): number {
  return PAGE_SIZE[paper][0] - 2 * MARGIN_X
}

export const BODY_SIZE = 9.2
export const LINE = 1.45

export const C = {
  ink: '#1d2a33',
  muted: '#6b7780',
  rule: '#c9d2d8',
  faint: '#eef2f4',
  accent: '#2f6f8f',
  pass: '#3d7a57',
  fail: '#b03a2e',
  warn: '#b7791f',
}

export const s = StyleSheet.create({
  page: { fontFamily: TEXT_STACK, fontSize: BODY_SIZE, color: C.ink, paddingTop: BODY_TOP, paddingBottom: BODY_BOTTOM, paddingHorizontal: MARGIN_X, lineHeight: LINE },
  sectionHead: { flexDirection: 'row', alignItems: 'flex-end', borderBottomWidth: 1.2, borderBottomColor: C.accent, paddingBottom: 4, marginBottom: 10 },
  sectionNum: { fontSize: 14, fontWeight: 700, color: C.accent, width: 26, lineHeight: 1.2 },
  sectionTitle: { fontSize: 14, fontWeight: 700, lineHeight: 1.2 },
  h3: { fontSize: 10.5, fontWeight: 700, marginTop: 8, marginBottom: 4 },
  h4: { fontSize: 9.5, fontWeight: 700, marginTop: 6, marginBottom: 3 },
  p: { marginBottom: 6 },
  em: { fontStyle: 'italic' },
  strong: { fontWeight: 700 },
  code: { fontFamily: MONO, fontSize: BODY_SIZE * 0.9 },
  list: { marginBottom: 6 },
  li: { flexDirection: 'row', marginBottom: 2 },
  bullet: { width: 12, color: C.accent },
  liBody: { flex: 1 },
  small: { fontSize: 7, color: C.muted },
  mono: { fontFamily: MONO, fontSize: 6.8, color: C.muted },
  caption: { fontSize: 7.8, color: C.muted, marginTop: 3, marginBottom: 10 },
  captionLabel: { fontWeight: 700, color: C.ink },
})

/** The top row of the title block, as flex shares; finishPdf stamps into the State and Page cells. */
export const TITLE_CELLS = { project: 3, calc: 1.6, rev: 0.5, state: 1.0, page: 1 }
const titleTotal = Object.values(TITLE_CELLS).reduce((a, b) => a + b, 0)
/** Share of the text width from the left where a title-block cell starts, and the baseline of its value below the block's top. */
export const TITLE_CELL_AT = {
  calc: TITLE_CELLS.project / titleTotal,
  rev: (TITLE_CELLS.project + TITLE_CELLS.calc) / titleTotal,
  state: (TITLE_CELLS.project + TITLE_CELLS.calc + TITLE_CELLS.rev) / titleTotal,
  page: (titleTotal - TITLE_CELLS.page) / titleTotal,
  /** The second row: Client, then Title (flex 3 : 4.1). */
  title: 3 / 7.1,
  baseline: 18.4,
}
/** The sign-off strip at the foot of every page: a column per role, then the generation note. */
export const FOOTER = { bottom: 18, height: 26 }
export const SIGN_OFF_ROLES = ['Engineer', 'Checker', 'Approver'] as const
