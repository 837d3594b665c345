import type { Metadata } from 'next'
import { publicKeyFingerprint, publicKeyPem } from '@/server/signing'

export const metadata: Metadata = { title: 'About signatures' }
export const dynamic = 'force-dynamic'

export default function AboutPage() {
  return (
    <div className="flex flex-col gap-4">
      <h1 className="h1">How Inverso signs a package</h1>
      <p>
        When a checker signs a revision as checked, an approver approves it or issues it, they confirm with their password, and this server signs a statement with its Ed25519
        key: the revision, the SHA-256 of its content (inputs and results), the action, the person and the time. The issued PDF carries a verification code; the public{' '}
        <a className="text-accent underline" href="/verify">
          verification page
        </a>{' '}
        tells anyone whether a PDF or code belongs to an issued revision and whether it is still current.
      </p>
      <h2 className="h2">This server’s public key</h2>
      <p className="text-sm">
        Fingerprint (SHA-256 of the key): <span className="font-mono">{publicKeyFingerprint()}</span>
      </p>
      <pre className="panel overflow-x-auto p-3 font-mono text-xs" data-testid="public-key">
        {publicKeyPem()}
      </pre>
      <p className="text-xs text-ink/70">A calculation here supports but does not replace the judgement of a competent engineer. Local codes and licensed practice govern.</p>
    </div>
  )
}
