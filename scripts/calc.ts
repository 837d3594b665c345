/**
 * `npm run calc -- input.json`: prints the calc result as JSON on stdout.
 * Kept thin on purpose: read, parse, run, print. Bad input exits 1 with one line.
 */
import { readFileSync } from 'node:fs'
import { ZodError } from 'zod'
import { formatZodError } from '@/lib/calc/format-zod-error'
import { mechanismInputSchema, runMechanism } from '@/lib/calc/mechanism'

function fail(message: string): never {
  process.stderr.write(`${message}\n`)
  process.exit(1)
}

const file = process.argv[2]
if (!file) fail('usage: npm run calc -- <input.json>')
let json: unknown
try {
  json = JSON.parse(readFileSync(file, 'utf8'))
} catch (e) {
  fail(`error: ${file}: ${e instanceof Error ? e.message.split('\n')[0] : 'cannot read'}`)
}
const parsed = mechanismInputSchema.safeParse(json)
if (!parsed.success) fail(formatZodError(parsed.error))
try {
  process.stdout.write(`${JSON.stringify(runMechanism(parsed.data), null, 2)}\n`)
} catch (e) {
  fail(e instanceof ZodError ? formatZodError(e) : `error: ${e instanceof Error ? e.message : String(e)}`)
}
