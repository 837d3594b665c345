/** Pin and link checks: public entry. Pure TypeScript, SI inside (mm, N, N·mm, MPa). */
export {
  checksInputSchema,
  basisSchema,
  factorsSchema,
  materialSchema,
  jointSchema,
  linkSchema,
  sectionSchema,
  eyeSchema,
  plateSchema,
  strengthBandSchema,
} from './schema'
export type { ChecksInput, ChecksInputRaw, JointInput, LinkInput, SectionInput, MaterialInput, Basis, Factors } from './schema'
export { runChecks, checkComponent, basisImpl } from './run'
export type { ChecksResult, ComponentTarget } from './run'
export { MATERIALS, strengthFor } from './materials'
export type { Material, StrengthBand } from './materials'
export { validateChecksInput, parseChecksInput, resolveAll, ChecksInputError } from './validate'
export type { FieldIssue, MechanismNames } from './validate'
export { checksInputToSI } from './to-si'
export { runChecksCli, checksInUnits, singleComponentSchema, componentSchema } from './cli'
export type { CliResult } from './cli'
export { GENERAL_CAUTION } from './cautions'
export { johnsonEuler, enChi, aiscFcr, IMPERFECTION } from './buckling'
export { sectionProps, pinProps } from './sections'
