import type { Metadata } from 'next'
import { findToken } from '@/server/auth/invitations'
import { AppError } from '@/lib/errors'
import { TokenProblem } from '../../token-problem'
import { NewPasswordForm } from './new-password-form'

export const metadata: Metadata = { title: 'Choose a new password' }

export default async function ResetTokenPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params
  try {
    await findToken(token, 'reset')
    return <NewPasswordForm token={token} />
  } catch (err) {
    if (err instanceof AppError) return <TokenProblem message={err.message} />
    throw err
  }
}
