/**
 * `npm run calc -- input.json`: prints the calc result as JSON on stdout.
 * An input with `mechanism` runs the linkage (and the pin/link checks when it has a `basis`);
 * one without checks a single component with its force given directly (docs/checks.md).
 * Bad input exits 1 with one line naming the field.
 */
import { readFileSync } from 'node:fs'
import { analyse } from '@/lib/analyse'

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

// The same function as POST /api/v1/analyse: ranges, schema and rules first, so a bad field is one line.
let out: ReturnType<typeof analyse>
try {
  out = analyse(json)
} catch (e) {
  // Not expected (tests/security/input-bounds.test.ts); still one line, never a stack trace.
  fail(`error: (input): could not be calculated (${e instanceof Error ? e.message.split('\n')[0] : String(e)})`)
}
if (!out.ok) {
  const [path, message] = Object.entries(out.fieldErrors)[0] ?? []
  fail(`error: ${path && path !== '_form' ? path : '(input)'}: ${message ?? 'invalid input'}`)
}
process.stdout.write(`${JSON.stringify(out.output, null, 2)}\n`)
