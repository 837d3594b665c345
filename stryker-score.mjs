// Mutation score per file from reports-mutation/mutation.json, with and without
// display-text mutants: mutants that only change a label or note (a check's
// title, note, TeX formula, the basis caution, messages and error texts), not
// a number, a clause, a step key or the printed working. Run after `stryker run`
// (npm run test:mutation does both). Usage: node stryker-score.mjs [report.json]
import { readFileSync } from 'node:fs'
import ts from 'typescript'

const DISPLAY_PROPS = new Set(['title', 'note', 'label', 'formula', 'caution', 'message', 'rhoMinName', 'rhoMaxName', 'splitReason', 'farName'])
const DISPLAY_CALLS = new Set(['fail', 'Error'])

/**
 * Mutants shown to be equivalent: the mutated program gives the same result for every input it can get,
 * so no test can kill them. Each row: file, the source text the mutant replaces, its replacement, and why.
 * They are counted in the first two columns and left out of the third only; the script lists them.
 */
const EQUIVALENT = [
  ['lib/units/format.ts', 'a >= 1000', 'false', 'decimalsOf: max(0, 3 − floor(log10 a)) is already 0 from 1000 up'],
  ['lib/units/format.ts', 'a >= 1000', 'a > 1000', 'decimalsOf: at 1000, 3 − log10(1000) = 0 as well'],
  ['lib/units/format.ts', 'Math.abs(x) >= 1000', 'false', 'digitsOf: decimalsOf(x) is 0 from 1000 up'],
  ['lib/units/format.ts', 'Math.abs(x) >= 1000', 'Math.abs(x) > 1000', 'digitsOf: decimalsOf(1000) = 0'],
  ['lib/units/format.ts', 'Math.abs(x) < SMALL', 'Math.abs(x) <= SMALL', 'roundShown: both branches round 10⁻³ to 0.001'],
  ['lib/units/format.ts', 'r < 0', 'r <= 0', 'formatNumber, texNumber: r = 0 has returned "0" before'],
  ['lib/units/format.ts', 'SIGNIFICANT - 1', 'SIGNIFICANT + 1', 'toPrecision of a value already rounded to 3 figures: 5 figures keep the same number'],
  // After a carry into the next decade (999.96 → 1000) the value is a power of ten, which rounding x again at
  // the coarser step gives as well (nearest: x is within half a fine step of it; up/down: within one).
  ['lib/units/format.ts', 'decimalsOf(r) !== d && r !== 0', '*', 'roundShown: re-rounding after a carry gives the same power of ten'],
  ['lib/units/format.ts', 'decimalsOf(r) !== d', '*', 'roundShown: re-rounding after a carry gives the same power of ten'],
  ['lib/units/format.ts', 'r !== 0', '*', 'roundShown: re-rounding after a carry gives the same power of ten'],
  ['lib/units/format.ts', '{\n    d = decimalsOf(r)\n    r = roundTo(x, 10 ** -d, dir)\n  }', '{}', 'roundShown: re-rounding after a carry gives the same power of ten'],
  ['lib/units/format.ts', 'e < -300', 'e <= -300', 'at 10⁻³⁰⁰ both ways of applying the power are exact enough for 3 figures'],
  ['lib/units/format.ts', 'e < -300', 'true', 'the two-step power gives the same 3 figures for normal numbers'],
  ['lib/units/format.ts', '-300', '+300', 'e < 300 always holds below 10⁻³: the two-step power, same 3 figures as above'],
  // AISC §D5.2 w ≥ 2b_e + d with b_e ≤ c = (w − d0)/2: 2b_e + d ≤ w − d0 + d < w, the rule always holds, so a
  // smaller printed demand changes neither the sign nor the rounding of its comparison (only in the printed working).
  ['lib/checks/bases/aisc360.ts', '2 * beDim + e.d', '2 * beDim - e.d', 'D5.2 width rule always met: a smaller demand prints the same', 'substituted'],
  ['lib/checks/bases/aisc360.ts', '2 * beDim', '2 / beDim', 'D5.2 width rule always met: a smaller demand prints the same', 'substituted'],
  // 1/32 in = 0.79375 mm is 7937.4999… in units of 10⁻⁴ in binary: printed 0.7937 to nearest and rounded down alike.
  ['lib/checks/bases/aisc360.ts', 'e.d0 - e.d', 'e.d0 + e.d', 'D5.2 hole: the capacity 1/32 in prints 0.7937 whichever way it is rounded', 'shownCapacity(e.d0 - e.d, HOLE_OVERSIZE)'],
  // |e − r| ≤ 1e-9·max(e, r) and ≤ 1e-9·min(e, r) differ by 1e-9·|e − r|, far below the resolution of |e − r|.
  ['lib/linkage/geometry.ts', 'Math.max(e, r)', 'Math.min(e, r)', 'isStraight: the two bounds differ by 1e-18 relative'],
  ['lib/linkage/geometry.ts', 'i <= n', 'i < n', 'halfStroke: the stroke is symmetric, |T_y| at −θ_lim (sampled first) equals |T_y| at +θ_lim'],
]
/** A row matches the file, the replaced text, the replacement ('*': any) and, when given, text on the mutant's line. */
const equivalent = (path, original, replacement, line) =>
  EQUIVALENT.find(([f, o, r, , ctx]) => f === path && o === original && (r === '*' || r === replacement) && (!ctx || line.includes(ctx)))

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
const eq = []
for (const [path, f] of Object.entries(report.files)) {
  const sf = ts.createSourceFile(path, f.source, ts.ScriptTarget.Latest, true)
  const ms = f.mutants.map((m) => {
    const [s, e] = [offsetOf(f.source, m.location.start), offsetOf(f.source, m.location.end)]
    const alive = m.status === 'Survived' || m.status === 'NoCoverage'
    const line = f.source.split('\n')[m.location.start.line - 1]
    return { ...m, display: isDisplay(sf, s, e), equivalent: alive ? equivalent(path, f.source.slice(s, e), m.replacement ?? '', line) : undefined }
  })
  const a = counted(ms)
  const b = counted(ms.filter((m) => !m.display))
  const c = counted(ms.filter((m) => !m.display && !m.equivalent))
  rows.push([path, a, b, c])
  const where = (m) => `${path}:${m.location.start.line}:${m.location.start.column} ${m.status} ${m.mutatorName}: ${(m.replacement ?? '').replace(/\s+/g, ' ').slice(0, 90)}`
  for (const m of ms) {
    if (m.display || !(m.status === 'Survived' || m.status === 'NoCoverage')) continue
    if (m.equivalent) eq.push(`${where(m)} — ${m.equivalent[3]}`)
    else left.push(where(m))
  }
}
const pct = (x) => `${x.score.toFixed(1)} % (${x.k}/${x.all})`
console.log('file | all mutants | without display text | without display text and equivalent mutants')
for (const [p, a, b, c] of rows) console.log(`${p} | ${pct(a)} | ${pct(b)} | ${pct(c)}`)
const tot = (i) => {
  const t = rows.reduce((s, r) => ({ k: s.k + r[i].k, all: s.all + r[i].all }), { k: 0, all: 0 })
  return { ...t, score: t.all ? (100 * t.k) / t.all : 100 }
}
console.log(`all files | ${pct(tot(1))} | ${pct(tot(2))} | ${pct(tot(3))}`)
if (process.argv.includes('--left')) console.log(['', 'surviving (not display text):', ...left, '', 'left out as equivalent:', ...eq].join('\n'))
