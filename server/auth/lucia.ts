import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle'
import { Lucia } from 'lucia'
import { db } from '@/db'
import { sessions, users } from '@/db/schema'

/** All session handling lives behind this folder so lucia can be swapped later (it is no longer developed upstream). */
export const lucia = new Lucia(new DrizzleSQLiteAdapter(db, sessions, users), {
  sessionCookie: {
    name: 'inverso_session',
    attributes: { secure: (process.env.APP_URL ?? '').startsWith('https://') },
  },
  getUserAttributes: (attributes) => ({
    email: attributes.email,
    name: attributes.name,
    isAdmin: attributes.isAdmin,
  }),
})

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia
    DatabaseUserAttributes: { email: string; name: string; isAdmin: boolean }
  }
}

export type SessionUser = { id: string; email: string; name: string; isAdmin: boolean }
