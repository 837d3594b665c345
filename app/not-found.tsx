import Link from 'next/link'

export default function NotFound() {
  return (
    <div className="mx-auto max-w-lg px-6 pt-24 text-center" id="main">
      <p className="font-mono text-5xl text-accent">404</p>
      <h1 className="h1 mt-4">Nothing here</h1>
      <p className="mt-2 text-ink/80">The page, project or calc does not exist, or you are not a member of its project.</p>
      <Link href="/projects" className="btn mt-6">
        Back to projects
      </Link>
    </div>
  )
}
