import { redirect } from 'next/navigation'
import { getCurrentUser } from './_lib/session'

export default async function Home() {
  redirect((await getCurrentUser()) ? '/projects' : '/sign-in')
}
