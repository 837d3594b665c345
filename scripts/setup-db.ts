/** Migrates the database and loads the demo scenario if it is empty: `npm run db:setup`. */
import { databaseUrl, db } from '@/db'
import { migrateDb } from '@/db/migrate'
import { localFileStore } from '@/lib/storage'
import { finishPdf, renderBody } from '@/reports'
import { seedDemo } from '@/server/demo/seed'

await migrateDb(db)
const seeded = await seedDemo(db, { renderer: { renderBody, finishPdf }, store: localFileStore() })
console.log(`database ${databaseUrl()}: migrated${seeded ? ', demo seeded' : ', demo already present'}`)
process.exit(0)
