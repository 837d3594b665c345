/** Migrates the database and loads the demo scenario if it is empty: `npm run db:setup`. */
import { databaseUrl, openDb } from '@/db'
import { migrateDb } from '@/db/migrate'
import { seedDemo } from '@/db/seed/seed'

const { db, client } = openDb()
await migrateDb(db)
const seeded = await seedDemo(db)
console.log(`database ${databaseUrl()}: migrated${seeded ? ', demo seeded' : ', demo already present'}`)
client.close()
