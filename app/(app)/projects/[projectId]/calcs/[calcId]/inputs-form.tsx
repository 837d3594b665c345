'use client'

import { useRef, type ReactNode } from 'react'
import type { MechanismId as CalcType } from '@/lib/mechanisms'
import { rangeFor, rangeMessage } from '@/lib/bench/ranges'
import type { UnitSystem } from '@/lib/units'
import { BASIS_FIELDS, BASIS_OPTIONS, FACTOR_FIELDS, geometryFields, LINK_FIELDS, OPERATING_SPEED_FIELDS, OVERRIDE_FIELDS, PIN_FIELDS, SELF_WEIGHT_FIELDS, TOLERANCE_FIELDS, STROKE_FIELDS, type InputFieldDef } from './input-fields'
import { displayUnitOf, showValue } from './units'

/** How the form reads and changes the working inputs the bench holds (SI inside). */
export interface FormBinding {
  system: UnitSystem
  editable: boolean
  /** What the field shows: the text being typed, else the stored value in the display unit. */
  text(path: string, siUnit?: string): string
  error(path: string): string | undefined
  change(path: string, text: string, def: { unit?: string; kind: 'number' | 'text' | 'option' }): void
  loads: { name: string; fx: number; fy: number }[]
  addLoad(): void
  removeLoad(index: number): void
  basisKind: string
}

/** A range error in the unit shown: the stored message gives SI limits. */
function shownError(b: FormBinding, path: string, unit?: string): string | undefined {
  const e = b.error(path)
  const r = rangeFor(path)
  if (!e || !r || b.system === 'SI' || !unit || !e.startsWith('must be')) return e
  return rangeMessage(r, (v) => showValue(v, unit, b.system), displayUnitOf(unit, b.system))
}

function NumberOrOption({ def, b, label }: { def: InputFieldDef; b: FormBinding; label?: ReactNode }) {
  const id = `in-${def.path.replace(/\./g, '-')}`
  const error = shownError(b, def.path, def.unit)
  const unit = displayUnitOf(def.unit, b.system)
  const hintId = def.hint ? `${id}-hint` : undefined
  const describedBy = [error ? `${id}-error` : null, hintId].filter(Boolean).join(' ') || undefined
  const common = {
    id,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': describedBy,
    className: b.editable ? 'field' : 'field field-readonly',
  }
  const value = b.text(def.path, def.unit)
  return (
    <div>
      <label htmlFor={id} className="mb-0.5 block text-xs text-ink/80">
        {label ?? def.label} {unit && unit !== '—' && <span className="text-ink/70">[{unit}]</span>}
      </label>
      {def.options && b.editable ? (
        <select {...common} value={value} onChange={(e) => b.change(def.path, e.target.value, { kind: 'option' })}>
          {!def.options.some((o) => o.value === value) && <option value={value}>{value || '—'}</option>}
          {def.options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      ) : (
        <input
          {...common}
          type="text"
          inputMode={def.options ? undefined : 'decimal'}
          autoComplete="off"
          readOnly={!b.editable}
          value={def.options ? (def.options.find((o) => o.value === value)?.label ?? value) : value}
          onChange={(e) => b.change(def.path, e.target.value, { unit: def.unit, kind: 'number' })}
        />
      )}
      {def.hint && !error && (
        <p id={hintId} className="mt-0.5 text-[11px] text-ink/70">
          {def.hint}
        </p>
      )}
      <p id={`${id}-error`} className="field-error" aria-live="polite">
        {error}
      </p>
    </div>
  )
}

function Group({ title, children, note }: { title: string; children: ReactNode; note?: string }) {
  return (
    <fieldset className="flex flex-col gap-2 border-t border-rule pt-3">
      <legend className="h2 pr-2">{title}</legend>
      {note && <p className="text-[11px] text-ink/70">{note}</p>}
      <div className="grid grid-cols-2 gap-x-3 gap-y-2">{children}</div>
    </fieldset>
  )
}

/** The working inputs of a calc: every number typed as the person writes it, stored in SI exactly as entered. */
export function InputsForm({ calcType, materials, b, header }: { calcType: CalcType; materials: readonly string[]; b: FormBinding; header: ReactNode }) {
  const addRef = useRef<HTMLButtonElement>(null)
  const removeRefs = useRef<(HTMLButtonElement | null)[]>([])
  const field = (def: InputFieldDef) => <NumberOrOption key={def.path} def={def} b={b} />
  const force = displayUnitOf('N', b.system)
  const remove = (i: number) => {
    b.removeLoad(i)
    // Focus stays in the list: on the next case's remove button, or on "Add load case".
    requestAnimationFrame(() => (removeRefs.current[Math.min(i, b.loads.length - 2)] ?? addRef.current)?.focus())
  }
  return (
    <form className="panel flex flex-col gap-4 p-4" noValidate data-testid="inputs-form" aria-labelledby="inputs-title" onSubmit={(e) => e.preventDefault()}>
      {header}
      {!b.editable && <p className="rounded bg-paper px-3 py-2 text-xs text-ink/80">Read-only: your role in this project does not edit inputs.</p>}
      <Group title="Geometry">{geometryFields(calcType).map(field)}</Group>
      <Group title="Stroke">{STROKE_FIELDS.map(field)}</Group>
      <fieldset className="flex flex-col gap-2 border-t border-rule pt-3">
        <legend className="h2 pr-2">Load cases at the tracer [{force}]</legend>
        <div className="grid grid-cols-[1fr_5.5rem_5.5rem_2rem] gap-2 text-[11px] text-ink/70" aria-hidden="true">
          <span>Name</span>
          <span>Fx (across)</span>
          <span>Fy (along)</span>
        </div>
        {b.loads.map((_, i) => (
          <div key={i} className="grid grid-cols-[1fr_5.5rem_5.5rem_2rem] items-start gap-2" data-testid={`load-${i}`}>
            {(['name', 'fx', 'fy'] as const).map((k) => {
              const path = `loads.${i}.${k}`
              const id = `in-${path.replace(/\./g, '-')}`
              const error = shownError(b, path, k === 'name' ? undefined : 'N')
              return (
                <div key={k}>
                  <label htmlFor={id} className="sr-only">
                    Load case {i + 1} {k === 'name' ? 'name' : k === 'fx' ? `Fx across the line [${force}]` : `Fy along the line [${force}]`}
                  </label>
                  <input
                    id={id}
                    className={b.editable ? 'field' : 'field field-readonly'}
                    readOnly={!b.editable}
                    type="text"
                    inputMode={k === 'name' ? undefined : 'decimal'}
                    autoComplete="off"
                    aria-invalid={error ? true : undefined}
                    aria-describedby={error ? `${id}-error` : undefined}
                    value={b.text(path, k === 'name' ? undefined : 'N')}
                    onChange={(e) => b.change(path, e.target.value, k === 'name' ? { kind: 'text' } : { unit: 'N', kind: 'number' })}
                  />
                  <p id={`${id}-error`} className="field-error" aria-live="polite">
                    {error}
                  </p>
                </div>
              )
            })}
            {b.editable && (
              <button
                type="button"
                ref={(el) => {
                  removeRefs.current[i] = el
                }}
                className="btn-quiet px-2"
                onClick={() => remove(i)}
                aria-label={`Remove load case ${i + 1}`}
                disabled={b.loads.length === 1}
              >
                ×
              </button>
            )}
          </div>
        ))}
        <p className="field-error">{b.error('loads')}</p>
        {b.editable && (
          <button ref={addRef} type="button" className="btn-quiet self-start" onClick={b.addLoad}>
            Add load case
          </button>
        )}
      </fieldset>
      <Group title="Design basis">
        {field({ path: 'basis.kind', label: 'Basis', options: BASIS_OPTIONS })}
        {(BASIS_FIELDS[b.basisKind] ?? []).map(field)}
        {FACTOR_FIELDS.map(field)}
      </Group>
      <Group title="Pins (every joint)">{PIN_FIELDS(materials).map(field)}</Group>
      <Group title="Links (every link)">{LINK_FIELDS(materials).map(field)}</Group>
      <Group title="Self-weight (optional)">{SELF_WEIGHT_FIELDS.map(field)}</Group>
      <Group title="Operating speed (optional)">{OPERATING_SPEED_FIELDS.map(field)}</Group>
      <Group title="Straightness as built (optional)">{TOLERANCE_FIELDS.map(field)}</Group>
      <details className="border-t border-rule pt-3" open={OVERRIDE_FIELDS(calcType).some((d) => b.error(d.path))}>
        <summary className="h2 cursor-pointer">Per joint and link (overrides the above)</summary>
        <p className="mt-1 text-[11px] text-ink/70">Leave empty to use the values for every joint or link. A flat bar width needs its thickness too.</p>
        <div className="mt-2 grid grid-cols-2 gap-x-3 gap-y-2">{OVERRIDE_FIELDS(calcType).map(field)}</div>
      </details>
    </form>
  )
}
