/** The report components as static HTML; classes are styled by report.css. */
import { stepAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import { diagramFigure, plotFigure, utilisationFigure, type FigureView } from '../model/figures'
import {
  cautions, changesView, componentTable, criteriaTable, detailingTable, governingTables, historyTable, inputsTable, materialsTable, references, remarksTable, signatories, stepView, tableView, titleView, verdictView,
  type StepView, type TableView,
} from '../model/views'
import { formatUtilisation } from '../model/format'
import { Tex } from './math'
import { SceneSvg } from './scene'

/** Columns from which a table may be wider than the text column. */
const WIDE_TABLE = 7

export function HtmlTable({ view, caption = true }: { view: TableView; caption?: boolean }) {
  return (
    // A table wide enough to scroll sideways can be reached and scrolled from the keyboard.
    <div className="inv-table-wrap" {...(view.headers.length >= WIDE_TABLE ? { tabIndex: 0, role: 'region', 'aria-label': view.title } : {})}>
      <table className="inv-table" id={`table-${view.id}`}>
        {caption ? <caption>{view.title}</caption> : null}
        <thead>
          <tr>{view.headers.map((h, i) => <th key={i} className={view.numeric[i] ? 'num' : undefined}>{h}</th>)}</tr>
        </thead>
        <tbody>
          {view.rows.map((row, r) => (
            <tr key={r}>{row.map((v, i) => <td key={i} className={[view.numeric[i] ? 'num' : '', v === 'fails' || v === 'not met' ? 'inv-flag' : ''].join(' ').trim() || undefined}>{v}</td>)}</tr>
          ))}
        </tbody>
      </table>
    </div>
  )
}

/** The utilisation glyph: a small square filled from below in proportion to u; open-topped and in the accent colour above 1. */
export function UGlyph({ u }: { u: number }) {
  const k = Math.max(0, Math.min(1, u))
  const over = u > 1 + 1e-9
  return (
    <svg className={over ? 'inv-u inv-u-over' : 'inv-u'} viewBox="0 0 8 8" width="8" height="8" aria-hidden="true">
      <path d={`M0.5 0.5V7.5H7.5V0.5${over ? '' : 'Z'}`} fill="none" strokeWidth="0.8" />
      {k > 0 ? <rect x="1.2" y={6.8 - 5.6 * k} width="5.6" height={5.6 * k} /> : null}
    </svg>
  )
}

export function StepBox({ v }: { v: StepView }) {
  return (
    <div className={`inv-step inv-${v.verdict ?? 'info'}`} id={stepAnchor(v.id)}>
      <a className="inv-step-n" href={`#${stepAnchor(v.id)}`}>{v.n}</a>
      <div className="inv-step-work">
        <div className="inv-step-title">{v.title}</div>
        {v.formula ? <div className="inv-line"><Tex tex={v.formula} /></div> : null}
        {v.substituted ? <div className="inv-line"><Tex tex={v.substituted} /></div> : null}
        <div className="inv-ref">
          {v.source ? <span>per {v.source}</span> : null}
          {v.from ? <span>from {v.from}</span> : null}
          <code className="inv-step-id">{v.id}</code>
        </div>
        {v.note ? <p className="inv-note">{v.note}</p> : null}
      </div>
      <div className="inv-value">
        <span className="inv-result">{v.utilisation !== undefined ? <UGlyph u={v.utilisation} /> : null}{v.result || '—'}</span>
        {v.criterion ? <span className="inv-criterion"><Tex tex={v.criterion} /></span> : null}
        {v.verdictLabel ? <span className="inv-verdict-word">{v.verdictLabel}</span> : null}
      </div>
      <div className="inv-check" role="note" aria-label="Checker’s column" />
    </div>
  )
}

export function Steps({ section }: { section: string }) {
  const ctx = useReport()
  const list = ctx.bySection.get(section) ?? []
  return <div className="inv-steps">{list.map(({ n, step }) => <StepBox key={step.id} v={stepView(n, step, ctx)} />)}</div>
}

export function AppendixSteps() {
  const ctx = useReport()
  return (
    <>
      {[...ctx.appendixBySection].map(([section, list]) => (
        <div key={section}>
          <h3>{section}</h3>
          <div className="inv-steps">{list.map(({ n, step }) => <StepBox key={step.id} v={stepView(n, step, ctx)} />)}</div>
        </div>
      ))}
      {(ctx.pkg.result.tables ?? []).filter((t) => t.id.startsWith('tab.sweep')).map((t) => <HtmlTable key={t.id} view={tableView(t, ctx.units)} />)}
    </>
  )
}

export function Step({ id }: { id: string }) {
  const ctx = useReport()
  const n = ctx.numberOf.get(id)
  const step = ctx.pkg.result.steps.find((s) => s.id === id)
  return n && step ? <StepBox v={stepView(n, step, ctx)} /> : null
}

export function OtherSteps() {
  const ctx = useReport()
  return <>{ctx.otherSections.map((sec) => <div key={sec}><h3>{sec}</h3><Steps section={sec} /></div>)}</>
}

function HtmlFigure({ fig }: { fig: FigureView | null }) {
  if (!fig) return null
  return (
    <figure className="inv-figure">
      <SceneSvg scene={fig.scene} label={fig.caption} />
      <figcaption><strong>{fig.label}.</strong> {fig.caption}</figcaption>
    </figure>
  )
}

export const Figure = ({ at, caption, ordinal }: { at?: string; caption?: string; ordinal?: string }) => <HtmlFigure fig={diagramFigure(useReport(), at, caption, ordinal)} />
export const Plot = ({ kind, caption, ordinal }: { kind: string; caption?: string; ordinal?: string }) => <HtmlFigure fig={plotFigure(useReport(), kind, caption, ordinal)} />
export const UtilisationChart = ({ caption, ordinal }: { caption?: string; ordinal?: string }) => <HtmlFigure fig={utilisationFigure(useReport(), caption, ordinal)} />

export function TitleBlock() {
  const ctx = useReport()
  const t = titleView(ctx.pkg, ctx.resultHash)
  return (
    <div className="inv-titleblock">
      <div className="inv-titleblock-head">{t.title}</div>
      <dl>{t.rows.map(([k, v]) => <div key={k}><dt>{k}</dt><dd>{v}</dd></div>)}</dl>
    </div>
  )
}

export function Verdict() {
  const ctx = useReport()
  const v = verdictView(ctx.pkg, ctx)
  if (!v) return null
  return (
    <div className={`inv-verdict ${v.pass ? 'inv-pass' : 'inv-fail'}`}>
      <strong>{v.pass ? 'Holds.' : 'Does not hold.'} {v.headline}</strong>
      {v.governing ? <div>{v.governing}{v.utilisation !== null ? <> <UGlyph u={v.utilisation} /> <b>u = {formatUtilisation(v.utilisation)}</b></> : null}</div> : null}
      {v.unmet.length ? <div className="inv-unmet">Not met: {v.unmet.join('; ')}.</div> : null}
    </div>
  )
}

export function Criteria() {
  const view = criteriaTable(useReport())
  return view ? <HtmlTable view={view} /> : null
}

const Lines = ({ items }: { items: string[] }) => <ul className="inv-lines">{items.map((t, i) => <li key={i}>{t}</li>)}</ul>

export function DesignBasis() {
  const b = useReport().pkg.result.basis
  return b ? <Lines items={b.statements} /> : null
}

export function Assumptions() {
  const b = useReport().pkg.result.basis
  return b ? <Lines items={b.assumptions} /> : null
}

export const InputsTable = () => {
  const { pkg } = useReport()
  return pkg.inputRows.length ? <HtmlTable view={inputsTable(pkg)} caption={false} /> : null
}

export function MaterialsTable() {
  const view = materialsTable(useReport().pkg)
  return view ? <HtmlTable view={view} /> : null
}

export function GoverningTables() {
  return <>{governingTables(useReport()).map((t) => <HtmlTable key={t.id} view={t} />)}</>
}

export function ResultsTable({ section, id }: { section?: string; id?: string }) {
  const ctx = useReport()
  const tables = (ctx.pkg.result.tables ?? []).filter((t) => t.id !== 'checks-summary' && (id ? t.id === id : !section || t.section === section))
  return <>{tables.map((t) => <HtmlTable key={t.id} view={tableView(t, ctx.units)} />)}</>
}

export function ChecksTable() {
  const ctx = useReport()
  const checks = ctx.pkg.result.checks ?? []
  if (!checks.length) return null
  const d = detailingTable(checks, ctx)
  return <><HtmlTable view={componentTable(checks, ctx)} />{d ? <HtmlTable view={d} /> : null}</>
}

export function References() {
  const r = references(useReport())
  return (
    <>
      <ol className="inv-refs">{r.template.map((t, i) => <li key={i}>{t}</li>)}</ol>
      {r.cited.length ? <><h3>Sources cited by the steps</h3><ol className="inv-refs" start={r.template.length + 1}>{r.cited.map((t, i) => <li key={i}>{t}</li>)}</ol></> : null}
    </>
  )
}

export function Cautions() {
  return <ul className="inv-cautions">{cautions(useReport().pkg).map((c, i) => <li key={i}>{c}</li>)}</ul>
}

export const RevisionHistory = () => {
  const { pkg } = useReport()
  return pkg.history.length ? <HtmlTable view={historyTable(pkg)} /> : null
}

export function RemarksLog() {
  const ctx = useReport()
  return ctx.pkg.remarks.length ? <HtmlTable view={remarksTable(ctx.pkg, ctx)} /> : <p>No remarks recorded.</p>
}

export function Changes() {
  const v = changesView(useReport())
  if (!v) return null
  return <><p>{v.summary}</p>{v.tables.map((t) => <HtmlTable key={t.id} view={t} />)}</>
}

export function SignatureBlock() {
  return (
    <div className="inv-signatures">
      {signatories(useReport().pkg).map((s) => (
        <div key={s.role}><small>{s.role}</small><strong>{s.name}</strong><span>{s.date === '—' ? 'not signed' : `Date ${s.date}`}</span></div>
      ))}
    </div>
  )
}
