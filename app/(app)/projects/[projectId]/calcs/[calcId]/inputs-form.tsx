'use client'

import { useRouter } from 'next/navigation'
import { useState, useTransition } from 'react'
import { useFieldArray, useForm, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form'
import { FieldError, FormMessage } from '@/app/_components/form'
import type { ActionState } from '@/app/_lib/action'
import type { MechanismId as CalcType } from '@/lib/mechanisms'
import { saveInputsAction } from './actions'
import { convertInputs, unitFor } from './units'
import type { UnitSystem } from '@/lib/units'
import { BASIS_FIELDS, BASIS_OPTIONS, FACTOR_FIELDS, geometryFields, LINK_FIELDS, OVERRIDE_FIELDS, PIN_FIELDS, STROKE_FIELDS, type InputFieldDef } from './input-fields'

type Values = FieldValues & { loads: { name: string; fx: number; fy: number }[]; basis: { kind: string }; displayUnits?: UnitSystem }

function get(errors: Record<string, string>, path: string) {
  return errors[path]
}

function InputField({ def, form, errors, disabled, system }: { def: InputFieldDef; form: UseFormReturn<Values>; errors: Record<string, string>; disabled: boolean; system: UnitSystem }) {
  const id = `in-${def.path.replace(/\./g, '-')}`
  const error = get(errors, def.path)
  const common = { id, disabled, className: 'field', 'aria-invalid': error ? true : undefined, 'aria-describedby': `${id}-error` }
  return (
    <div>
      <label htmlFor={id} className="mb-0.5 block text-xs text-ink/70">
        {def.label} {def.unit && <span className="text-ink/50">[{unitFor(def, system)}]</span>}
      </label>
      {def.options ? (
        <select {...common} {...form.register(def.path as Path<Values>)}>
          {def.options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      ) : (
        <input type="number" step={def.step ?? 'any'} {...common} {...form.register(def.path as Path<Values>, { valueAsNumber: true })} />
      )}
      {def.hint && !error && <p className="mt-0.5 text-[11px] text-ink/50">{def.hint}</p>}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  )
}

function Group({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-2 border-t border-rule pt-3">
      <legend className="h2 pr-2">{title}</legend>
      <div className="grid grid-cols-2 gap-x-3 gap-y-2">{children}</div>
    </fieldset>
  )
}

/** An emptied number field reads as NaN: leave the key out, so an optional field is simply absent and a required one is named by the schema. */
function clean(value: unknown): unknown {
  if (typeof value === 'number' && Number.isNaN(value)) return undefined
  if (Array.isArray(value)) return value.map(clean)
  if (value && typeof value === 'object') {
    // Untouched override groups (every field empty) vanish, so the inputs only say what was given.
    const entries = Object.entries(value)
      .map(([k, v]) => [k, clean(v)] as const)
      .filter(([, v]) => v !== undefined)
    return entries.length ? Object.fromEntries(entries) : undefined
  }
  return value
}

type Section = { shape?: string; width?: number; thickness?: number }
type Described = {
  defaults?: { joint?: { middle?: { material?: string }; outer?: { material?: string } }; link?: { section?: Section } }
  links?: Record<string, { section?: Section }>
}

/** What the editor implies but does not show: one plate material per fork, and per-link sizes are flat bars. */
function completeDescriptions(values: Described) {
  const joint = values.defaults?.joint
  if (joint?.outer && joint.middle) joint.outer.material = joint.middle.material
  const base = values.defaults?.link?.section
  for (const link of Object.values(values.links ?? {})) {
    if (link.section) link.section = { ...(base?.shape === 'flat' ? base : {}), ...link.section, shape: 'flat' }
  }
}

export function InputsForm(props: { projectId: string; calcId: string; calcType: CalcType; initial: Values; materials: readonly string[]; editable: boolean }) {
  const { projectId, calcId, calcType, initial, materials, editable } = props
  const router = useRouter()
  const [system, setSystem] = useState<UnitSystem>(initial.displayUnits === 'US' ? 'US' : 'SI')
  const allDefs = (kind: string) =>
    [geometryFields(calcType), STROKE_FIELDS, BASIS_FIELDS[kind] ?? [], FACTOR_FIELDS, PIN_FIELDS(materials), LINK_FIELDS(materials), OVERRIDE_FIELDS(calcType)].flat()
  const form = useForm<Values>({ defaultValues: convertInputs(initial, allDefs(initial.basis.kind), system, 'toDisplay') })
  const loads = useFieldArray({ control: form.control, name: 'loads' })
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [state, setState] = useState<ActionState>({})
  const [pending, startTransition] = useTransition()
  const basisKind = form.watch('basis.kind')

  const submit = form.handleSubmit((values) =>
    startTransition(async () => {
      // Stored and computed in SI; the person's unit system is kept as a preference.
      const payload: Values = { ...convertInputs(clean(values) as Values, allDefs(values.basis.kind), system, 'toSI'), displayUnits: system }
      completeDescriptions(payload as Described)
      const result = await saveInputsAction(projectId, calcId, payload)
      setErrors(result.fieldErrors ?? {})
      setState(result)
      if (result.ok) router.refresh()
    }),
  )

  const shown = allDefs(basisKind).map((d) => d.path)
  const switchUnits = (next: UnitSystem) => {
    const si = convertInputs(form.getValues(), allDefs(basisKind), system, 'toSI')
    form.reset(convertInputs(si, allDefs(basisKind), next, 'toDisplay'))
    setSystem(next)
  }
  // Messages for paths the editor has no field for (e.g. a joint described in the JSON) still show.
  const otherErrors = Object.entries(errors).filter(([path]) => path !== 'basis.kind' && !shown.includes(path) && !path.startsWith('loads'))
  const field = (def: InputFieldDef) => <InputField key={def.path} def={def} form={form} errors={errors} disabled={!editable} system={system} />
  return (
    <form onSubmit={submit} className="panel flex flex-col gap-4 p-4" noValidate data-testid="inputs-form">
      <div className="flex items-center justify-between">
        <h2 className="h2">Inputs</h2>
        <label className="ml-auto mr-3 flex items-center gap-1 text-xs text-ink/70">
          Units
          <select className="field w-auto py-0.5" value={system} onChange={(e) => switchUnits(e.target.value as UnitSystem)} aria-label="Units of the inputs">
            <option value="SI">SI (mm, N)</option>
            <option value="US">US (in, lbf)</option>
          </select>
        </label>
        {editable && (
          <button type="submit" className="btn" disabled={pending}>
            {pending ? 'Running…' : 'Save and run'}
          </button>
        )}
      </div>
      <FormMessage state={state} />
      <Group title="Geometry">{geometryFields(calcType).map(field)}</Group>
      <Group title="Stroke">{STROKE_FIELDS.map(field)}</Group>
      <fieldset className="flex flex-col gap-2 border-t border-rule pt-3">
        <legend className="h2 pr-2">Load cases at the tracer [{system === 'US' ? 'lbf' : 'N'}]</legend>
        {loads.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-[1fr_5rem_5rem_auto] items-start gap-2">
            {(['name', 'fx', 'fy'] as const).map((k) => {
              const path = `loads.${i}.${k}`
              const id = `in-${path.replace(/\./g, '-')}`
              return (
                <div key={k}>
                  <label htmlFor={id} className="sr-only">
                    Load case {i + 1} {k}
                  </label>
                  <input
                    id={id}
                    className="field"
                    disabled={!editable}
                    placeholder={k === 'name' ? 'Name' : k}
                    type={k === 'name' ? 'text' : 'number'}
                    step="any"
                    aria-invalid={errors[path] ? true : undefined}
                    {...form.register(path as Path<Values>, k === 'name' ? {} : { valueAsNumber: true })}
                  />
                  <FieldError id={`${id}-error`} message={errors[path]} />
                </div>
              )
            })}
            {editable && (
              <button type="button" className="btn-quiet" onClick={() => loads.remove(i)} aria-label={`Remove load case ${i + 1}`} disabled={loads.fields.length === 1}>
                ×
              </button>
            )}
          </div>
        ))}
        <FieldError message={errors.loads} />
        {editable && (
          <button type="button" className="btn-quiet self-start" onClick={() => loads.append({ name: `Case ${loads.fields.length + 1}`, fx: 0, fy: 0 })}>
            Add load case
          </button>
        )}
      </fieldset>
      <Group title="Design basis">
        {field({ path: 'basis.kind', label: 'Basis', options: BASIS_OPTIONS })}
        {(BASIS_FIELDS[basisKind] ?? []).map(field)}
        {FACTOR_FIELDS.map(field)}
      </Group>
      <Group title="Pins (every joint)">{PIN_FIELDS(materials).map(field)}</Group>
      <Group title="Links (every link)">{LINK_FIELDS(materials).map(field)}</Group>
      <details className="border-t border-rule pt-3" open={OVERRIDE_FIELDS(calcType).some((d) => errors[d.path])}>
        <summary className="h2 cursor-pointer">Per joint and link (overrides the above)</summary>
        <p className="mt-1 text-[11px] text-ink/50">Leave empty to use the values for every joint or link. A flat bar width needs its thickness too.</p>
        <div className="mt-2 grid grid-cols-2 gap-x-3 gap-y-2">{OVERRIDE_FIELDS(calcType).map(field)}</div>
      </details>
      {otherErrors.length > 0 && (
        <ul role="alert" className="rounded bg-fail-soft px-3 py-2 text-xs text-fail">
          {otherErrors.map(([path, message]) => (
            <li key={path}>
              <span className="font-mono">{path}</span>: {message}
            </li>
          ))}
        </ul>
      )}
    </form>
  )
}
