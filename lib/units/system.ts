import { fromSI, toSI, type QuantityKind, type Unit } from './table'

/** Which family of units a person reads and writes; the checks always run in SI. */
export type UnitSystem = 'SI' | 'US'

type Kind = Exclude<QuantityKind, 'dimensionless'>

/**
 * Display unit per quantity kind. US customary uses lbf and ksi because pin
 * forces in linkages are small and material data sheets quote ksi.
 */
export const DISPLAY_UNITS: Record<UnitSystem, Record<Kind, Unit>> = {
  SI: { length: 'mm', area: 'mm²', force: 'N', moment: 'N·mm', stress: 'MPa', density: 'kg/m³' },
  US: { length: 'in', area: 'in²', force: 'lbf', moment: 'lbf·in', stress: 'ksi', density: 'lb/in³' },
}

export function displayUnit(system: UnitSystem, kind: Kind): Unit {
  return DISPLAY_UNITS[system][kind]
}

/** A value given in the display unit of `system` converted to SI-inside. */
export function inputToSI(value: number, system: UnitSystem, kind: Kind): number {
  return toSI(value, DISPLAY_UNITS[system][kind])
}

/** An SI-inside value converted to the display unit of `system`. */
export function outputFromSI(value: number, system: UnitSystem, kind: Kind): number {
  return fromSI(value, DISPLAY_UNITS[system][kind])
}

/** The kind of an SI-inside unit label as the results print it (`N`, `N·mm`, `MPa`, `mm`). */
export function kindOfSILabel(label: string): Kind | null {
  switch (label) {
    case 'mm':
      return 'length'
    case 'mm²':
      return 'area'
    case 'N':
      return 'force'
    case 'N·mm':
      return 'moment'
    case 'MPa':
      return 'stress'
    case 'kg/m³':
      return 'density'
    default:
      return null
  }
}
