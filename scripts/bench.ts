/**
 * `npm run bench`: runs the default export of every scripts/bench/*.ts module,
 * in file-name order. Each module prints its own figures.
 */
import { readdirSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'

const dir = join(dirname(fileURLToPath(import.meta.url)), 'bench')
const files = readdirSync(dir).filter((f) => f.endsWith('.ts')).sort()
for (const f of files) {
  const mod = (await import(pathToFileURL(join(dir, f)).href)) as { default?: () => unknown }
  if (typeof mod.default !== 'function') continue
  console.log(`# ${f}`)
  await mod.default()
}
