import type { Metadata } from 'next'
import { redirect } from 'next/navigation'
import { getCurrentUser } from '@/app/_lib/session'
import { SignInForm } from './sign-in-form'

export const metadata: Metadata = { title: 'Sign in' }

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ joined?: string }> }) {
  if (await getCurrentUser()) redirect('/projects')
  const { joined } = await searchParams
  return <SignInForm notice={joined ? 'The project was added to your account. Sign in with your password.' : undefined} />
}
