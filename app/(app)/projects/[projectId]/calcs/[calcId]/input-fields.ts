import { getMechanism, mechanismComponents, type MechanismId as CalcType } from '@/lib/mechanisms'

export interface InputFieldDef {
  path: string
  label: string
  unit?: string
  hint?: string
  step?: string
  options?: readonly { value: string; label: string }[]
}

/** The editor's geometry fields, as the mechanism declares them (lib/mechanisms). */
export function geometryFields(calcType: CalcType): InputFieldDef[] {
  return getMechanism(calcType).fields.map((f) => ({ path: `geometry.${f.key}`, label: f.label, unit: f.unit, hint: f.hint, step: f.step }))
}

export const STROKE_FIELDS: InputFieldDef[] = [
  { path: 'requiredStroke', label: 'Stroke needed', unit: 'mm', hint: 'full travel along the line; sets the working range unless end stops are given' },
  { path: 'workingRange.fromDeg', label: 'End stop from', unit: '°', hint: 'crank angle of one end of the working range (optional)' },
  { path: 'workingRange.toDeg', label: 'End stop to', unit: '°', hint: 'crank angle of the other end' },
  { path: 'toggleMarginDeg', label: 'Margin from toggle', unit: '°', hint: 'crank angle kept away from each locked position' },
  { path: 'minTransmissionAngleDeg', label: 'Smallest transmission angle', unit: '°', step: '1', hint: 'checked over the working range; 30° is common practice' },
  { path: 'straightnessTolerance', label: 'Straightness tolerance', unit: 'mm', step: '0.01', hint: 'largest deviation from the line over the working range' },
]

export const BASIS_OPTIONS = [
  { value: 'en1993', label: 'EN 1993-1-8 §3.13 / EN 1993-1-1' },
  { value: 'aisc360', label: 'AISC 360-16 §D5, §J7' },
  { value: 'allowable', label: 'Allowable stress (factor of safety)' },
] as const

export const BASIS_FIELDS: Record<string, InputFieldDef[]> = {
  en1993: [
    { path: 'basis.gammaM0', label: 'γM0', step: '0.01' },
    { path: 'basis.gammaM1', label: 'γM1', step: '0.01' },
    { path: 'basis.gammaM2', label: 'γM2', step: '0.01' },
    { path: 'basis.gammaM6ser', label: 'γM6,ser', step: '0.01' },
  ],
  aisc360: [{ path: 'basis.method', label: 'Method', options: [{ value: 'LRFD', label: 'LRFD' }, { value: 'ASD', label: 'ASD' }] }],
  allowable: [{ path: 'basis.factorOfSafety', label: 'Factor of safety', step: '0.1' }],
}

export const FACTOR_FIELDS: InputFieldDef[] = [
  { path: 'factors.load', label: 'Load factor', step: '0.05' },
  { path: 'factors.dynamic', label: 'Dynamic factor', step: '0.05' },
]

export function materialOptions(ids: readonly string[]) {
  return ids.map((id) => ({ value: id, label: id }))
}

export const PIN_FIELDS = (materials: readonly string[]): InputFieldDef[] => [
  { path: 'defaults.joint.pinDiameter', label: 'Pin diameter d', unit: 'mm', step: '0.1' },
  { path: 'defaults.joint.holeDiameter', label: 'Hole diameter d₀', unit: 'mm', step: '0.1' },
  { path: 'defaults.joint.pinMaterial', label: 'Pin material', options: materialOptions(materials) },
  {
    path: 'defaults.joint.arrangement',
    label: 'Arrangement',
    options: [
      { value: 'double', label: 'Double shear (fork)' },
      { value: 'single', label: 'Single shear (lapped)' },
    ],
  },
  { path: 'defaults.joint.middle.thickness', label: 'Middle plate t', unit: 'mm', step: '0.1' },
  { path: 'defaults.joint.outer.thickness', label: 'Outer plates t', unit: 'mm', step: '0.1' },
  { path: 'defaults.joint.gap', label: 'Gap c', unit: 'mm', step: '0.1' },
  { path: 'defaults.joint.middle.material', label: 'Plate material', options: materialOptions(materials) },
]

export const LINK_FIELDS = (materials: readonly string[]): InputFieldDef[] => [
  { path: 'defaults.link.section.width', label: 'Flat bar width', unit: 'mm', step: '0.5' },
  { path: 'defaults.link.section.thickness', label: 'Flat bar thickness', unit: 'mm', step: '0.5' },
  { path: 'defaults.link.material', label: 'Link material', options: materialOptions(materials) },
  { path: 'defaults.link.eye.edgeAlong', label: 'Eye end distance a', unit: 'mm', step: '0.5', hint: 'hole edge to the link end, along the link' },
]

/** Optional: the links' own weight, added to every load case. */
export const SELF_WEIGHT_FIELDS: InputFieldDef[] = [
  { path: 'selfWeight.density', label: 'Density ρ', unit: 'kg/m³', step: '10', hint: 'steel 7850; leave empty to leave weight out' },
  { path: 'selfWeight.area', label: 'Link section A', unit: 'mm²', step: '1' },
]

/** Optional: the crank's speed and the tool's mass, for the forces at speed (a case at speed beside each load case). */
export const OPERATING_SPEED_FIELDS: InputFieldDef[] = [
  { path: 'operatingSpeed.rpm', label: 'Crank speed n', unit: 'rev/min', step: '1', hint: 'constant; leave empty for static forces only' },
  { path: 'operatingSpeed.toolMass', label: 'Tool mass at T', unit: 'kg', step: '0.1', hint: 'tool and carriage; their weight belongs in the load cases' },
]

/** Optional: the straightness of the built guide under link tolerances and pin clearance. */
export const TOLERANCE_FIELDS: InputFieldDef[] = [
  {
    path: 'tolerances.toleranceClass',
    label: 'Tolerance class',
    hint: 'ISO 2768-1 general tolerances of the link lengths; the pin clearance comes from the pins',
    options: [
      { value: '', label: 'not analysed' },
      { value: 'f', label: 'f (fine)' },
      { value: 'm', label: 'm (medium)' },
      { value: 'c', label: 'c (coarse)' },
      { value: 'v', label: 'v (very coarse)' },
    ],
  },
  { path: 'tolerances.samples', label: 'Monte Carlo samples', step: '100', hint: 'with a class: 0 for the worst case only, at most 20 000 (default 2000)' },
]

/** Only the sizes an engineer typically changes per component; anything else stays on the defaults. */
export const OVERRIDE_FIELDS = (calcType: CalcType): InputFieldDef[] => {
  const { joints, links } = mechanismComponents(calcType)
  return [
    ...joints.flatMap((j) => [
      { path: `joints.${j}.pinDiameter`, label: `${j}: pin d`, unit: 'mm', step: '0.1' },
      { path: `joints.${j}.holeDiameter`, label: `${j}: hole d₀`, unit: 'mm', step: '0.1' },
    ]),
    ...links.flatMap((l) => [
      { path: `links.${l}.section.width`, label: `${l}: width`, unit: 'mm', step: '0.5' },
      { path: `links.${l}.section.thickness`, label: `${l}: thickness`, unit: 'mm', step: '0.5' },
      { path: `links.${l}.eye.edgeAlong`, label: `${l}: eye end distance a`, unit: 'mm', step: '0.5' },
      { path: `tolerances.lengths.${l}`, label: `${l}: length tolerance ±`, unit: 'mm', step: '0.01', hint: 'overrides the tolerance class' },
    ]),
  ]
}
