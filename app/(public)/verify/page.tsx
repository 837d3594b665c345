import type { Metadata } from 'next'
import { VerifyForm } from './verify-form'

export const metadata: Metadata = { title: 'Verify a package' }

export default function VerifyPage() {
  return (
    <div className="flex flex-col gap-4">
      <h1 className="h1">Verify a calc package</h1>
      <p className="text-ink/70">
        Upload the PDF you were given, or type the verification code printed in its issue block. You learn whether it is an issued package of this server, which calc and
        revision it is, whether it has since been superseded or voided, and whether the server’s signature verifies. A file changed by even one byte does not verify.
      </p>
      <VerifyForm />
    </div>
  )
}
