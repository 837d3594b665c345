'use client'

import { SegmentError } from '@/app/_components/segment-error'

export default function CalcError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <SegmentError {...props} what="this calc" />
}
