/**
 * AISC 360-16: pin-connected members (§D5), bearing on pins (§J7), gross
 * yielding (§D2(a)), compression (§E3) and, for pins and three-pin links,
 * flexure of solid sections (§F11) with §H1.1 interaction. LRFD divides by
 * nothing and multiplies by φ; ASD divides by Ω — one helper does both.
 */
import { aiscFcr } from '../buckling'
import { bearingFy, pinMoment, plateLabel, worstPlate } from '../pin'
import type { ResolvedLink } from '../resolve'
import { pinProps } from '../sections'
import { cmp, fmt, op, shownCapacity, shownDemand, type CheckSpec, type LinkForces } from '../spec'
import { toSI } from '@/lib/units'
import type { BasisImpl } from './types'

/** AISC 360-16 uses E = 29 000 ksi (200 000 MPa) for steel regardless of the grade's own sheet value. */
const E_AISC = 200000
/** be = 2t + 0.63 in: the 0.63 in is 16 mm in the metric form of Eq. D5-1; exact conversion kept. */
const BE_ADD = toSI(0.63, 'in')
/** D5.2: hole at most 1/32 in larger than the pin when the pin moves under load. */
const HOLE_OVERSIZE = toSI(1 / 32, 'in')

type Method = 'LRFD' | 'ASD'

function design(method: Method, Rn: number, phi: number, omega: number): { value: number; tex: string } {
  return method === 'LRFD'
    ? { value: phi * Rn, tex: `\\phi R_n = ${phi} \\cdot ${fmt(Rn)} = ${fmt(phi * Rn)}` }
    : { value: Rn / omega, tex: `R_n/\\Omega = ${fmt(Rn)}/${omega} = ${fmt(Rn / omega)}` }
}

function fac(method: Method, phi: number, omega: number): string {
  return method === 'LRFD' ? `φ = ${phi}` : `Ω = ${omega}`
}

function linkChecks(l: ResolvedLink, f: LinkForces, method: Method): CheckSpec[] {
  const e = l.eye
  const s = l.section
  const T = f.tension.value
  const E = f.eye
  const out: CheckSpec[] = []
  // A pin force that turns across the link points at the side edge somewhere in the working range:
  // the eye is then checked for the resultant with the smaller of a and c as the distance in the force direction.
  const worst = E.across
  const b = worst ? Math.min(e.a, e.c) : e.c
  const aDir = worst ? Math.min(e.a, e.c) : e.a
  const Fr = worst ? E.value : T
  const gov = worst ? E : f.tension
  const worstNote = worst ? `the pin force turns across the link over the working range: its resultant is taken in its worst direction, with min(a, c) = ${fmt(aDir)} mm as the distance in that direction` : undefined
  const be = Math.min(2 * e.t + BE_ADD, b)
  const rup = design(method, e.fu * 2 * e.t * be, 0.75, 2.0)
  out.push({
    key: 'tensile-rupture',
    title: worst ? 'Tensile rupture of the eye for the pin force in its worst direction' : 'Tensile rupture on the net effective area',
    clause: `AISC 360-16 §D5.1(a), Eq. D5-1, ${fac(method, 0.75, 2.0)}; b_e = 2t + 0.63 in (2t + 16 mm) ≤ actual`,
    ref: `AISC 360-16 §D5.1(a), Eq. D5-1`,
    formula: 'P_n = F_u\\,(2\\,t\\,b_e),\\; b_e = \\min(2t + 0.63\\,\\text{in},\\ b)',
    substituted: `b_e = \\min(2 \\cdot ${fmt(e.t)} + ${fmt(BE_ADD)},\\ ${fmt(b)}) = ${fmt(be)},\\; P_n = ${fmt(e.fu)} \\cdot 2 \\cdot ${fmt(e.t)} \\cdot ${fmt(be)},\\; ${rup.tex};\\; ${cmp(Fr, rup.value)}\\ \\text{N}`,
    demand: Fr,
    capacity: rup.value,
    unit: 'N',
    governedBy: gov,
    note: worstNote,
  })
  const Asf = 2 * e.t * (aDir + e.d / 2)
  const sr = design(method, 0.6 * e.fu * Asf, 0.75, 2.0)
  out.push({
    key: 'shear-rupture',
    title: worst ? 'Shear rupture of the eye for the pin force in its worst direction' : 'Shear rupture of the eye end',
    clause: `AISC 360-16 §D5.1(b), Eq. D5-2, ${fac(method, 0.75, 2.0)}; A_sf = 2t(a + d/2)`,
    ref: 'AISC 360-16 §D5.1(b), Eq. D5-2',
    formula: 'P_n = 0.6\\,F_u\\,A_{sf},\\; A_{sf} = 2t\\left(a + \\frac{d}{2}\\right)',
    substituted: `A_{sf} = 2 \\cdot ${fmt(e.t)} \\cdot (${fmt(aDir)} + ${fmt(e.d)}/2) = ${fmt(Asf)},\\; ${sr.tex};\\; ${cmp(Fr, sr.value)}\\ \\text{N}`,
    demand: Fr,
    capacity: sr.value,
    unit: 'N',
    governedBy: gov,
    note: worstNote,
  })
  const N = f.axial.value
  const bp = design(method, 1.8 * e.fy * e.d * e.t, 0.75, 2.0)
  out.push({
    key: 'bearing',
    title: 'Bearing of the pin on the eye',
    clause: `AISC 360-16 §D5.1(c) with §J7(a), Eq. J7-1, ${fac(method, 0.75, 2.0)}`,
    ref: 'AISC 360-16 §D5.1(c), §J7(a), Eq. J7-1',
    formula: 'R_n = 1.8\\,F_y\\,A_{pb},\\; A_{pb} = d\\, t',
    substituted: `R_n = 1.8 \\cdot ${fmt(e.fy)} \\cdot ${fmt(e.d)} \\cdot ${fmt(e.t)},\\; ${bp.tex};\\; ${cmp(Math.max(N, E.value), bp.value)}\\ \\text{N}`,
    demand: Math.max(N, E.value),
    capacity: bp.value,
    unit: 'N',
    governedBy: E.value > N ? E : f.axial,
    note: 'the resultant pin force on the eye, in any direction',
  })
  const gy = design(method, l.fy * s.A, 0.9, 1.67)
  out.push({
    key: 'gross-yielding',
    title: 'Yielding on the gross section',
    clause: `AISC 360-16 §D5.1(d) with §D2(a), Eq. D2-1, ${fac(method, 0.9, 1.67)}`,
    ref: 'AISC 360-16 §D5.1(d), §D2(a), Eq. D2-1',
    formula: 'P_n = F_y\\,A_g',
    substituted: `P_n = ${fmt(l.fy)} \\cdot ${fmt(s.A)},\\; ${gy.tex};\\; ${cmp(T, gy.value)}\\ \\text{N}`,
    demand: T,
    capacity: gy.value,
    unit: 'N',
    governedBy: f.tension,
    note: `${s.label}, ${l.band}`,
  })
  const beDim = Math.min(2 * e.t + BE_ADD, e.c)
  out.push({
    key: 'd52-extension',
    title: 'Extension beyond the hole a ≥ 1.33 b_e',
    clause: 'AISC 360-16 §D5.2',
    ref: 'AISC 360-16 §D5.2',
    kind: 'detailing',
    formula: 'a \\ge 1.33\\, b_e',
    substituted: `1.33 \\cdot ${fmt(beDim)} = ${shownDemand(1.33 * beDim, e.a)}\\ \\text{mm} ${op(1.33 * beDim, e.a)} a = ${shownCapacity(1.33 * beDim, e.a)}\\ \\text{mm}`,
    demand: 1.33 * beDim,
    capacity: e.a,
    unit: 'mm',
  })
  out.push({
    key: 'd52-width',
    title: 'Width at the hole w ≥ 2 b_e + d',
    clause: 'AISC 360-16 §D5.2',
    ref: 'AISC 360-16 §D5.2',
    kind: 'detailing',
    formula: 'w \\ge 2 b_e + d',
    substituted: `2 \\cdot ${fmt(beDim)} + ${fmt(e.d)} = ${shownDemand(2 * beDim + e.d, e.w)}\\ \\text{mm} ${op(2 * beDim + e.d, e.w)} w = ${shownCapacity(2 * beDim + e.d, e.w)}\\ \\text{mm}`,
    demand: 2 * beDim + e.d,
    capacity: e.w,
    unit: 'mm',
  })
  out.push({
    key: 'd52-hole',
    title: 'Hole oversize d0 − d ≤ 1/32 in (moving pin)',
    clause: 'AISC 360-16 §D5.2 (pin providing relative movement under full load)',
    ref: 'AISC 360-16 §D5.2',
    kind: 'detailing',
    formula: 'd_0 - d \\le \\tfrac{1}{32}\\,\\text{in}',
    substituted: `${fmt(e.d0)} - ${fmt(e.d)} = ${shownDemand(e.d0 - e.d, HOLE_OVERSIZE)}\\ \\text{mm} ${op(e.d0 - e.d, HOLE_OVERSIZE)} ${shownCapacity(e.d0 - e.d, HOLE_OVERSIZE)}\\ \\text{mm}`,
    demand: e.d0 - e.d,
    capacity: HOLE_OVERSIZE,
    unit: 'mm',
  })
  const C = f.compression.value
  const slender = (l.K * l.length) / s.rMin
  const c = aiscFcr(E_AISC, l.fy, slender)
  const Pc = design(method, c.Fcr * s.A, 0.9, 1.67)
  out.push({
    key: 'buckling',
    title: `Flexural buckling of the link (${c.inelastic ? 'inelastic' : 'elastic'})`,
    clause: `AISC 360-16 §E3, Eq. ${c.inelastic ? 'E3-2' : 'E3-3'}, ${fac(method, 0.9, 1.67)}, E = 200 000 MPa`,
    ref: `AISC 360-16 §E3, Eq. ${c.inelastic ? 'E3-2' : 'E3-3'}`,
    formula: c.inelastic
      ? 'F_e = \\frac{\\pi^2 E}{(L_c/r)^2},\\; F_{cr} = 0.658^{F_y/F_e} F_y,\\; P_n = F_{cr} A_g'
      : 'F_e = \\frac{\\pi^2 E}{(L_c/r)^2},\\; F_{cr} = 0.877 F_e,\\; P_n = F_{cr} A_g',
    substituted: `\\frac{L_c}{r} = ${fmt(slender)},\\; F_e = ${fmt(c.Fe)},\\; F_{cr} = ${fmt(c.Fcr)},\\; ${Pc.tex};\\; ${cmp(C, Pc.value)}\\ \\text{N}`,
    demand: C,
    capacity: Pc.value,
    unit: 'N',
    governedBy: f.compression,
  })
  if (f.moment) {
    const M = f.moment.value
    const Mc = design(method, Math.min(l.fy * s.Wpl, 1.6 * l.fy * s.Wel), 0.9, 1.67)
    const Pcap = Math.min(Pc.value, gy.value)
    const ratio = N / Pcap
    const inter = ratio >= 0.2 ? ratio + (8 / 9) * (M / Mc.value) : ratio / 2 + M / Mc.value
    out.push({
      key: 'axial-bending',
      title: 'Axial force and bending in the link body',
      clause: `AISC 360-16 §H1.1 (Eq. ${ratio >= 0.2 ? 'H1-1a' : 'H1-1b'}) with §F11.1 M_n = F_y Z ≤ 1.6 F_y S_x; lateral-torsional buckling not evaluated`,
      ref: `AISC 360-16 §H1.1, Eq. ${ratio >= 0.2 ? 'H1-1a' : 'H1-1b'}; §F11.1`,
      formula: '\\frac{P_r}{P_c} + \\frac{8}{9}\\frac{M_r}{M_c} \\le 1 \\;\\text{or}\\; \\frac{P_r}{2P_c} + \\frac{M_r}{M_c} \\le 1',
      substituted: `\\frac{P_r}{P_c} = \\frac{${fmt(N)}}{${fmt(Pcap)}} = ${fmt(ratio)},\\; M_r = ${fmt(M)},\\; M_c = ${fmt(Mc.value)},\\; \\text{sum} = ${cmp(inter, 1)}`,
      demand: inter,
      capacity: 1,
      unit: '—',
      governedBy: f.moment,
      note: 'largest axial force and largest moment combined — conservative',
    })
  }
  return out
}

export function aiscBasis(method: Method): BasisImpl {
  return {
    label: `AISC 360-16 ${method}`,
    caution:
      'AISC 360-16: φ and Ω are the specification’s values; the building code or owner’s specification in force may change load combinations and requirements.',
    pin(j, f) {
      const F = f.force.value
      const n = j.shearPlanes
      const { A, Wel, Wpl } = pinProps(j.d)
      const sh = design(method, n * 0.563 * j.pin.fu * A, 0.75, 2.0)
      const br = worstPlate(j, F, (p, Fp) => {
        const fy = bearingFy(j, p)
        const Rn = 1.8 * fy * j.d * p.thickness
        const Rd = design(method, Rn, 0.75, 2.0)
        return { result: { fy, Rn, tex: Rd.tex }, demand: Fp, capacity: Rd.value }
      })
      const m = pinMoment(j)
      const M = F * m.lever
      const Mn = Math.min(j.pin.fy * Wpl, 1.6 * j.pin.fy * Wel)
      const Mc = design(method, Mn, 0.9, 1.67)
      return [
        {
          key: 'shear',
          title: `Pin shear (${n} shear plane${n === 2 ? 's' : ''})`,
          clause: `not a D5/J7 provision: shear by analogy with §J3.6, F_nv = 0.563 F_u (threads excluded; Commentary J3.6 — from memory), ${fac(method, 0.75, 2.0)}`,
          ref: 'by analogy with AISC 360-16 §J3.6 (Commentary J3.6) — from memory',
          formula: 'R_n = n \\cdot 0.563 F_u A_b',
          substituted: `R_n = ${n} \\cdot 0.563 \\cdot ${fmt(j.pin.fu)} \\cdot ${fmt(A)},\\; ${sh.tex};\\; ${cmp(F, sh.value)}\\ \\text{N}`,
          demand: F,
          capacity: sh.value,
          unit: 'N',
          governedBy: f.force,
          note: `pin ${j.pin.band}`,
        },
        {
          key: 'bearing',
          title: 'Bearing of the pin on the plates',
          clause: `AISC 360-16 §J7(a), Eq. J7-1, ${fac(method, 0.75, 2.0)} (F_y the lower of pin and plate)`,
          ref: 'AISC 360-16 §J7(a), Eq. J7-1',
          formula: 'R_n = 1.8 F_y A_{pb},\\; A_{pb} = d\\, t',
          substituted: `R_n = 1.8 \\cdot ${fmt(br.result.fy)} \\cdot ${fmt(j.d)} \\cdot ${fmt(br.plate.thickness)} = ${fmt(br.result.Rn)},\\; ${br.result.tex};\\; ${cmp(br.force, br.capacity)}\\ \\text{N}`,
          demand: br.demand,
          capacity: br.capacity,
          unit: 'N',
          governedBy: f.force,
          note: `governing plate: ${plateLabel(j, br.plate)}`,
        },
        {
          key: 'bending',
          title: 'Pin bending',
          clause: `AISC 360-16 §F11.1 (solid round: M_n = F_y Z ≤ 1.6 F_y S_x), ${fac(method, 0.9, 1.67)}; moment from ${m.source}`,
          ref: `AISC 360-16 §F11.1; ${m.ref}`,
          formula: `${m.formula},\\; M_n = \\min(F_y Z, 1.6 F_y S_x)`,
          substituted: `${m.substituted(F)} = ${fmt(M)},\\; M_n = ${fmt(Mn)},\\; ${Mc.tex};\\; ${cmp(M, Mc.value)}\\ \\text{N}{\\cdot}\\text{mm}`,
          demand: M,
          capacity: Mc.value,
          unit: 'N·mm',
          governedBy: f.force,
        },
      ]
    },
    link: (l, f) => linkChecks(l, f, method),
  }
}
