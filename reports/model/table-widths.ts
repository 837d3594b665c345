/** Relative column widths from content length, so short codes stay narrow and notes get room. */
import type { TableView } from './views'

export function columnWeights(view: TableView): number[] {
  return view.headers.map((h, i) => {
    const longest = Math.max(h.length * 0.8, ...view.rows.map((r) => (r[i] ?? '').length))
    return Math.min(34, Math.max(3, longest))
  })
}
