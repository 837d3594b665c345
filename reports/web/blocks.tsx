/** The report components as static HTML; classes are styled by report.css. */
import { stepAnchor } from '../model/context'
import { useReport } from '../model/react-context'
import { diagramFigure, plotFigure, utilisationFigure, type FigureView } from '../model/figures'
import {
  cautions, checksTable, historyTable, inputsTable, references, remarksTable, signatories, stepView, tableView, titleView, verdictView,
  type StepView, type TableView,
} from '../model/views'
import { Tex } from './math'
import { SceneSvg } from './scene'

export function HtmlTable({ view, caption = true }: { view: TableView; caption?: boolean }) {
  return (
    <div className="inv-table-wrap">
      <table className="inv-table" id={`table-${view.id}`}>
        {caption ? <caption>{view.title}</caption> : null}
        <thead>
          <tr>{view.headers.map((h, i) => <th key={i} className={view.numeric[i] ? 'num' : undefined}>{h}</th>)}</tr>
        </thead>
        <tbody>
          {view.rows.map((row, r) => (
            <tr key={r}>{row.map((v, i) => <td key={i} className={view.numeric[i] ? 'num' : undefined}>{v}</td>)}</tr>
          ))}
        </tbody>
      </table>
    </div>
  )
}

export function StepBox({ v }: { v: StepView }) {
  return (
    <div className={`inv-step inv-${v.verdict ?? 'info'}`} id={stepAnchor(v.id)}>
      <div className="inv-step-head">
        <a className="inv-step-n" href={`#${stepAnchor(v.id)}`}>{v.n}</a>
        <span className="inv-step-title">{v.title}</span>
        <code className="inv-step-id">{v.id}</code>
        {v.verdictLabel ? <span className="inv-badge">{v.verdictLabel}</span> : null}
      </div>
      <dl className="inv-step-body">
        {v.formula ? <><dt>Formula</dt><dd><Tex tex={v.formula} /></dd></> : null}
        {v.substituted ? <><dt>With values</dt><dd><Tex tex={v.substituted} /></dd></> : null}
        <dt>Result</dt><dd className="inv-result">{v.result || '—'}</dd>
        <dt>Source</dt><dd>{v.source ?? '—'}</dd>
      </dl>
      {v.note ? <p className="inv-note">{v.note}</p> : null}
    </div>
  )
}

export function Steps({ section }: { section: string }) {
  const list = useReport().bySection.get(section) ?? []
  return <div className="inv-steps">{list.map(({ n, step }) => <StepBox key={step.id} v={stepView(n, step)} />)}</div>
}

export function Step({ id }: { id: string }) {
  const ctx = useReport()
  const n = ctx.numberOf.get(id)
  const step = ctx.pkg.result.steps.find((s) => s.id === id)
  return n && step ? <StepBox v={stepView(n, step)} /> : null
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
      <div className="inv-titleblock-head"><small>Calculation package</small><div>{t.title}</div></div>
      <dl>{t.rows.map(([k, v]) => <div key={k}><dt>{k}</dt><dd>{v}</dd></div>)}</dl>
    </div>
  )
}

export function Verdict() {
  const v = verdictView(useReport().pkg)
  if (!v) return null
  return (
    <div className={`inv-verdict ${v.pass ? 'inv-pass' : 'inv-fail'}`}>
      <span className="inv-verdict-mark">{v.pass ? 'PASS' : 'FAIL'}</span>
      <div><strong>{v.headline}</strong><br />{v.detail}</div>
    </div>
  )
}

export const InputsTable = () => {
  const { pkg } = useReport()
  return pkg.inputRows.length ? <HtmlTable view={inputsTable(pkg)} caption={false} /> : null
}

export function ResultsTable({ section, id }: { section?: string; id?: string }) {
  const tables = (useReport().pkg.result.tables ?? []).filter((t) => (id ? t.id === id : !section || t.section === section))
  return <>{tables.map((t) => <HtmlTable key={t.id} view={tableView(t)} />)}</>
}

export function ChecksTable() {
  const ctx = useReport()
  const checks = ctx.pkg.result.checks ?? []
  return checks.length ? <HtmlTable view={checksTable(checks, ctx)} /> : null
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

export function SignatureBlock() {
  return (
    <div className="inv-signatures">
      {signatories(useReport().pkg).map((s) => (
        <div key={s.role}><small>{s.role}</small><strong>{s.name}</strong><span>{s.date === '—' ? 'not signed' : `Date ${s.date}`}</span></div>
      ))}
    </div>
  )
}
