import type { Metadata } from 'next'
import { findToken } from '@/server/auth/invitations'
import { AppError } from '@/lib/errors'
import { TokenProblem } from '../../token-problem'
import { AcceptForm } from './accept-form'

export const metadata: Metadata = { title: 'Accept invitation' }

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params
  try {
    const row = await findToken(token, 'invite')
    return <AcceptForm token={token} email={row.email} />
  } catch (err) {
    if (err instanceof AppError) return <TokenProblem message={err.message} />
    throw err
  }
}
