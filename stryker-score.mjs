// Mutation score per file from reports-mutation/mutation.json, with and without
// display-text mutants: mutants that only change a label or note (a check's
// title, note, TeX formula, the basis caution, messages and error texts), not
// a number, a clause, a step key or the printed working. Run after `stryker run`
// (npm run test:mutation does both). Usage: node stryker-score.mjs [report.json]
import { readFileSync } from 'node:fs'
import ts from 'typescript'

const DISPLAY_PROPS = new Set(['title', 'note', 'label', 'formula', 'caution', 'message', 'rhoMinName', 'rhoMaxName', 'splitReason', 'farName'])
const DISPLAY_CALLS = new Set(['fail', 'Error'])

const file = process.argv[2] ?? 'reports-mutation/mutation.json'
const report = JSON.parse(readFileSync(file, 'utf8'))

function offsetOf(src, { line, column }) {
  let off = 0
  for (let l = 1; l < line; l++) off = src.indexOf('\n', off) + 1
  return off + column - 1
}

function isDisplay(sf, start, end) {
  let node = sf
  // innermost node that contains [start, end)
  for (;;) {
    const child = node.getChildren(sf).find((c) => c.getStart(sf) <= start && c.getEnd() >= end)
    if (!child) break
    node = child
  }
  for (let n = node; n; n = n.parent) {
    if (ts.isPropertyAssignment(n) && DISPLAY_PROPS.has(n.name.getText(sf))) return true
    if (ts.isVariableDeclaration(n) && DISPLAY_PROPS.has(n.name.getText(sf))) return true
    if ((ts.isCallExpression(n) || ts.isNewExpression(n)) && DISPLAY_CALLS.has(n.expression.getText(sf))) {
      // fail(kind, message): only the message; new Error(text): all of it
      const args = n.arguments ?? []
      const i = args.findIndex((a) => a.getStart(sf) <= start && a.getEnd() >= end)
      if (n.expression.getText(sf) === 'Error' ? i >= 0 : i === 1) return true
    }
  }
  return false
}

const counted = (ms) => {
  const k = ms.filter((m) => m.status === 'Killed' || m.status === 'Timeout').length
  const all = ms.filter((m) => ['Killed', 'Timeout', 'Survived', 'NoCoverage'].includes(m.status)).length
  return { k, all, score: all ? (100 * k) / all : 100 }
}

const rows = []
const left = []
for (const [path, f] of Object.entries(report.files)) {
  const sf = ts.createSourceFile(path, f.source, ts.ScriptTarget.Latest, true)
  const ms = f.mutants.map((m) => ({ ...m, display: isDisplay(sf, offsetOf(f.source, m.location.start), offsetOf(f.source, m.location.end)) }))
  const a = counted(ms)
  const b = counted(ms.filter((m) => !m.display))
  rows.push([path, a, b])
  for (const m of ms) if (!m.display && (m.status === 'Survived' || m.status === 'NoCoverage')) left.push(`${path}:${m.location.start.line}:${m.location.start.column} ${m.status} ${m.mutatorName}: ${(m.replacement ?? '').replace(/\s+/g, ' ').slice(0, 90)}`)
}
const pct = (x) => `${x.score.toFixed(1)} % (${x.k}/${x.all})`
console.log('file | all mutants | without display text')
for (const [p, a, b] of rows) console.log(`${p} | ${pct(a)} | ${pct(b)}`)
const tot = (i) => rows.reduce((s, r) => ({ k: s.k + r[i].k, all: s.all + r[i].all }), { k: 0, all: 0 })
const t1 = tot(1)
const t2 = tot(2)
console.log(`all files | ${pct({ ...t1, score: (100 * t1.k) / t1.all })} | ${pct({ ...t2, score: (100 * t2.k) / t2.all })}`)
if (process.argv.includes('--left')) console.log(['', 'surviving (not display text):', ...left].join('\n'))
