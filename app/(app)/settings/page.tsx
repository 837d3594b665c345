import type { Metadata } from 'next'
import { requirePageUser } from '@/app/_lib/session'
import { listApiTokens } from '@/server/auth/api-tokens'
import { CreateTokenForm, RevokeTokenForm } from './token-forms'

export const metadata: Metadata = { title: 'Settings' }

const when = (d: Date | null) => (d ? d.toISOString().slice(0, 16).replace('T', ' ') : '—')

export default async function SettingsPage() {
  const user = await requirePageUser()
  const tokens = await listApiTokens(user)
  return (
    <div className="flex max-w-3xl flex-col gap-5">
      <h1 className="h1">Settings</h1>
      <section className="flex flex-col gap-3">
        <h2 className="h2">API tokens</h2>
        <p className="text-sm text-ink/70">
          A token lets a script call the API (<code>/api/v1</code>, see <a className="text-accent underline" href="/api/v1/openapi.json">the OpenAPI document</a>) as you, with
          your roles and never more. Send it as <code>Authorization: Bearer …</code>. Signing steps still ask for your password.
        </p>
        <CreateTokenForm />
        <table className="w-full text-sm" data-testid="tokens">
          <thead>
            <tr className="border-b border-rule text-left text-xs text-ink/70">
              <th className="py-1">Name</th>
              <th>Starts with</th>
              <th>Created</th>
              <th>Last used</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {tokens.length === 0 && (
              <tr>
                <td colSpan={5} className="py-2 text-ink/70">
                  No tokens yet.
                </td>
              </tr>
            )}
            {tokens.map((t) => (
              <tr key={t.id} className="border-b border-rule">
                <td className="py-1.5">{t.name}</td>
                <td className="font-mono">{t.prefix}…</td>
                <td>{when(t.createdAt)}</td>
                <td>{when(t.lastUsedAt)}</td>
                <td className="text-right">{t.revokedAt ? <span className="text-ink/70">revoked {when(t.revokedAt)}</span> : <RevokeTokenForm tokenId={t.id} name={t.name} />}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  )
}
