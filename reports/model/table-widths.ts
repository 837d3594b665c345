/** Relative column widths from content length, so short codes stay narrow and notes get room. */
import type { TableView } from './views'

export function columnWeights(view: TableView): number[] {
  return view.headers.map((h, i) => {
    // A header may wrap between words but never inside one, so its longest word sets a floor
    // (bold, hence a little wider than the cells); otherwise "Component" runs into "Check".
    const word = Math.max(...h.split(/\s+/).map((w) => w.length)) * 1.1
    const longest = Math.max(word, h.length * 0.6, ...view.rows.map((r) => (r[i] ?? '').length))
    return Math.min(34, Math.max(3, longest))
  })
}
