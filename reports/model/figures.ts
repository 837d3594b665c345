/** Figure scenes and captions, shared by both renderings. */
import { reportPartsOf } from '../mechanisms'
import type { ReportContext } from './context'
import { mechanismScene, type DiagramAt } from './diagram'
import { histogramScene } from './histogram'
import { PLOT_TITLE, plotScene, type PlotKind } from './plots'
import type { Scene } from './scene'
import { CHART_ALL_UP_TO, utilisationScene } from './utilisation'

export interface FigureView {
  scene: Scene
  label: string
  caption: string
}

/** Null when the figure has no data or its section is left out; the caller then draws nothing. */
function label(ctx: ReportContext, ordinal?: string): string | null {
  if (ordinal === undefined) return 'Figure'
  const n = ctx.numbering.figure[Number(ordinal)]
  return n ? `Figure ${n}` : null
}

export function diagramFigure(ctx: ReportContext, at: string | undefined, caption: string | undefined, ordinal?: string): FigureView | null {
  const name = label(ctx, ordinal)
  if (!name) return null
  const picks = (at ?? 'start,middle,end').split(',').map((x) => x.trim()).filter((x): x is DiagramAt => x === 'start' || x === 'middle' || x === 'end')
  const draw = reportPartsOf(ctx.pkg.calc.type).diagram ?? mechanismScene
  const scene = draw(ctx.pkg.result, picks.length ? picks : ['middle'], ctx.figureWidth)
  if (!scene) return null
  return { scene, label: name, caption: caption ?? 'The mechanism at the start, middle and end of the working range, drawn to scale with its dimensions and the loads of the first load case at T. Dashed: the line x = x_T; thin: the tracer over the full range to the locked positions; thick: over the working range.' }
}

export function plotFigure(ctx: ReportContext, kind: string, caption: string | undefined, ordinal?: string): FigureView | null {
  const name = label(ctx, ordinal)
  if (!name) return null
  if (kind === 'tolerance') {
    const scene = histogramScene(ctx.pkg.result, ctx.figureWidth)
    return scene ? { scene, label: name, caption: caption ?? 'Straightness deviation of the built mechanisms in the Monte Carlo run (tolerances and pin clearance); dashed: the straightness tolerance.' } : null
  }
  if (kind !== 'links' && kind !== 'pins' && kind !== 'torque' && kind !== 'kinematics') return null
  const scene = plotScene(ctx.pkg.result, kind as PlotKind, ctx.figureWidth, ctx.units)
  if (!scene) return null
  return { scene, label: name, caption: caption ?? PLOT_TITLE[kind as PlotKind] }
}

export function utilisationFigure(ctx: ReportContext, caption: string | undefined, ordinal?: string): FigureView | null {
  const name = label(ctx, ordinal)
  if (!name) return null
  const scene = utilisationScene(ctx.pkg.result.checks ?? [], ctx.figureWidth, ctx.numberOf)
  if (!scene) return null
  const checks = ctx.pkg.result.checks ?? []
  const what = checks.length > CHART_ALL_UP_TO ? 'the governing check of each component' : 'every component check'
  return { scene, label: name, caption: caption ?? `Utilisation of ${what}; numbers are step numbers.` }
}
