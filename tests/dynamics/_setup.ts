import { peaucellierCell } from '@/lib/linkage/cells/peaucellier'
import { hartCell } from '@/lib/linkage/cells/hart'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { bodyFromSection, type LinkBody } from '@/lib/dynamics'

/** The registry's default geometries (lib/mechanisms): e = r, so the tracer runs on x = k/(2r). */
export const CELLS: Record<string, () => { cell: InversorCell; crank: number; offset: number; range: [number, number] }> = {
  // Ring 150 … √52500: 200 cos(θ/2) ≥ 150 for |θ| ≤ 82.8°.
  peaucellier: () => ({ cell: peaucellierCell({ arm: 250, side: 100 }), crank: 100, offset: 100, range: [-70, 70] }),
  // Ring 42 … 102: 80 cos(θ/2) ≥ 42 for |θ| ≤ 116.7°.
  hart: () => ({ cell: hartCell({ long: 240, short: 100, ratio: 0.3 }), crank: 40, offset: 40, range: [-100, 100] }),
}

/** Every link of the cell plus the crank, a 20 × 5 mm steel flat (7850 kg/m³). */
export function steelFlats(cell: InversorCell): Record<string, LinkBody> {
  const out: Record<string, LinkBody> = {}
  for (const l of [...cell.links.map((x) => x.name), 'CP']) out[l] = bodyFromSection({ shape: 'flat', width: 20, thickness: 5 }, 7850, 'steel, common practice')
  return out
}

export const sweep = (lo: number, hi: number, n: number) => Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1))
