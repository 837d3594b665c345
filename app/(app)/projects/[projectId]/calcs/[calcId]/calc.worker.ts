/// <reference lib="webworker" />
/**
 * The bench's calc off the page's thread: the same benchCalculate the server runs, with the Monte
 * Carlo run's progress reported as it goes. The page ends a run it no longer needs (new inputs, or
 * Cancel) by terminating the worker.
 */
import { benchCalculate } from '@/lib/bench/validate'

export type CalcRequest = { id: number; payload: unknown }
export type CalcReply = { id: number; progress: number } | { id: number; outcome: ReturnType<typeof benchCalculate> }

const scope = self as unknown as DedicatedWorkerGlobalScope

scope.onmessage = (e: MessageEvent<CalcRequest>) => {
  const { id, payload } = e.data
  const outcome = benchCalculate(payload, { onProgress: (done, total) => scope.postMessage({ id, progress: done / total } satisfies CalcReply) })
  scope.postMessage({ id, outcome } satisfies CalcReply)
}
