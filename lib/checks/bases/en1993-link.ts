/**
 * EN 1993 checks of a link: eye geometry (EN 1993-1-8 Table 3.9), net and
 * gross section (EN 1993-1-1 §6.2.3), flexural buckling (§6.3.1) and, for
 * three-pin links, bending with axial force (§6.2.5 and the linear sum of
 * §6.2.1(7), which is conservative).
 */
import { enChi } from '../buckling'
import type { ResolvedLink } from '../resolve'
import { cmp, fmt, op, shownCapacity, shownDemand, type CheckSpec, type LinkForces } from '../spec'
import type { EnFactors } from './en1993-pin'

const T39 = 'EN 1993-1-8:2005 §3.13.1 Table 3.9'

function table39(l: ResolvedLink, f: LinkForces, g: EnFactors): CheckSpec[] {
  const e = l.eye
  const E = f.eye
  const F = E.value
  const base = (F * g.gammaM0) / (2 * e.t * e.fy)
  const where = E.joint ? ` (largest at pin ${E.joint})` : ''
  if (e.table39Type === 'A') {
    const aReq = base + (2 * e.d0) / 3
    const cReq = base + e.d0 / 3
    // A force that turns across the link points at the side edge somewhere in the stroke: the side
    // distance c then has to meet the rule for the distance in the direction of the force.
    const cRule = E.across ? aReq : cReq
    return [
      {
        key: 'eye-end',
        title: 'Eye end distance a for the pin force (Table 3.9 type A)',
        clause: `${T39} type A: a ≥ F_Ed γM0/(2 t f_y) + 2d0/3`,
        ref: `${T39}, type A`,
        formula: 'a \\ge \\frac{F_{Ed}\\,\\gamma_{M0}}{2\\,t\\,f_y} + \\frac{2 d_0}{3}',
        substituted: `a_{req} = \\frac{${fmt(F)} \\cdot ${fmt(g.gammaM0)}}{2 \\cdot ${fmt(e.t)} \\cdot ${fmt(e.fy)}} + \\frac{2 \\cdot ${fmt(e.d0)}}{3} = ${shownDemand(aReq, e.a)}\\ \\text{mm} ${op(aReq, e.a)} a = ${shownCapacity(aReq, e.a)}\\ \\text{mm}`,
        demand: aReq,
        capacity: e.a,
        unit: 'mm',
        governedBy: E,
        note: `F_Ed is the largest pin force on the link's eyes${where}, in N; sized for tension and compression alike — conservative where an end only pushes`,
      },
      {
        key: 'eye-side',
        title: E.across ? 'Eye side distance c for the pin force in its worst direction (Table 3.9 type A)' : 'Eye side distance c (Table 3.9 type A)',
        clause: E.across ? `${T39} type A: c ≥ F_Ed γM0/(2 t f_y) + 2d0/3 (force across the link)` : `${T39} type A: c ≥ F_Ed γM0/(2 t f_y) + d0/3`,
        ref: `${T39}, type A`,
        formula: E.across ? 'c \\ge \\frac{F_{Ed}\\,\\gamma_{M0}}{2\\,t\\,f_y} + \\frac{2 d_0}{3}' : 'c \\ge \\frac{F_{Ed}\\,\\gamma_{M0}}{2\\,t\\,f_y} + \\frac{d_0}{3}',
        substituted: `c_{req} = ${fmt(base)} + \\frac{${E.across ? '2 \\cdot ' : ''}${fmt(e.d0)}}{3} = ${shownDemand(cRule, e.c)}\\ \\text{mm} ${op(cRule, e.c)} c = \\frac{${fmt(e.w)} - ${fmt(e.d0)}}{2} = ${shownCapacity(cRule, e.c)}\\ \\text{mm}`,
        demand: cRule,
        capacity: e.c,
        unit: 'mm',
        governedBy: E,
        note: E.across
          ? `the pin force turns across the link over the working range, so it points at the side edge in its worst direction: c takes the rule for the distance in the force direction${where}`
          : undefined,
      },
    ]
  }
  const tReq = 0.7 * Math.sqrt((F * g.gammaM0) / e.fy)
  return [
    {
      key: 'eye-thickness',
      title: 'Eye thickness for the pin force (Table 3.9 type B)',
      clause: `${T39} type B: t ≥ 0.7 sqrt(F_Ed γM0 / f_y)`,
      ref: `${T39}, type B`,
      formula: 't \\ge 0.7\\sqrt{\\frac{F_{Ed}\\,\\gamma_{M0}}{f_y}}',
      substituted: `t_{req} = 0.7\\sqrt{\\frac{${fmt(F)} \\cdot ${fmt(g.gammaM0)}}{${fmt(e.fy)}}} = ${shownDemand(tReq, e.t)}\\ \\text{mm} ${op(tReq, e.t)} t = ${shownCapacity(tReq, e.t)}\\ \\text{mm}`,
      demand: tReq,
      capacity: e.t,
      unit: 'mm',
      governedBy: E,
      note: `F_Ed is the largest pin force on the link's eyes${where}, in any direction`,
    },
    {
      key: 'eye-hole',
      title: 'Hole diameter (Table 3.9 type B)',
      clause: `${T39} type B: d0 ≤ 2.5 t`,
      ref: `${T39}, type B`,
      kind: 'detailing',
      formula: 'd_0 \\le 2.5\\, t',
      substituted: `${shownDemand(e.d0, 2.5 * e.t)}\\ \\text{mm} ${op(e.d0, 2.5 * e.t)} 2.5 \\cdot ${fmt(e.t)} = ${shownCapacity(e.d0, 2.5 * e.t)}\\ \\text{mm}`,
      demand: e.d0,
      capacity: 2.5 * e.t,
      unit: 'mm',
    },
  ]
}

export function enLinkChecks(l: ResolvedLink, f: LinkForces, g: EnFactors): CheckSpec[] {
  const e = l.eye
  const s = l.section
  const out = table39(l, f, g)
  const T = f.tension.value
  const Anet = (e.w - e.d0) * e.t
  const NuRd = (0.9 * Anet * e.fu) / g.gammaM2
  out.push({
    key: 'net-tension',
    title: 'Tension on the net section at the hole',
    clause: 'EN 1993-1-1:2005 §6.2.3(2)b: N_u,Rd = 0.9 A_net f_u / γM2',
    ref: 'EN 1993-1-1:2005 §6.2.3(2)b, Eq. (6.7)',
    formula: 'N_{Ed} \\le N_{u,Rd} = \\frac{0.9\\,A_{net}\\,f_u}{\\gamma_{M2}}',
    substituted: `N_{u,Rd} = \\frac{0.9 \\cdot (${fmt(e.w)} - ${fmt(e.d0)}) \\cdot ${fmt(e.t)} \\cdot ${fmt(e.fu)}}{${fmt(g.gammaM2)}};\\quad ${cmp(T, NuRd)}\\ \\text{N}`,
    demand: T,
    capacity: NuRd,
    unit: 'N',
    governedBy: f.tension,
  })
  const N = f.axial.value
  const NplRd = (s.A * l.fy) / g.gammaM0
  const M = f.moment?.value ?? 0
  const McRd = (s.Wel * l.fy) / g.gammaM0
  const inter = N / NplRd + M / McRd
  out.push({
    key: f.moment ? 'axial-bending' : 'axial',
    title: f.moment ? 'Axial force and bending in the link body' : 'Axial resistance of the gross section',
    clause: f.moment
      ? 'EN 1993-1-1:2005 §6.2.1(7) linear sum with §6.2.3 N_pl,Rd and §6.2.5 M_c,Rd = W_el f_y/γM0'
      : 'EN 1993-1-1:2005 §6.2.3(2)a / §6.2.4: N_pl,Rd = A f_y / γM0',
    ref: f.moment ? 'EN 1993-1-1:2005 §6.2.1(7), §6.2.3, §6.2.5' : 'EN 1993-1-1:2005 §6.2.3(2)a, §6.2.4',
    formula: '\\frac{N_{Ed}}{A\\,f_y/\\gamma_{M0}} + \\frac{M_{Ed}}{W_{el}\\,f_y/\\gamma_{M0}} \\le 1',
    substituted: `\\frac{${fmt(N)}}{${fmt(NplRd)}} + \\frac{${fmt(M)}}{${fmt(McRd)}} = ${cmp(inter, 1)}`,
    demand: inter,
    capacity: 1,
    unit: '—',
    governedBy: f.moment ?? f.axial,
    note: `${s.label}, ${l.band}`,
  })
  const C = f.compression.value
  const Lcr = l.K * l.length
  const lambda1 = Math.PI * Math.sqrt(l.material.E / l.fy)
  const lambdaBar = Lcr / s.rMin / lambda1
  const { chi, phi, alpha } = enChi(lambdaBar, l.curve)
  const NbRd = (chi * s.A * l.fy) / g.gammaM1
  out.push({
    key: 'buckling',
    title: 'Flexural buckling of the link',
    clause: `EN 1993-1-1:2005 §6.3.1.1–6.3.1.3, curve ${l.curve} (α = ${alpha})`,
    ref: `EN 1993-1-1:2005 §6.3.1.1–6.3.1.3, Table 6.1, curve ${l.curve}`,
    formula:
      '\\bar\\lambda = \\frac{L_{cr}}{i\\,\\lambda_1},\\; \\Phi = 0.5\\left[1 + \\alpha(\\bar\\lambda - 0.2) + \\bar\\lambda^2\\right],\\; \\chi = \\frac{1}{\\Phi + \\sqrt{\\Phi^2 - \\bar\\lambda^2}},\\; N_{b,Rd} = \\frac{\\chi A f_y}{\\gamma_{M1}}',
    substituted: `\\bar\\lambda = \\frac{${fmt(Lcr)}}{${fmt(s.rMin)} \\cdot ${fmt(lambda1)}} = ${fmt(lambdaBar)},\\; \\Phi = ${fmt(phi)},\\; \\chi = ${fmt(chi)},\\; N_{b,Rd} = \\frac{${fmt(chi)} \\cdot ${fmt(s.A)} \\cdot ${fmt(l.fy)}}{${fmt(g.gammaM1)}};\\; ${cmp(C, NbRd)}\\ \\text{N}`,
    demand: C,
    capacity: NbRd,
    unit: 'N',
    governedBy: f.compression,
    note: `${s.label}, least radius of gyration, L_cr = K·L with K = ${fmt(l.K)}; solid sections are curve c in Table 6.2`,
  })
  return out
}
