/**
 * `npm run calc -- input.json`: prints the calc result as JSON on stdout.
 * An input with `mechanism` runs the linkage (and the pin/link checks when it has a `basis`);
 * one without checks a single component with its force given directly (docs/checks.md).
 * Bad input exits 1 with one line naming the field.
 */
import { readFileSync } from 'node:fs'
import { checksInUnits, runChecksCli } from '@/lib/checks'
import { calculate } from '@/lib/calc/run'

function fail(message: string): never {
  process.stderr.write(`${message}\n`)
  process.exit(1)
}

const firstError = (errors: Record<string, string> | { path: string; message: string }[]) => {
  const [path, message] = Array.isArray(errors) ? [errors[0]?.path, errors[0]?.message] : (Object.entries(errors)[0] ?? [])
  return `error: ${path || '(input)'}: ${message ?? 'invalid input'}`
}

const file = process.argv[2]
if (!file) fail('usage: npm run calc -- <input.json>')
let json: unknown
try {
  json = JSON.parse(readFileSync(file, 'utf8'))
} catch (e) {
  fail(`error: ${file}: ${e instanceof Error ? e.message.split('\n')[0] : 'cannot read'}`)
}

let output: unknown
if (typeof json === 'object' && json !== null && !('mechanism' in json)) {
  const r = runChecksCli(json)
  if (!r.ok) fail(firstError(r.issues))
  output = { units: r.units, ...r.result }
} else {
  const run = calculate(json)
  if (!run.ok) fail(firstError(run.fieldErrors))
  const units = run.input.checks?.units ?? 'SI'
  output = { ...run.result, checks: checksInUnits(run.result.checks, units) }
}
process.stdout.write(`${JSON.stringify(output, null, 2)}\n`)
