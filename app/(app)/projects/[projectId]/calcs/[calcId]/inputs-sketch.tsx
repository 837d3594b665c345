'use client'

import { memo, useMemo } from 'react'
import { getMechanism } from '@/lib/mechanisms'
import { frameOf, jointsAt } from './mechanism-geometry'
import { MechanismSvg } from './mechanism-svg'

/** What each input means, per mechanism (the sketch beside it uses the same letters). */
const MEANING: Record<string, [term: string, meaning: string][]> = {
  peaucellier: [
    ['O', 'the pole, fixed to the frame; the arms turn about it'],
    ['l', 'arm length: O to the outer rhombus vertices A and B'],
    ['s', 'rhombus side: A and B to the driven vertex P and to the tracer T'],
    ['C, r', 'crank pivot and crank length: the crank CP drives P on a circle of radius r'],
    ['e', 'crank pivot offset |OC|; with e = r the crank circle passes through O and T runs on a straight line'],
    ['d', 'line offset k/(2r), with k = l² − s²: how far the line lies from O'],
  ],
  hart: [
    ['a, b', 'long links AE and BD (crossed), short links AD and BE: together a crossed four-bar (antiparallelogram)'],
    ['μ', 'ratio: the pole O, the driven point P and the tracer T sit at the same fraction μ along AD, AE and BD, measured from A and B (AO = μb, AP = μa, BT = μa). It sets k = μ(1 − μ)(a² − b²)'],
    ['C, r', 'crank pivot and crank length: the crank CP drives P on a circle of radius r'],
    ['e', 'crank pivot offset |OC|; with e = r T runs on a straight line'],
    ['d', 'line offset k/(2r): how far the line lies from O'],
  ],
}

/** A labelled sketch explaining every geometry input, drawn by the same code as the live drawing. */
export const InputsSketch = memo(function InputsSketch({ mechanism }: { mechanism: string }) {
  const frame = useMemo(() => {
    const def = getMechanism(mechanism)
    return frameOf(mechanism, def.defaultGeometry as Record<string, number>, 5)
  }, [mechanism])
  if (!frame) return null
  const joints = jointsAt(frame, Math.min(frame.usable[1], 35))
  return (
    <details className="border-t border-rule pt-2" data-testid="inputs-sketch">
      <summary className="cursor-pointer text-xs font-semibold text-ink/80">What the inputs mean (sketch)</summary>
      <div className="mt-2 grid gap-3 md:grid-cols-[minmax(0,16rem)_1fr]">
        <MechanismSvg mechanism={mechanism} frame={frame} joints={joints} forces={null} load={null} showValues={false} />
        <dl className="grid grid-cols-[3rem_1fr] gap-x-2 gap-y-1 text-xs">
          {(MEANING[mechanism] ?? []).map(([term, meaning]) => (
            <div key={term} className="contents">
              <dt className="font-semibold italic">{term}</dt>
              <dd>{meaning}</dd>
            </div>
          ))}
        </dl>
      </div>
    </details>
  )
})
