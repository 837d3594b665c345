export { UNITS, toSI, fromSI, convert, isUnit, kindOf } from './table'
export type { Unit, QuantityKind } from './table'
export { DISPLAY_UNITS, displayUnit, inputToSI, outputFromSI, kindOfSILabel } from './system'
export type { UnitSystem } from './system'
