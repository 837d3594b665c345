/** A TableView as rows of Views; column widths follow their content. */
import { Text, View } from '@react-pdf/renderer'
import { columnWeights } from '../model/table-widths'
import type { TableView } from '../model/views'
import { C } from './styles'

export function PdfTable({ view, size = 7.4, title = true }: { view: TableView; size?: number; title?: boolean }) {
  const widths = columnWeights(view)
  const cellStyle = (i: number) => ({
    flex: widths[i],
    paddingHorizontal: 3,
    paddingVertical: 1.6,
    textAlign: view.numeric[i] ? ('right' as const) : ('left' as const),
  })
  return (
    <View style={{ marginBottom: 10 }}>
      {title ? <Text style={{ fontSize: 8.4, fontWeight: 700, marginBottom: 3 }} minPresenceAhead={40}>{view.title}</Text> : null}
      <View style={{ flexDirection: 'row', borderTopWidth: 0.9, borderBottomWidth: 0.6, borderColor: C.ink, backgroundColor: C.faint }} wrap={false} fixed>
        {view.headers.map((h, i) => (
          // The unit gets its own line: left to textkit, "[N·mm]" breaks inside the bracket with a hyphen.
          <Text key={i} style={[cellStyle(i), { fontSize: size - 0.4, fontWeight: 700 }]}>{h.replace(/ (\[[^\]]*\])$/, '\n$1')}</Text>
        ))}
      </View>
      {view.rows.map((row, r) => (
        <View key={r} wrap={false} style={{ flexDirection: 'row', borderBottomWidth: 0.4, borderBottomColor: C.rule, backgroundColor: r % 2 ? '#fafbfc' : '#ffffff' }}>
          {row.map((v, i) => (
            <Text key={i} style={[cellStyle(i), { fontSize: size }]}>{v}</Text>
          ))}
        </View>
      ))}
    </View>
  )
}
