/** Starts the local fake SMTP server on its own: `npm run mail:fake`. */
import { mailDir } from '@/lib/mail/inbox'
import { startFakeMailServer } from '@/lib/mail/fake-server'

const port = Number(process.env.SMTP_PORT || 2525)
await startFakeMailServer({ port, dir: mailDir() })
console.log(`fake mail server on 127.0.0.1:${port}, keeping messages in ${mailDir()}`)
