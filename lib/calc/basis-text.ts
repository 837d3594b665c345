/**
 * The design basis, assumptions and references of a calc in words, generated from its own inputs
 * and results: the package prints these instead of fixed template prose, so the text cannot
 * contradict the numbers (a partial-factor format under an allowable-stress basis, an operating speed
 * never stated, a margin called generous that is not).
 */
import type { BasisText, MaterialUse, MechanismResult } from '@/lib/contract'
import { formatNumber as n } from '@/lib/units/format'
import type { ChecksInput } from '@/lib/checks'
import type { AnyMechanismInput } from './mechanism'

/** The two halves of a calc input (lib/calc/run's CalcInput, named here to keep the import one-way). */
interface CalcInput {
  mechanism: AnyMechanismInput
  checks: ChecksInput | null
}

const REF = {
  en18: 'EN 1993-1-8:2005, Eurocode 3: Design of steel structures — Part 1-8: Design of joints, §3.13 (pin connections).',
  en11: 'EN 1993-1-1:2005, Eurocode 3: Design of steel structures — Part 1-1: General rules, §6.2 (resistance of cross-sections) and §6.3 (buckling).',
  aisc: 'ANSI/AISC 360-16, Specification for Structural Steel Buildings: §D2, §D5 (pin-connected members), §E3, §F11, §H1, §J7.',
  shigley: "R. G. Budynas, J. K. Nisbett: Shigley's Mechanical Engineering Design — columns (Euler, Johnson) and the distortion-energy theory.",
  en10025: 'EN 10025-2:2019, Hot rolled products of structural steels — non-alloy structural steels, Table 7.',
  iso6831: 'EN ISO 683-1:2018, Heat-treatable steels — non-alloy steels (formerly EN 10083-2).',
  iso6832: 'EN ISO 683-2:2018, Heat-treatable steels — alloy steels (formerly EN 10083-3).',
  astm: 'ASTM A36/A36M and ASTM A572/A572M, as listed in the AISC Steel Construction Manual, Table 2-4.',
  en1999: 'EN 1999-1-1:2007, Eurocode 9: Design of aluminium structures — General rules, Table 3.2b.',
}

function materialRefs(materials: MaterialUse[]): string[] {
  const ids = new Set(materials.map((m) => m.id))
  const out: string[] = []
  if ([...ids].some((i) => /^S\d{3}/.test(i))) out.push(REF.en10025)
  if ([...ids].some((i) => i.startsWith('C45'))) out.push(REF.iso6831)
  if ([...ids].some((i) => i.startsWith('42CrMo4'))) out.push(REF.iso6832)
  if ([...ids].some((i) => i.startsWith('A36') || i.startsWith('A572'))) out.push(REF.astm)
  if ([...ids].some((i) => i.startsWith('60'))) out.push(REF.en1999)
  return out
}

export function basisText(input: CalcInput, mech: MechanismResult, materials: MaterialUse[] = []): BasisText {
  const m = input.mechanism
  const c = input.checks
  const statements: string[] = []
  const assumptions: string[] = []
  const references: string[] = []
  let label = 'kinematics and forces only (no component checks requested)'

  statements.push('Geometry and statics are solved in the plane, for rigid links on frictionless pins; every link force comes from the equilibrium of every body at every solved position, cross-checked by virtual work.')
  const loads = m.loads.map((l) => `“${l.name}” (F_x = ${n(l.fx)} N, F_y = ${n(l.fy)} N)`).join(', ')
  statements.push(`Loads act at the tracer T as the inputs give them: ${loads}.${m.selfWeight ? ` The links' self-weight (${n(m.selfWeight.density)} kg/m³ over ${n(m.selfWeight.area)} mm²) is added to every load case.` : ' Self-weight of the links is not included.'}`)
  const dyn = c?.factors.dynamic ?? 1
  const speed = m.operatingSpeed
  statements.push(
    speed
      ? `The crank turns at a constant ${n(speed.rpm)} rev/min${speed.toolMass ? ` carrying ${n(speed.toolMass)} kg of tool and carriage at T` : ''}: each load case is also solved at that speed, with d'Alembert's inertia forces and couples of every link (slender bars of their sections and materials) added, and the design forces are the largest over the static cases and the cases at speed${c && dyn !== 1 ? `; the dynamic factor γ_dyn = ${n(dyn)} of the inputs applies on top` : ''}.`
      : `The analysis is quasi-static: no operating speed is stated and no inertia force is computed${c ? `; the dynamic factor γ_dyn = ${n(dyn)} of the inputs is the only allowance for motion${dyn === 1 ? ' (none)' : ''}` : ''}.`,
  )
  const w = mech.workingRange
  if (w && mech.feasibility.ok) {
    const lim = mech.stroke.crankMaxDeg
    const gap = lim - Math.max(Math.abs(w.crankMinDeg), Math.abs(w.crankMaxDeg))
    statements.push(
      `Statics and the component checks cover the working range, crank angles ${n(w.crankMinDeg)}° to ${n(w.crankMaxDeg)}° (tracer travel ${n(2 * w.half)} mm). The full range to the locked positions, ±${n(lim)}°, is drawn as kinematics only; the working range stops ${n(gap)}° of crank angle short of it.`,
    )
  }

  if (c) {
    const f = c.factors
    const b = c.basis
    if (b.kind === 'en1993') {
      label = `EN 1993-1-8 §3.13 (pins) with EN 1993-1-1 §6.2, §6.3 (links); γM0 = ${n(b.gammaM0)}, γM1 = ${n(b.gammaM1)}, γM2 = ${n(b.gammaM2)}, γM6,ser = ${n(b.gammaM6ser)}`
      statements.push(`Limit-state format of EN 1993: design forces are the envelope × load factor ${n(f.load)} × dynamic factor ${n(f.dynamic)}, compared with design resistances using the partial factors γM0 = ${n(b.gammaM0)}, γM1 = ${n(b.gammaM1)}, γM2 = ${n(b.gammaM2)} and γM6,ser = ${n(b.gammaM6ser)} (the recommended values unless the inputs change them).`)
      const names = Object.keys(c.joints)
      const replaceable = (j?: { replaceable?: boolean }) => j?.replaceable ?? c.defaults.joint?.replaceable ?? true
      const any = replaceable() || names.some((j) => replaceable(c.joints[j]))
      const all = replaceable() && names.every((j) => replaceable(c.joints[j]))
      statements.push(
        all
          ? 'Every pin is meant to be replaceable, so the serviceability checks of EN 1993-1-8 §3.13.2(3) apply too (bearing, contact stress and pin bending under the serviceability force, envelope × dynamic factor).'
          : any
            ? `Pins meant to be replaceable (${names.filter((j) => replaceable(c.joints[j])).join(', ') || 'the defaults'}) also get the serviceability checks of EN 1993-1-8 §3.13.2(3).`
            : 'No pin is meant to be replaceable: the serviceability checks of EN 1993-1-8 §3.13.2(3) are not made.',
      )
      references.push(REF.en18, REF.en11)
    } else if (b.kind === 'aisc360') {
      label = `AISC 360-16 §D5, §J7 with §D2, §E3, §F11, §H1; ${b.method}`
      statements.push(
        b.method === 'LRFD'
          ? `LRFD format of AISC 360-16: required strengths are the envelope × load factor ${n(f.load)} × dynamic factor ${n(f.dynamic)}, compared with design strengths φR_n.`
          : `ASD format of AISC 360-16: required strengths are the envelope × load factor ${n(f.load)} × dynamic factor ${n(f.dynamic)} (service loads: keep the load factor at 1), compared with allowable strengths R_n/Ω.`,
      )
      statements.push('Pin shear has no AISC 360-16 provision for pins: it is checked by analogy with §J3.6, as each check step says. Dimensional rules of §D5.2 are reported as met or not met.')
      references.push(REF.aisc)
    } else {
      label = `allowable stress, factor of safety n_s = ${n(b.factorOfSafety)}`
      statements.push(`Allowable-stress format: stresses and forces from the envelope × load factor ${n(f.load)} × dynamic factor ${n(f.dynamic)} are compared with the yield strength (shear: 0.577 f_y) or the buckling load divided by the factor of safety n_s = ${n(b.factorOfSafety)}. No partial factors are used.`)
      references.push(REF.shigley)
    }
    statements.push('Each eye and each hole of a link is checked for the largest force any one pin puts on it over the working range; where that force turns across the link, in its worst direction (toward the nearer edge).')
    const holes = new Set<number>()
    const dj = c.defaults.joint
    if (dj?.pinDiameter !== undefined) holes.add((dj.holeDiameter ?? dj.pinDiameter + 0.1) - dj.pinDiameter)
    assumptions.push(
      m.tolerances
        ? `The ideal line is found for exact links on tight pins; the section on straightness as built adds the link tolerances (ISO 2768-1 class ${m.tolerances.toleranceClass ?? 'm'} unless a length has its own) and the hole clearance of the inputs (d₀ − d = ${[...holes].map((h) => n(h)).join(', ')} mm), each pin pushed along its force.`
        : `Pin clearances are taken as zero in the kinematics${holes.size ? `; the hole clearance of the inputs (d₀ − d = ${[...holes].map((h) => n(h)).join(', ')} mm) adds directly to the deviation from the line` : ''}.`,
    )
    references.push(...materialRefs(materials))
  } else {
    assumptions.push('Pin clearances are taken as zero: real clearances add directly to the deviation from the line.')
  }
  assumptions.push('The links lie in planes close together: out-of-plane moments at the pins are not considered.')
  return { label, statements, assumptions, references }
}
