/**
 * Allowable-stress basis: plain mechanics against yield divided by one user
 * factor of safety. Shear yield is taken from the distortion-energy theory,
 * Ssy = 0.577 Sy (Shigley's Mechanical Engineering Design, ch. 5).
 */
import { johnsonEuler } from '../buckling'
import { bearingFy, pinMoment, plateLabel, worstPlate } from '../pin'
import { cmp, fmt, op, shownCapacity, shownDemand, type CheckSpec } from '../spec'
import { pinProps } from '../sections'
import type { BasisImpl } from './types'

const SHIGLEY = "Shigley's Mechanical Engineering Design"

export function allowableBasis(n: number): BasisImpl {
  return {
    label: `allowable stress, FoS ${fmt(n)}`,
    caution:
      'Allowable-stress basis: the factor of safety is the user’s choice; national or local codes and the customer’s specification may require other factors or methods.',
    pin(j, f) {
      const F = f.force.value
      const { A, Wel } = pinProps(j.d)
      const fyp = j.pin.fy
      const out: CheckSpec[] = []
      const tau = F / (j.shearPlanes * A)
      out.push({
        key: 'shear',
        title: `Pin shear (${j.shearPlanes === 2 ? 'double' : 'single'} shear)`,
        clause: `${SHIGLEY}: τ = F/(n A), Ssy = 0.577 Sy (distortion energy)`,
        ref: `${SHIGLEY}, ch. 5 (distortion energy)`,
        formula: '\\tau = \\frac{F}{n \\pi d^2/4} \\le \\frac{0.577 f_{y,p}}{n_s}',
        substituted: `\\tau = \\frac{${fmt(F)}}{${j.shearPlanes} \\cdot \\pi \\cdot ${fmt(j.d)}^2/4}  = ${shownDemand(tau, (0.577 * fyp) / n)} ${op(tau, (0.577 * fyp) / n)} \\frac{0.577 \\cdot ${fmt(fyp)}}{${fmt(n)}} = ${shownCapacity(tau, (0.577 * fyp) / n)}\\ \\text{MPa}`,
        demand: tau,
        capacity: (0.577 * fyp) / n,
        unit: 'MPa',
        governedBy: f.force,
        note: `pin ${j.pin.band}`,
      })
      const br = worstPlate(j, F, (p, Fp) => {
        const fy = bearingFy(j, p)
        return { result: fy, demand: Fp / (j.d * p.thickness), capacity: fy / n }
      })
      out.push({
        key: 'bearing',
        title: 'Bearing of pin on plate',
        clause: 'plain mechanics: σ = F/(d t) on the projected area',
        ref: 'plain mechanics (projected area)',
        formula: '\\sigma_b = \\frac{F_p}{d\\, t} \\le \\frac{\\min(f_{y,p}, f_y)}{n_s}',
        substituted: `\\sigma_b = \\frac{${fmt(br.force)}}{${fmt(j.d)} \\cdot ${fmt(br.plate.thickness)}}  = ${shownDemand(br.demand, br.capacity)} ${op(br.demand, br.capacity)} \\frac{${fmt(br.result)}}{${fmt(n)}} = ${shownCapacity(br.demand, br.capacity)}\\ \\text{MPa}`,
        demand: br.demand,
        capacity: br.capacity,
        unit: 'MPa',
        governedBy: f.force,
        note: `governing plate: ${plateLabel(j, br.plate)}`,
      })
      const m = pinMoment(j)
      const M = F * m.lever
      out.push({
        key: 'bending',
        title: 'Pin bending',
        clause: `${m.source}; σ = M/(πd³/32)`,
        ref: `${m.ref}; plain mechanics`,
        formula: `${m.formula}, \\quad \\sigma = \\frac{32 M}{\\pi d^3} \\le \\frac{f_{y,p}}{n_s}`,
        substituted: `${m.substituted(F)} = ${fmt(M)}, \\quad \\sigma = \\frac{${fmt(M)}}{${fmt(Wel)}} = ${shownDemand(M / Wel, fyp / n)} ${op(M / Wel, fyp / n)} \\frac{${fmt(fyp)}}{${fmt(n)}} = ${shownCapacity(M / Wel, fyp / n)}\\ \\text{MPa}`,
        demand: M / Wel,
        capacity: fyp / n,
        unit: 'MPa',
        governedBy: f.force,
      })
      return out
    },
    link(l, f) {
      const e = l.eye
      const out: CheckSpec[] = []
      const T = f.tension.value
      const E = f.eye
      // A pin force that turns across the link tears out toward the nearer edge, a or c.
      const aDir = E.across ? Math.min(e.a, e.c) : e.a
      const Ft = E.across ? E.value : T
      const Anet = (e.w - e.d0) * e.t
      out.push({
        key: 'net-tension',
        title: 'Tension on the net section at the hole',
        clause: 'plain mechanics: σ = T/((w − d0) t)',
        ref: 'plain mechanics (net section)',
        formula: '\\sigma = \\frac{T}{(w - d_0)\\, t} \\le \\frac{f_y}{n_s}',
        substituted: `\\sigma = \\frac{${fmt(T)}}{(${fmt(e.w)} - ${fmt(e.d0)}) \\cdot ${fmt(e.t)}}  = ${shownDemand(T / Anet, e.fy / n)} ${op(T / Anet, e.fy / n)} \\frac{${fmt(e.fy)}}{${fmt(n)}} = ${shownCapacity(T / Anet, e.fy / n)}\\ \\text{MPa}`,
        demand: T / Anet,
        capacity: e.fy / n,
        unit: 'MPa',
        governedBy: f.tension,
        note: 'no stress-concentration factor: adequate for ductile static design; fatigue needs its own check',
      })
      out.push({
        key: 'tear-out',
        title: E.across ? 'Shear tear-out of the eye for the pin force in its worst direction' : 'Shear tear-out of the eye end',
        clause: `two shear planes of length a; Ssy = 0.577 Sy (${SHIGLEY}) — common practice`,
        ref: `${SHIGLEY}, ch. 5 (Ssy = 0.577 Sy); two shear planes — common practice`,
        formula: '\\tau = \\frac{F}{2\\,a\\,t} \\le \\frac{0.577\\,f_y}{n_s}',
        substituted: `\\tau = \\frac{${fmt(Ft)}}{2 \\cdot ${fmt(aDir)} \\cdot ${fmt(e.t)}} = ${shownDemand(Ft / (2 * aDir * e.t), (0.577 * e.fy) / n)} ${op(Ft / (2 * aDir * e.t), (0.577 * e.fy) / n)} \\frac{0.577 \\cdot ${fmt(e.fy)}}{${fmt(n)}} = ${shownCapacity(Ft / (2 * aDir * e.t), (0.577 * e.fy) / n)}\\ \\text{MPa}`,
        demand: Ft / (2 * aDir * e.t),
        capacity: (0.577 * e.fy) / n,
        unit: 'MPa',
        governedBy: E.across ? E : f.tension,
        note: E.across ? `the pin force turns across the link over the working range: its resultant tears out toward the nearer edge, min(a, c) = ${fmt(aDir)} mm` : undefined,
      })
      const s = l.section
      const C = f.compression.value
      const lam = (l.K * l.length) / s.rMin
      const je = johnsonEuler(l.material.E, l.fy, lam)
      const Pcr = je.stress * s.A
      out.push({
        key: 'buckling',
        title: `Buckling of the link (${je.regime})`,
        clause: `${SHIGLEY}: Euler column, Johnson parabola below (l/k)_1 = sqrt(2π²CE/Sy)`,
        ref: `${SHIGLEY}, ch. 4 (Euler and Johnson columns)`,
        formula:
          je.regime === 'Johnson'
            ? 'P_{cr} = A\\left[S_y - \\left(\\frac{S_y}{2\\pi}\\frac{K l}{k}\\right)^2 \\frac{1}{E}\\right], \\quad P \\le \\frac{P_{cr}}{n_s}'
            : 'P_{cr} = \\frac{\\pi^2 E A}{(K l/k)^2}, \\quad P \\le \\frac{P_{cr}}{n_s}',
        substituted: `\\frac{K l}{k} = \\frac{${fmt(l.K)} \\cdot ${fmt(l.length)}}{${fmt(s.rMin)}} = ${fmt(lam)}, \\; \\left(\\frac{l}{k}\\right)_1 = ${fmt(je.limit)}, \\; P_{cr} = ${fmt(Pcr)}, \\; \\frac{P_{cr}}{n_s} = \\frac{${fmt(Pcr)}}{${fmt(n)}};\\; ${cmp(C, Pcr / n)}\\ \\text{N}`,
        demand: C,
        capacity: Pcr / n,
        unit: 'N',
        governedBy: f.compression,
        note: `${s.label}, least radius of gyration, K = ${fmt(l.K)}`,
      })
      const N = f.axial.value
      const Mv = f.moment?.value ?? 0
      out.push({
        key: f.moment ? 'axial-bending' : 'axial',
        title: f.moment ? 'Axial force and bending in the link body' : 'Axial stress in the link body',
        clause: 'plain mechanics: σ = N/A + M/W (largest N and M combined — conservative)',
        ref: 'plain mechanics (largest N and M combined — conservative)',
        formula: '\\sigma = \\frac{N}{A} + \\frac{M}{W_{el}} \\le \\frac{f_y}{n_s}',
        substituted: `\\sigma = \\frac{${fmt(N)}}{${fmt(s.A)}} + \\frac{${fmt(Mv)}}{${fmt(s.Wel)}}  = ${shownDemand(N / s.A + Mv / s.Wel, l.fy / n)} ${op(N / s.A + Mv / s.Wel, l.fy / n)} \\frac{${fmt(l.fy)}}{${fmt(n)}} = ${shownCapacity(N / s.A + Mv / s.Wel, l.fy / n)}\\ \\text{MPa}`,
        demand: N / s.A + Mv / s.Wel,
        capacity: l.fy / n,
        unit: 'MPa',
        governedBy: f.moment ?? f.axial,
      })
      return out
    },
  }
}
