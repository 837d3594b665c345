import type { Metadata } from 'next'
import { findToken, invitationForActiveAccount } from '@/server/auth/invitations'
import { AppError } from '@/lib/errors'
import { TokenProblem } from '../../token-problem'
import { AcceptForm, JoinForm } from './accept-form'

export const metadata: Metadata = { title: 'Accept invitation' }

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params
  try {
    const row = await findToken(token, 'invite')
    // An address that already has an active account keeps its name and password: the invitation only adds the project.
    if (await invitationForActiveAccount(row)) return <JoinForm token={token} email={row.email} />
    return <AcceptForm token={token} email={row.email} />
  } catch (err) {
    if (err instanceof AppError) return <TokenProblem message={err.message} />
    throw err
  }
}
