/**
 * A TableView as rows of Views; column widths follow their content. Long tables are cut into page
 * slices by the wrapper (flow.tsx) from the row heights below, each slice with its own head; the
 * numbers of a slice are set one Text per column (a column of lines), which keeps a 40-row sweep at a
 * dozen nodes instead of five hundred.
 */
import { Text, View } from '@react-pdf/renderer'
import { columnWeights } from '../model/table-widths'
import type { TableView } from '../model/views'
import { C } from './styles'

const PAD_Y = 1.4
const LINE_H = 1.3

export const tableRowHeight = (size: number): number => size * LINE_H + 2 * PAD_Y + 0.4
/** Title (if any) and the two-line head. */
export const tableHeadHeight = (view: TableView, size: number, title: boolean): number =>
  (title ? 8.2 * 1.3 + 3 : 0) + 2 * (size - 0.4) * LINE_H + 2 * PAD_Y + 1.2 + 8

/** True when every cell fits its column on one line, so a column can be one Text of lines. */
function singleLine(view: TableView, widths: number[]): boolean {
  return view.headers.every((_, i) => view.rows.every((r) => (r[i] ?? '').length <= widths[i] * 1.1))
}

export function PdfTable({ view, size = 7.4, title = true, from = 0, to }: { view: TableView; size?: number; title?: boolean; from?: number; to?: number }) {
  const widths = columnWeights(view)
  const rows = view.rows.slice(from, to)
  const cellStyle = (i: number) => ({
    flex: widths[i],
    paddingHorizontal: 3,
    paddingVertical: PAD_Y,
    textAlign: view.numeric[i] ? ('right' as const) : ('left' as const),
  })
  const head = (
    <View style={{ flexDirection: 'row', borderTopWidth: 0.9, borderBottomWidth: 0.5, borderColor: C.ink }} wrap={false}>
      {view.headers.map((h, i) => {
        // The unit gets its own line (a Text of its own: a line break inside Text falls back to Helvetica).
        const m = /^(.*) (\[[^\]]*\])$/.exec(h)
        const st = { fontSize: size - 0.4, fontStyle: 'italic' as const, color: C.muted, lineHeight: LINE_H, textAlign: view.numeric[i] ? ('right' as const) : ('left' as const) }
        return (
          <View key={i} style={cellStyle(i)}>
            <Text style={st}>{m ? m[1] : h}</Text>
            {m ? <Text style={st}>{m[2]}</Text> : null}
          </View>
        )
      })}
    </View>
  )
  const caption = title ? <Text style={{ fontSize: 8.2, fontWeight: 700, marginBottom: 3, lineHeight: 1.3 }}>{from > 0 ? `${view.title} (continued)` : view.title}</Text> : null
  if (rows.length > 12 && singleLine(view, widths)) {
    return (
      <View style={{ marginBottom: 8 }} wrap={false}>
        {caption}
        {head}
        <View style={{ flexDirection: 'row', borderBottomWidth: 0.6, borderBottomColor: C.ink }}>
          {view.headers.map((_, i) => (
            <Text key={i} style={[cellStyle(i), { fontSize: size, lineHeight: (tableRowHeight(size) - 0.0001) / size }]}>{rows.map((r) => r[i]).join('\n')}</Text>
          ))}
        </View>
      </View>
    )
  }
  return (
    <View style={{ marginBottom: 8 }}>
      <View wrap={false} minPresenceAhead={30}>
        {caption}
        {head}
      </View>
      {rows.map((row, r) => (
        <View key={r} wrap={false} style={{ flexDirection: 'row', borderBottomWidth: r === rows.length - 1 ? 0.6 : 0.3, borderBottomColor: r === rows.length - 1 ? C.ink : C.hair }}>
          {row.map((v, i) => (
            <Text key={i} style={[cellStyle(i), { fontSize: size, lineHeight: LINE_H, fontWeight: view.strong?.[r] ? 700 : 400, color: v === 'fails' || v === 'not met' ? C.accent : C.ink }]}>{v}</Text>
          ))}
        </View>
      ))}
    </View>
  )
}
