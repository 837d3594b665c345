'use client'

import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react'
import { useFormStatus } from 'react-dom'
import type { ActionState } from '@/app/_lib/action'

interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  name: string
  label: string
  state: ActionState
  hint?: string
}

/** What every form control shares: its id, label, error state and the message beneath it. */
function fieldState(name: string, state: ActionState) {
  const id = `f-${name}`
  const error = state.fieldErrors?.[name]
  const control = {
    id,
    name,
    className: 'field',
    'aria-invalid': error ? true : undefined,
    'aria-describedby': error ? `${id}-error` : undefined,
  }
  return { id, error, control, value: state.values?.[name] }
}

function FieldShell({ id, label, error, hint, children }: { id: string; label: string; error?: string; hint?: string; children: ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      {children}
      {hint && !error && <p className="mt-1 text-xs text-ink/60">{hint}</p>}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  )
}

/** A labelled input that keeps what was typed and shows its own error beneath it. */
export function Field({ name, label, state, hint, defaultValue, ...rest }: FieldProps) {
  const f = fieldState(name, state)
  return (
    <FieldShell id={f.id} label={label} error={f.error} hint={hint}>
      <input {...f.control} defaultValue={f.value ?? defaultValue} {...rest} />
    </FieldShell>
  )
}

interface SelectFieldProps extends SelectHTMLAttributes<HTMLSelectElement> {
  name: string
  label: string
  state: ActionState
  options: readonly { value: string; label: string }[]
}

export function SelectField({ name, label, state, options, defaultValue, ...rest }: SelectFieldProps) {
  const f = fieldState(name, state)
  return (
    <FieldShell id={f.id} label={label} error={f.error}>
      <select {...f.control} defaultValue={f.value ?? defaultValue} {...rest}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  )
}

export function FieldError({ id, message }: { id?: string; message?: string }) {
  return (
    <p id={id} className="field-error" aria-live="polite">
      {message}
    </p>
  )
}

/** The form-level message: an error in red, a success note in teal. */
export function FormMessage({ state }: { state: ActionState }) {
  if (!state.message) return null
  return (
    <p role="alert" className={`rounded px-3 py-2 text-sm ${state.ok ? 'bg-accent-soft text-accent' : 'bg-fail-soft text-fail'}`}>
      {state.message}
    </p>
  )
}

export function SubmitButton({ children, quiet }: { children: ReactNode; quiet?: boolean }) {
  const { pending } = useFormStatus()
  return (
    <button type="submit" className={quiet ? 'btn-quiet' : 'btn'} disabled={pending}>
      {pending ? 'Working…' : children}
    </button>
  )
}
