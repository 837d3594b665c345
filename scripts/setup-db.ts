/** Migrates the database and loads the demo scenario if it is empty: `npm run db:setup`. */
import { databaseUrl, db } from '@/db'
import { migrateDb } from '@/db/migrate'
import { demoRevisions } from '@/db/seed/demo-revisions'
import { seedDemo } from '@/db/seed/seed'
import { localFileStore } from '@/lib/storage'
import { renderPdf } from '@/reports'

await migrateDb(db)
const seeded = await seedDemo(db, demoRevisions({ renderer: { renderPdf }, store: localFileStore() }))
console.log(`database ${databaseUrl()}: migrated${seeded ? ', demo seeded' : ', demo already present'}`)
process.exit(0)
