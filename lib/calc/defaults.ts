import { getMechanism, type MechanismId } from '@/lib/mechanisms'

/** A 10 mm C45 pin in double shear through S355 plates: a common first choice for light cells. */
export const DEFAULT_PIN = {
  pinDiameter: 10,
  holeDiameter: 10.5,
  pinMaterial: 'C45+QT',
  arrangement: 'double',
  middle: { thickness: 8, material: 'S355' },
  outer: { thickness: 5, material: 'S355' },
  gap: 1,
} as const

export const DEFAULT_LINK = { section: { shape: 'flat', width: 25, thickness: 8 }, material: 'S355', eye: { edgeAlong: 16 } } as const

/**
 * Starting inputs for a new calc: a feasible cell with one load case and a complete pin and link
 * description, so the first run gives a full package. The engineer changes what differs.
 */
export function defaultCalcInputs(mechanism: MechanismId): Record<string, unknown> {
  return {
    mechanism,
    geometry: { ...getMechanism(mechanism).defaultGeometry },
    loads: [{ name: 'Working load', fx: 0, fy: -150 }],
    toggleMarginDeg: 5,
    basis: { kind: 'en1993', gammaM0: 1.0, gammaM1: 1.0, gammaM2: 1.25, gammaM6ser: 1.0 },
    factors: { load: 1.5, dynamic: 1.2 },
    defaults: { joint: DEFAULT_PIN, link: DEFAULT_LINK },
  }
}
