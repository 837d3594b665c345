import Link from 'next/link'

export function TokenProblem({ message }: { message: string }) {
  return (
    <div className="flex flex-col gap-3">
      <h1 className="h1">This link cannot be used</h1>
      <p role="alert" className="rounded bg-fail-soft px-3 py-2 text-fail">
        {message}
      </p>
      <Link href="/sign-in" className="text-accent underline">
        Go to sign-in
      </Link>
    </div>
  )
}
