/**
 * `npm run size -- input.json`: the sizing assistant on the command line. Prints the proposals as
 * JSON on stdout (the same answer as `POST /api/v1/size`); bad input exits 1 with one line naming
 * the field. Input keys: lib/sizing/schema.ts (example: examples/sizing.json).
 */
import { readFileSync } from 'node:fs'
import { sizeMechanism, sizingInputSchema } from '@/lib/sizing'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'

function fail(message: string): never {
  process.stderr.write(`${message}\n`)
  process.exit(1)
}

const file = process.argv[2]
if (!file) fail('usage: npm run size -- <input.json>')
let json: unknown
try {
  json = JSON.parse(readFileSync(file, 'utf8'))
} catch (e) {
  fail(`error: ${file}: ${e instanceof Error ? e.message.split('\n')[0] : 'cannot read'}`)
}
const parsed = sizingInputSchema.safeParse(json)
if (!parsed.success) {
  const [path, message] = Object.entries(fieldErrorsOf(parsed.error))[0]
  fail(`error: ${path}: ${message}`)
}
process.stdout.write(`${JSON.stringify(sizeMechanism(parsed.data), null, 2)}\n`)
