import { apiRoute } from '@/app/_lib/api'
import { listNotices } from '@/server/notices'

/** The caller's in-app notices, newest first. */
export const GET = apiRoute(async ({ caller }) => ({
  items: (await listNotices(caller)).map((n) => ({ id: n.id, kind: n.kind, text: n.text, link: n.link, createdAt: n.createdAt.toISOString(), read: n.readAt !== null })),
}))
