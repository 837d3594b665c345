import type { Table } from '@/lib/contract'
import { caseSlugs, type ReportContext } from './context'

/** One sweep table per load case: crank angle, tracer, torque, every link's axial force. */
export function sweepTables(ctx: ReportContext): Table[] {
  const sweep = ctx.sweep
  if (!sweep) return []
  const slugs = caseSlugs(sweep.cases.map((c) => c.name))
  const linkNames = sweep.model.links.map((l) => l.name)
  // Built once: a template string per cell of a thousand-row table showed in profiles.
  const linkKeys = linkNames.map((n) => `N_${n}`)
  return sweep.cases.map((c, i) => ({
    id: `tab.sweep.${slugs[i]}`,
    section: 'statics',
    title: `Sweep, case “${c.name}”`,
    columns: [
      { key: 'crankDeg', label: 'Crank angle θ', unit: '°', digits: 2 },
      { key: 'tracerX', label: 'Tracer x', unit: 'mm', digits: 3 },
      { key: 'tracerY', label: 'Tracer y', unit: 'mm', digits: 3 },
      { key: 'driveTorque', label: 'Drive torque τ', unit: 'N·mm', digits: 1 },
      { key: 'transmissionDeg', label: 'Transmission angle', unit: '°', digits: 1 },
      ...linkNames.map((n, k) => ({ key: linkKeys[k], label: `N ${n}`, unit: 'N', digits: 1 })),
    ],
    rows: c.samples.map(({ position: p }) => {
      const row: Record<string, number> = {
        crankDeg: p.crankDeg,
        tracerX: p.tracer.x,
        tracerY: p.tracer.y,
        driveTorque: p.driveTorque,
        transmissionDeg: p.transmissionAngleDeg ?? 90,
      }
      // Round-off in a link that carries no axial force (1e-13 N in a bending crank) is shown as 0, as the envelope does.
      const noise = 1e-9 * Math.max(1, ...Object.values(p.pinForces).map((f) => f.magnitude))
      for (let k = 0; k < linkNames.length; k++) {
        const v = p.linkForces[linkNames[k]]
        row[linkKeys[k]] = Math.abs(v) < noise ? 0 : v
      }
      return row
    }),
  }))
}
