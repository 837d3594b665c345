'use client'

import { useCallback, useEffect, useMemo, useRef, useState } from 'react'
import { parseDecimal } from '@/lib/bench/number'
import type { CalcResult } from '@/lib/calc/run'
import type { MechanismId as CalcType } from '@/lib/mechanisms'
import type { UnitSystem } from '@/lib/units'
import { saveWorkingInputsAction } from './bench-actions'
import { CrankProvider } from './crank-context'
import { InputsForm, type FormBinding } from './inputs-form'
import { KeyResults, type RevisionSummary } from './key-results'
import { MechanismDrawing } from './mechanism-drawing'
import { DrawingUnits } from './mechanism-svg'
import { Plots } from './plots'
import { PositionsTable } from './positions-table'
import { BASIS_FIELDS, FACTOR_FIELDS, geometryFields, LINK_FIELDS, OPERATING_SPEED_FIELDS, OVERRIDE_FIELDS, PIN_FIELDS, SELF_WEIGHT_FIELDS, STROKE_FIELDS, TOLERANCE_FIELDS } from './input-fields'
import { getPath, setPath, type Tree } from './tree'
import { useCalc } from './use-calc'
import { showValue, storeValue } from './units'

export interface BenchProps {
  projectId: string
  calcId: string
  calcType: CalcType
  /** The saved working inputs (SI, as stored). */
  initial: Tree
  savedAt: string
  materials: readonly string[]
  editable: boolean
  /** The newest revision, for comparison with what is on screen. */
  revision: RevisionSummary | null
}

type Section = { shape?: string; width?: number; thickness?: number }

/** What the editor implies but does not show: one plate material per fork; per-link sizes are flat bars. */
function complete(values: Tree): Tree {
  const out = structuredClone(values) as Tree & {
    defaults?: { joint?: { middle?: { material?: string }; outer?: { material?: string } }; link?: { section?: Section } }
    links?: Record<string, { section?: Section }>
  }
  const joint = out.defaults?.joint
  if (joint?.outer && joint.middle) joint.outer.material = joint.middle.material
  const base = out.defaults?.link?.section
  for (const link of Object.values(out.links ?? {})) {
    if (link.section) link.section = { ...(base?.shape === 'flat' ? base : {}), ...link.section, shape: 'flat' }
  }
  return out
}

function fieldPaths(calcType: CalcType, materials: readonly string[]): string[] {
  const defs = [geometryFields(calcType), STROKE_FIELDS, ...Object.values(BASIS_FIELDS), FACTOR_FIELDS, PIN_FIELDS(materials), LINK_FIELDS(materials), SELF_WEIGHT_FIELDS, OPERATING_SPEED_FIELDS, TOLERANCE_FIELDS, OVERRIDE_FIELDS(calcType)]
  return ['basis.kind', ...defs.flat().map((d) => d.path)]
}

const draftKey = (calcId: string) => `inverso:draft:${calcId}`
const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })

/**
 * The engineer's bench: the working inputs, what they give (computed here by the same engine as
 * the server, as you type), the moving mechanism, plots and positions. Valid, feasible inputs are
 * saved automatically; anything else stays in this browser until it is fixed.
 */
export function Bench(props: BenchProps) {
  const { projectId, calcId, calcType, editable } = props
  const [inputs, setInputs] = useState<Tree>(props.initial)
  const [texts, setTexts] = useState<Record<string, string>>({})
  const [parseErrors, setParseErrors] = useState<Record<string, string>>({})
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({})
  const [system, setSystem] = useState<UnitSystem>(props.initial.displayUnits === 'US' ? 'US' : 'SI')
  const [saved, setSaved] = useState(() => JSON.stringify(complete(props.initial)))
  const [savedAt, setSavedAt] = useState(props.savedAt)
  const [saving, setSaving] = useState(false)
  const [alert, setAlert] = useState<string | null>(null)
  const [restorable, setRestorable] = useState<{ inputs: Tree; at: number } | null>(null)

  const payload = useMemo(() => complete(inputs), [inputs])
  // The calc runs in a Web Worker (use-calc.ts): a long run never freezes the page, and can be cancelled.
  const calc = useCalc(payload)
  const outcome = calc.outcome
  const lastGood = useRef<CalcResult | null>(null)
  if (outcome.ok) lastGood.current = outcome.result
  const result = outcome.ok ? outcome.result : (outcome.result ?? lastGood.current)
  const json = JSON.stringify(payload)
  const dirty = json !== saved
  const hasParseErrors = Object.keys(parseErrors).length > 0
  const valid = outcome.ok && !hasParseErrors && calc.of === payload

  // A draft left in this browser by an earlier visit (unsaved, e.g. with an error) is offered back.
  useEffect(() => {
    try {
      const raw = localStorage.getItem(draftKey(calcId))
      if (!raw) return
      const draft = JSON.parse(raw) as { inputs: Tree; at: number }
      if (JSON.stringify(complete(draft.inputs)) !== saved) setRestorable(draft)
      else localStorage.removeItem(draftKey(calcId))
    } catch {
      /* an unreadable draft is ignored */
    }
    // Only on arrival.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [])

  const save = useCallback(
    async (values: Tree) => {
      setSaving(true)
      try {
        const out = await saveWorkingInputsAction(projectId, calcId, values)
        if (out.ok) {
          setSaved(JSON.stringify(values))
          setSavedAt((out.data?.savedAt as string) ?? new Date().toISOString())
          setServerErrors({})
          setAlert(null)
          localStorage.removeItem(draftKey(calcId))
        } else {
          setServerErrors(out.fieldErrors ?? {})
          setAlert(out.message ?? 'Not saved.')
        }
      } catch {
        setAlert('Could not reach the server. Your changes are kept in this browser; they are saved when the connection is back (or press Save now).')
        localStorage.setItem(draftKey(calcId), JSON.stringify({ inputs, at: Date.now() }))
      } finally {
        setSaving(false)
      }
    },
    [projectId, calcId, inputs],
  )

  // Drafts save themselves: valid inputs go to the server after a pause, others stay in this browser.
  useEffect(() => {
    if (!editable || !dirty || saving) return
    if (!valid) {
      localStorage.setItem(draftKey(calcId), JSON.stringify({ inputs, at: Date.now() }))
      return
    }
    const t = setTimeout(() => save(payload), 1200)
    return () => clearTimeout(t)
  }, [editable, dirty, valid, saving, payload, inputs, calcId, save])

  // Leaving with unsaved changes asks first: the browser's own prompt, and links inside the app.
  useEffect(() => {
    if (!dirty) return
    const beforeUnload = (e: BeforeUnloadEvent) => e.preventDefault()
    const onClick = (e: MouseEvent) => {
      const a = (e.target as HTMLElement).closest?.('a[href]') as HTMLAnchorElement | null
      if (!a || a.target === '_blank' || a.hasAttribute('download') || a.origin !== location.origin) return
      if (a.pathname === location.pathname) return
      if (!confirm('Your latest changes are not saved yet. Leave this calc anyway?')) {
        e.preventDefault()
        e.stopPropagation()
      }
    }
    window.addEventListener('beforeunload', beforeUnload)
    document.addEventListener('click', onClick, true)
    return () => {
      window.removeEventListener('beforeunload', beforeUnload)
      document.removeEventListener('click', onClick, true)
    }
  }, [dirty])

  const change: FormBinding['change'] = (path, text, def) => {
    setTexts((t) => ({ ...t, [path]: text }))
    setServerErrors((e) => (e[path] ? Object.fromEntries(Object.entries(e).filter(([k]) => k !== path)) : e))
    if (def.kind !== 'number') {
      setParseErrors(({ [path]: _, ...rest }) => rest)
      // An empty choice ("not analysed") removes the key, as an empty number does.
      setInputs((v) => setPath(v, path, def.kind === 'option' && text === '' ? undefined : text))
      return
    }
    const parsed = parseDecimal(text)
    if (!parsed.ok) {
      setParseErrors((e) => ({ ...e, [path]: parsed.message }))
      return
    }
    setParseErrors(({ [path]: _, ...rest }) => rest)
    setInputs((v) => setPath(v, path, parsed.value === undefined ? undefined : storeValue(parsed.value, def.unit, system)))
  }

  const switchUnits = (next: UnitSystem) => {
    // Fields show the stored value in the new unit; only text that is not a number yet is kept.
    setTexts((t) => Object.fromEntries(Object.entries(t).filter(([p]) => parseErrors[p])))
    setSystem(next)
    setInputs((v) => setPath(v, 'displayUnits', next === 'US' ? 'US' : undefined))
  }

  const geometry = useMemo(() => (getPath(payload, 'geometry') as Record<string, number>) ?? {}, [payload])
  const marginDeg = Number(getPath(payload, 'toggleMarginDeg') ?? 5)
  const loads = (inputs.loads as { name: string; fx: number; fy: number }[] | undefined) ?? []
  const errorOf = (path: string) => parseErrors[path] ?? (!outcome.ok ? outcome.fieldErrors[path] : undefined) ?? serverErrors[path]
  const binding: FormBinding = {
    system,
    editable,
    text: (path, unit) => {
      if (path in texts) return texts[path]
      const v = getPath(inputs, path)
      if (typeof v === 'number') return showValue(v, unit, system)
      return v === undefined || v === null ? '' : String(v)
    },
    error: errorOf,
    change,
    loads,
    addLoad: () => setInputs((v) => setPath(v, `loads.${loads.length}`, { name: `Case ${loads.length + 1}`, fx: 0, fy: 0 })),
    removeLoad: (i) => {
      setInputs((v) => ({ ...v, loads: loads.filter((_, j) => j !== i) }))
      // Field texts are keyed by position: the cases after the removed one move up.
      setTexts((t) => Object.fromEntries(Object.entries(t).filter(([p]) => !p.startsWith('loads.'))))
      setParseErrors((e) => Object.fromEntries(Object.entries(e).filter(([p]) => !p.startsWith('loads.'))))
    },
    basisKind: String(getPath(inputs, 'basis.kind') ?? 'en1993'),
  }

  // Messages for paths the form has no field for (e.g. a joint described in an imported file) still show.
  const shownPaths = new Set(fieldPaths(calcType, props.materials))
  const allErrors = { ...serverErrors, ...(!outcome.ok ? outcome.fieldErrors : {}), ...parseErrors }
  const stray = Object.entries(allErrors).filter(([p]) => !shownPaths.has(p) && !/^loads(\.\d+\.(name|fx|fy))?$/.test(p))

  const status = saving
    ? 'Saving…'
    : calc.running
      ? `Calculating…${calc.progress !== null ? ` ${Math.round(100 * calc.progress)} %` : ''}`
    : calc.cancelled
      ? 'Calculation cancelled: the results shown are for the inputs before; change an input to run again'
    : !dirty
      ? `Saved ${time(savedAt)}`
      : valid
        ? 'Unsaved changes — saving shortly'
        : 'Not saved: fix the marked fields (kept in this browser meanwhile)'

  const header = (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <h2 id="inputs-title" className="h2">
          Inputs
        </h2>
        <label className="ml-auto flex items-center gap-1 text-xs text-ink/80">
          Units
          <select className="field w-auto py-0.5" value={system} onChange={(e) => switchUnits(e.target.value as UnitSystem)}>
            <option value="SI">SI (mm, N)</option>
            <option value="US">US (in, lbf)</option>
          </select>
        </label>
        {editable && (
          <button type="button" className="btn" aria-disabled={!dirty || !valid || saving} onClick={() => dirty && valid && !saving && save(payload)}>
            Save and run
          </button>
        )}
      </div>
      {editable && (
        <p className={`flex items-center gap-2 text-xs ${dirty && !valid && !calc.running && !calc.cancelled ? 'text-fail' : 'text-ink/80'}`} role="status" data-testid="save-status">
          {status}
          {calc.running && (
            <button type="button" className="underline" onClick={calc.cancel}>
              Cancel
            </button>
          )}
        </p>
      )}
      {alert && (
        <p role="alert" className="rounded bg-fail-soft px-3 py-2 text-sm text-fail">
          {alert}
        </p>
      )}
      {restorable && editable && (
        <div role="alert" className="rounded bg-caution-soft px-3 py-2 text-sm text-caution">
          Changes from {new Date(restorable.at).toLocaleString()} were not saved.{' '}
          <button
            type="button"
            className="underline"
            onClick={() => {
              setInputs(restorable.inputs)
              setTexts({})
              setRestorable(null)
            }}
          >
            Restore them
          </button>{' '}
          or{' '}
          <button
            type="button"
            className="underline"
            onClick={() => {
              localStorage.removeItem(draftKey(calcId))
              setRestorable(null)
            }}
          >
            discard them
          </button>
          .
        </div>
      )}
    </div>
  )

  return (
    <CrankProvider>
    <div className="flex flex-col gap-4">
      <KeyResults result={outcome.ok ? outcome.result : null} infeasible={!outcome.ok && outcome.result ? outcome.result.feasibility.message : null} hasErrors={!outcome.ok || hasParseErrors} dirty={dirty} savedAt={savedAt} system={system} revision={props.revision} requiredStroke={getPath(payload, 'requiredStroke') as number | undefined} />
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(22rem,26rem)_1fr]">
        <div className="flex flex-col gap-2">
          <InputsForm calcType={calcType} materials={props.materials} b={binding} header={header} />
          {stray.length > 0 && (
            <ul role="alert" className="rounded bg-fail-soft px-3 py-2 text-xs text-fail">
              {stray.map(([path, message]) => (
                <li key={path}>
                  <span className="font-mono">{path}</span>: {message}
                </li>
              ))}
            </ul>
          )}
        </div>
        <div className="flex min-w-0 flex-col gap-4">
          <DrawingUnits.Provider value={system}>
            <MechanismDrawing mechanism={calcType} geometry={geometry} result={result} loads={loads} marginDeg={marginDeg} />
          </DrawingUnits.Provider>
          {result && result.feasibility.ok && <Plots result={result} system={system} />}
        </div>
      </div>
      {result && result.feasibility.ok && <PositionsTable result={result} system={system} />}
    </div>
    </CrankProvider>
  )
}
