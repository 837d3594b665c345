/**
 * One command for a fresh machine: migrate, seed, start the fake mail server, build and start
 * the app on http://localhost:3000 with the embedded SQLite default.
 */
import { spawn, spawnSync } from 'node:child_process'
import { mailDir } from '@/lib/mail/inbox'
import { startFakeMailServer } from '@/lib/mail/fake-server'

const port = process.env.PORT || '3000'
const env = { ...process.env, INVERSO_MAIL_INBOX: 'on', APP_URL: process.env.APP_URL || `http://localhost:${port}` }

const run = (args: string[]) => {
  const r = spawnSync(process.execPath, args, { stdio: 'inherit', env })
  if (r.status !== 0) process.exit(r.status ?? 1)
}

run(['--import', 'tsx', 'scripts/setup-db.ts'])
await startFakeMailServer({ port: Number(process.env.SMTP_PORT || 2525), dir: mailDir() })
console.log('fake mail server listening on 127.0.0.1:2525')
if (process.env.SKIP_BUILD !== '1') {
  run(['scripts/build-reports.mjs'])
  run(['node_modules/next/dist/bin/next', 'build'])
}
const app = spawn(process.execPath, ['node_modules/next/dist/bin/next', 'start', '-p', port], { stdio: 'inherit', env })
console.log(`\nInverso: open http://localhost:${port} and sign in with a demo account (see README).\n`)
for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => app.kill(sig))
app.on('exit', (code) => process.exit(code ?? 0))
