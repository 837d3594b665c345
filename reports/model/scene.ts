/**
 * A drawing as a flat list of primitives in points (1/72 in). Diagrams and
 * charts are computed once as scenes; the web draws them as inline SVG and the
 * PDF as react-pdf Svg, so both show the same picture.
 */
export type Anchor = 'start' | 'middle' | 'end'

export type SceneItem =
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number; stroke: string; width: number; dash?: string }
  | { kind: 'circle'; cx: number; cy: number; r: number; stroke?: string; fill?: string; width?: number }
  | { kind: 'rect'; x: number; y: number; w: number; h: number; fill: string; stroke?: string; width?: number }
  | { kind: 'path'; d: string; stroke?: string; fill?: string; width?: number; dash?: string }
  | { kind: 'text'; x: number; y: number; text: string; size: number; anchor?: Anchor; bold?: boolean; fill?: string }

export interface Scene {
  width: number
  height: number
  items: SceneItem[]
}

export const INK = '#1b1f23'
export const MUTED = '#5f676e'
export const GRID = '#d9dde0'
/** The package's one accent colour (reports/pdf/styles.ts C.accent). */
export const ACCENT = '#a8431f'
export const WARN = ACCENT
export const FAIL = ACCENT
export const PASS = INK

/** Series colours: muted, distinguishable in print and for common colour-vision deficiencies. */
export const SERIES = ['#2f6f8f', '#c0643f', '#5f8f4e', '#8566a8', '#b99130', '#3c9aa5', '#8a8f94', '#a14f70']

/** Rough advance width of sans text; enough to leave room for labels. */
export function textWidth(text: string, size: number): number {
  return text.length * size * 0.55
}

export function fmtPt(n: number): string {
  return (Math.round(n * 100) / 100).toString()
}
