import type { Metadata } from 'next'
import { redirect } from 'next/navigation'
import { getCurrentUser } from '@/app/_lib/session'
import { SignInForm } from './sign-in-form'

export const metadata: Metadata = { title: 'Sign in' }

export default async function SignInPage() {
  if (await getCurrentUser()) redirect('/projects')
  return <SignInForm />
}
