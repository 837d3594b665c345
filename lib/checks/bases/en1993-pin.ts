/**
 * EN 1993-1-8:2005 §3.13.2, Table 3.10: resistances of a pin. fy for bearing
 * is the lower of pin and plate (Table 3.10 note); serviceability checks apply
 * when the pin is meant to be replaceable (§3.13.2(3)).
 */
import type { ResolvedJoint } from '../resolve'
import { bearingFy, pinMoment, plateLabel, worstPlate } from '../pin'
import { pinProps } from '../sections'
import { cmp, fmt, op, shownCapacity, shownDemand, type CheckSpec, type JointForces } from '../spec'

export interface EnFactors {
  gammaM0: number
  gammaM1: number
  gammaM2: number
  gammaM6ser: number
}

const T310 = 'EN 1993-1-8:2005 §3.13.2 Table 3.10'

export function enPinChecks(j: ResolvedJoint, f: JointForces, g: EnFactors): CheckSpec[] {
  const F = f.force.value
  const n = j.shearPlanes
  const { A, Wel } = pinProps(j.d)
  const { fy: fyp, fu: fup } = j.pin
  const out: CheckSpec[] = []

  const FvRd = (0.6 * A * fup) / g.gammaM2
  out.push({
    key: 'shear',
    title: `Pin shear (${n} shear plane${n === 2 ? 's' : ''})`,
    clause: `${T310}: F_v,Rd = 0.6 A f_up / γM2 per shear plane`,
    ref: T310,
    formula: 'F_{Ed} \\le n \\cdot F_{v,Rd} = n \\cdot \\frac{0.6 A f_{up}}{\\gamma_{M2}}',
    substituted: `n\\,F_{v,Rd} = ${n} \\cdot \\frac{0.6 \\cdot ${fmt(A)} \\cdot ${fmt(fup)}}{${fmt(g.gammaM2)}};\\quad ${cmp(F, n * FvRd)}\\ \\text{N}`,
    demand: F,
    capacity: n * FvRd,
    unit: 'N',
    governedBy: f.force,
    note: `pin ${j.pin.band}`,
  })

  const br = worstPlate(j, F, (p, Fp) => {
    const fy = bearingFy(j, p)
    return { result: fy, demand: Fp, capacity: (1.5 * p.thickness * j.d * fy) / g.gammaM0 }
  })
  out.push({
    key: 'bearing',
    title: 'Bearing of plate and pin',
    clause: `${T310}: F_b,Rd = 1.5 t d f_y / γM0 (f_y the lower of pin and plate)`,
    ref: T310,
    formula: 'F_{b,Ed} \\le F_{b,Rd} = \\frac{1.5\\, t\\, d\\, f_y}{\\gamma_{M0}}',
    substituted: `F_{b,Rd} = \\frac{1.5 \\cdot ${fmt(br.plate.thickness)} \\cdot ${fmt(j.d)} \\cdot ${fmt(br.result)}}{${fmt(g.gammaM0)}};\\quad ${cmp(br.force, br.capacity)}\\ \\text{N}`,
    demand: br.demand,
    capacity: br.capacity,
    unit: 'N',
    governedBy: f.force,
    note: `governing plate: ${plateLabel(j, br.plate)}`,
  })

  const m = pinMoment(j)
  const MEd = F * m.lever
  const MRd = (1.5 * Wel * fyp) / g.gammaM0
  out.push({
    key: 'bending',
    title: 'Pin bending',
    clause: `${T310}: M_Rd = 1.5 W_el f_yp / γM0; ${m.source}`,
    ref: `${T310}; ${m.ref}`,
    formula: `${m.formula} \\le M_{Rd} = \\frac{1.5 W_{el} f_{yp}}{\\gamma_{M0}}`,
    substituted: `${m.substituted(F)} = ${fmt(MEd)};\\; M_{Rd} = \\frac{1.5 \\cdot ${fmt(Wel)} \\cdot ${fmt(fyp)}}{${fmt(g.gammaM0)}};\\; ${cmp(MEd, MRd)}\\ \\text{N}{\\cdot}\\text{mm}`,
    demand: MEd,
    capacity: MRd,
    unit: 'N·mm',
    governedBy: f.force,
  })

  const FvEd = F / n
  const inter = (MEd / MRd) ** 2 + (FvEd / FvRd) ** 2
  out.push({
    key: 'shear-bending',
    title: 'Pin shear and bending combined',
    clause: `${T310}: [M_Ed/M_Rd]² + [F_v,Ed/F_v,Rd]² ≤ 1`,
    ref: T310,
    formula: '\\left[\\frac{M_{Ed}}{M_{Rd}}\\right]^2 + \\left[\\frac{F_{v,Ed}}{F_{v,Rd}}\\right]^2 \\le 1',
    substituted: `\\left[\\frac{${fmt(MEd)}}{${fmt(MRd)}}\\right]^2 + \\left[\\frac{${fmt(FvEd)}}{${fmt(FvRd)}}\\right]^2 = ${cmp(inter, 1)}`,
    demand: inter,
    capacity: 1,
    unit: '—',
    governedBy: f.force,
  })

  if (!j.replaceable) return out
  const Fs = f.service
  const serRef = 'EN 1993-1-8:2005 §3.13.2(3), Table 3.10 (replaceable pin)'
  const sb = worstPlate(j, Fs, (p, Fp) => {
    const fy = bearingFy(j, p)
    return { result: fy, demand: Fp, capacity: (0.6 * p.thickness * j.d * fy) / g.gammaM6ser }
  })
  out.push({
    key: 'bearing-ser',
    title: 'Bearing at serviceability (replaceable pin)',
    clause: `${serRef}: F_b,Rd,ser = 0.6 t d f_y / γM6,ser`,
    ref: serRef,
    formula: 'F_{b,Ed,ser} \\le F_{b,Rd,ser} = \\frac{0.6\\, t\\, d\\, f_y}{\\gamma_{M6,ser}}',
    substituted: `F_{b,Rd,ser} = \\frac{0.6 \\cdot ${fmt(sb.plate.thickness)} \\cdot ${fmt(j.d)} \\cdot ${fmt(sb.result)}}{${fmt(g.gammaM6ser)}};\\quad ${cmp(sb.force, sb.capacity)}\\ \\text{N}`,
    demand: sb.demand,
    capacity: sb.capacity,
    unit: 'N',
    governedBy: f.force,
    note: `serviceability force = envelope × dynamic factor (no load factor); governing plate: ${plateLabel(j, sb.plate)}`,
  })
  const sh = worstPlate(j, Fs, (p, Fp) => {
    const fy = bearingFy(j, p)
    const sigma = 0.591 * Math.sqrt((p.material.E * Fp * (j.d0 - j.d)) / (j.d * j.d * p.thickness))
    return { result: { fy, E: p.material.E }, demand: sigma, capacity: (2.5 * fy) / g.gammaM6ser }
  })
  out.push({
    key: 'contact-ser',
    title: 'Contact stress at serviceability (replaceable pin)',
    clause: `${serRef}: σ_h,Ed = 0.591 sqrt(E F_Ed,ser (d0 − d)/(d² t)) ≤ f_h,Rd = 2.5 f_y / γM6,ser`,
    ref: `${serRef}, Eq. (3.15), (3.16)`,
    formula: '\\sigma_{h,Ed} = 0.591\\sqrt{\\frac{E F_{Ed,ser} (d_0 - d)}{d^2 t}} \\le \\frac{2.5 f_y}{\\gamma_{M6,ser}}',
    substituted: `0.591\\sqrt{\\frac{${fmt(sh.result.E)} \\cdot ${fmt(sh.force)} \\cdot (${fmt(j.d0)} - ${fmt(j.d)})}{${fmt(j.d)}^2 \\cdot ${fmt(sh.plate.thickness)}}} = ${shownDemand(sh.demand, sh.capacity)}\\ \\text{MPa} ${op(sh.demand, sh.capacity)} \\frac{2.5 \\cdot ${fmt(sh.result.fy)}}{${fmt(g.gammaM6ser)}} = ${shownCapacity(sh.demand, sh.capacity)}\\ \\text{MPa}`,
    demand: sh.demand,
    capacity: sh.capacity,
    unit: 'MPa',
    governedBy: f.force,
    note: `governing plate: ${plateLabel(j, sh.plate)}`,
  })
  const Ms = Fs * m.lever
  const MRdSer = (0.8 * Wel * fyp) / g.gammaM6ser
  out.push({
    key: 'bending-ser',
    title: 'Pin bending at serviceability (replaceable pin)',
    clause: `${serRef}: M_Rd,ser = 0.8 W_el f_yp / γM6,ser`,
    ref: serRef,
    formula: 'M_{Ed,ser} \\le M_{Rd,ser} = \\frac{0.8 W_{el} f_{yp}}{\\gamma_{M6,ser}}',
    substituted: `M_{Rd,ser} = \\frac{0.8 \\cdot ${fmt(Wel)} \\cdot ${fmt(fyp)}}{${fmt(g.gammaM6ser)}};\\quad ${cmp(Ms, MRdSer)}\\ \\text{N}{\\cdot}\\text{mm}`,
    demand: Ms,
    capacity: MRdSer,
    unit: 'N·mm',
    governedBy: f.force,
  })
  return out
}
