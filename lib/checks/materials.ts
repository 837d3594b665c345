/**
 * Material library. Strengths are the specified minimum values of the product
 * standard, by thickness (plates, flats) or diameter (bars) band, because the
 * design codes read fy and fu from the product standard. Every value carries
 * its source; "from memory" marks values not checked against a copy of the
 * standard (verify before issuing a package). Values marked "checked against
 * a public reproduction" agree with the copies listed in the project's
 * material-sources notes (2026-12); confirm against the edition a customer uses.
 */

export type MaterialKind = 'steel' | 'aluminium'

export interface StrengthBand {
  /** Upper bound of the band, mm (inclusive); thickness for plates, diameter for bars. */
  upTo: number
  fy: number
  fu: number
}

export interface Material {
  id: string
  name: string
  kind: MaterialKind
  /** What the bands are indexed by. */
  bandBy: 'thickness' | 'diameter'
  bands: StrengthBand[]
  /** Young's modulus, MPa. */
  E: number
  /** kg/m³ */
  density: number
  sources: { strength: string; E: string; density: string }
  note?: string
}

const STEEL_E = 'EN 1993-1-1:2005 §3.2.6 (E = 210 000 MPa)'
const STEEL_RHO = 'EN 1991-1-1:2002 Table A.4 (77–78.5 kN/m³), 7850 kg/m³ — common practice'
const AL_E = 'EN 1999-1-1:2007 §3.2.5 (E = 70 000 MPa) — from memory'
const AL_RHO = 'EN 1999-1-1:2007 §3.2.5 (ρ = 2700 kg/m³) — from memory'

export const MATERIALS: Record<string, Material> = {
  S235: {
    id: 'S235',
    name: 'S235JR structural steel',
    kind: 'steel',
    bandBy: 'thickness',
    bands: [
      { upTo: 16, fy: 235, fu: 360 },
      { upTo: 40, fy: 225, fu: 360 },
      { upTo: 100, fy: 215, fu: 360 },
      { upTo: 150, fy: 195, fu: 350 },
    ],
    E: 210000,
    density: 7850,
    sources: {
      strength: 'EN 10025-2:2019 Table 7, minimum ReH and lower bound of Rm (checked against a public reproduction of the table)',
      E: STEEL_E,
      density: STEEL_RHO,
    },
  },
  S355: {
    id: 'S355',
    name: 'S355J2 structural steel',
    kind: 'steel',
    bandBy: 'thickness',
    bands: [
      { upTo: 16, fy: 355, fu: 470 },
      { upTo: 40, fy: 345, fu: 470 },
      { upTo: 63, fy: 335, fu: 470 },
      { upTo: 80, fy: 325, fu: 470 },
      { upTo: 100, fy: 315, fu: 470 },
      { upTo: 150, fy: 295, fu: 450 },
    ],
    E: 210000,
    density: 7850,
    sources: {
      strength: 'EN 10025-2:2019 Table 7, minimum ReH and lower bound of Rm (checked against a public reproduction of the table)',
      E: STEEL_E,
      density: STEEL_RHO,
    },
  },
  'C45+QT': {
    id: 'C45+QT',
    name: 'C45 quenched and tempered (+QT)',
    kind: 'steel',
    bandBy: 'diameter',
    bands: [
      { upTo: 16, fy: 490, fu: 700 },
      { upTo: 40, fy: 430, fu: 650 },
      { upTo: 100, fy: 370, fu: 630 },
    ],
    E: 210000,
    density: 7850,
    sources: {
      strength: 'EN ISO 683-1:2018 (formerly EN 10083-2), C45 +QT, minimum Re and Rm by diameter (checked against a steel maker’s data sheet)',
      E: STEEL_E,
      density: STEEL_RHO,
    },
  },
  'C45+N': {
    id: 'C45+N',
    name: 'C45 normalized (+N)',
    kind: 'steel',
    bandBy: 'diameter',
    bands: [
      { upTo: 16, fy: 340, fu: 620 },
      { upTo: 100, fy: 305, fu: 580 },
      { upTo: 250, fy: 275, fu: 560 },
    ],
    E: 210000,
    density: 7850,
    sources: {
      strength: 'EN ISO 683-1:2018 (formerly EN 10083-2), C45 +N, minimum Re and Rm by diameter (checked against a steel maker’s data sheet)',
      E: STEEL_E,
      density: STEEL_RHO,
    },
  },
  '42CrMo4+QT': {
    id: '42CrMo4+QT',
    name: '42CrMo4 quenched and tempered (+QT)',
    kind: 'steel',
    bandBy: 'diameter',
    bands: [
      { upTo: 16, fy: 900, fu: 1100 },
      { upTo: 40, fy: 750, fu: 1000 },
      { upTo: 100, fy: 650, fu: 900 },
      { upTo: 160, fy: 550, fu: 800 },
      { upTo: 250, fy: 500, fu: 750 },
    ],
    E: 210000,
    density: 7850,
    sources: {
      strength: 'EN ISO 683-2:2018 (formerly EN 10083-3), 42CrMo4 +QT, minimum Re and Rm by diameter (checked against steel makers’ data sheets)',
      E: STEEL_E,
      density: STEEL_RHO,
    },
    note: 'fy above 460 MPa is beyond the grades EN 1993-1-1 Table 3.1 lists; EN 1993-1-8 is used for pins of such steel in practice, but confirm with the national annex.',
  },
  A36: {
    id: 'A36',
    name: 'ASTM A36 structural steel',
    kind: 'steel',
    bandBy: 'thickness',
    bands: [{ upTo: 200, fy: 250, fu: 400 }],
    E: 200000,
    density: 7850,
    sources: {
      strength: 'ASTM A36/A36M: Fy 36 ksi (250 MPa), Fu 58 ksi (400 MPa), as the AISC Manual Table 2-4 lists them',
      E: 'AISC 360-16 Symbols: E = 29 000 ksi (200 000 MPa)',
      density: STEEL_RHO,
    },
  },
  'A572-50': {
    id: 'A572-50',
    name: 'ASTM A572 Grade 50',
    kind: 'steel',
    bandBy: 'thickness',
    bands: [{ upTo: 100, fy: 345, fu: 450 }],
    E: 200000,
    density: 7850,
    sources: {
      strength: 'ASTM A572/A572M Grade 50: Fy 50 ksi (345 MPa), Fu 65 ksi (450 MPa), as the AISC Manual Table 2-4 lists them',
      E: 'AISC 360-16 Symbols: E = 29 000 ksi (200 000 MPa)',
      density: STEEL_RHO,
    },
  },
  '6061-T6': {
    id: '6061-T6',
    name: 'EN AW-6061 T6 extruded bar',
    kind: 'aluminium',
    bandBy: 'thickness',
    bands: [{ upTo: 20, fy: 240, fu: 260 }],
    E: 70000,
    density: 2700,
    sources: {
      strength: 'EN 1999-1-1:2007 Table 3.2b, EN AW-6061 T6 extrusions t ≤ 20 mm, f0 and fu (checked against a public reproduction of the table)',
      E: AL_E,
      density: AL_RHO,
    },
    note: 'Heat-affected zones near welds lose much of this strength (EN 1999-1-1 §6.1.6); the checks assume no welds.',
  },
  '6082-T6': {
    id: '6082-T6',
    name: 'EN AW-6082 T6 extruded bar',
    kind: 'aluminium',
    bandBy: 'thickness',
    bands: [
      { upTo: 20, fy: 250, fu: 295 },
      { upTo: 150, fy: 260, fu: 310 },
    ],
    E: 70000,
    density: 2700,
    sources: {
      strength: 'EN 1999-1-1:2007 Table 3.2b, EN AW-6082 T6 extruded bars EP/R (EN 755-2 values), f0 and fu — from memory',
      E: AL_E,
      density: AL_RHO,
    },
    note: 'Heat-affected zones near welds lose much of this strength (EN 1999-1-1 §6.1.6); the checks assume no welds.',
  },
}

export interface BandResult {
  fy: number
  fu: number
  /** Human-readable band used, e.g. `t ≤ 16 mm`. */
  band: string
  /** Set when the size is beyond the largest band and the last band was used. */
  beyond: boolean
}

/** fy and fu for a given thickness or diameter; the band is named so a reviewer can see which row was read. */
export function strengthFor(m: Material, size: number): BandResult {
  const sym = m.bandBy === 'thickness' ? 't' : 'd'
  let lower = 0
  for (const b of m.bands) {
    if (!Number.isFinite(b.upTo)) return { fy: b.fy, fu: b.fu, band: 'all sizes', beyond: false }
    if (size <= b.upTo) {
      const band = lower === 0 ? `${sym} ≤ ${b.upTo} mm` : `${lower} < ${sym} ≤ ${b.upTo} mm`
      return { fy: b.fy, fu: b.fu, band, beyond: false }
    }
    lower = b.upTo
  }
  const last = m.bands[m.bands.length - 1]
  return { fy: last.fy, fu: last.fu, band: `${sym} > ${lower} mm (outside the standard's bands; last band used)`, beyond: true }
}
