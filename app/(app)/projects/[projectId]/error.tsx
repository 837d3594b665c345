'use client'

import { SegmentError } from '@/app/_components/segment-error'

export default function ProjectError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <SegmentError {...props} what="this project" />
}
