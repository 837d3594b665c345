/**
 * Allowable-stress basis: plain mechanics against yield divided by one user
 * factor of safety. Shear yield is taken from the distortion-energy theory,
 * Ssy = 0.577 Sy (Shigley's Mechanical Engineering Design, ch. 5).
 */
import { johnsonEuler } from '../buckling'
import { bearingFy, pinMoment, plateLabel, worstPlate } from '../pin'
import { fmt, type CheckSpec } from '../spec'
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
        formula: '\\tau = \\frac{F}{n \\pi d^2/4} \\le \\frac{0.577 f_{y,p}}{n_s}',
        substituted: `\\tau = \\frac{${fmt(F)}}{${j.shearPlanes} \\cdot \\pi \\cdot ${fmt(j.d)}^2/4} = ${fmt(tau)} \\le \\frac{0.577 \\cdot ${fmt(fyp)}}{${fmt(n)}} = ${fmt((0.577 * fyp) / n)}`,
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
        formula: '\\sigma_b = \\frac{F_p}{d\\, t} \\le \\frac{\\min(f_{y,p}, f_y)}{n_s}',
        substituted: `\\sigma_b = \\frac{${fmt(br.force)}}{${fmt(j.d)} \\cdot ${fmt(br.plate.thickness)}} = ${fmt(br.demand)} \\le \\frac{${fmt(br.result)}}{${fmt(n)}} = ${fmt(br.capacity)}`,
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
        formula: `${m.formula}, \\quad \\sigma = \\frac{32 M}{\\pi d^3} \\le \\frac{f_{y,p}}{n_s}`,
        substituted: `${m.substituted(F)} = ${fmt(M)}, \\quad \\sigma = \\frac{${fmt(M)}}{${fmt(Wel)}} = ${fmt(M / Wel)} \\le \\frac{${fmt(fyp)}}{${fmt(n)}} = ${fmt(fyp / n)}`,
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
      const Anet = (e.w - e.d0) * e.t
      out.push({
        key: 'net-tension',
        title: 'Tension on the net section at the hole',
        clause: 'plain mechanics: σ = T/((w − d0) t)',
        formula: '\\sigma = \\frac{T}{(w - d_0)\\, t} \\le \\frac{f_y}{n_s}',
        substituted: `\\sigma = \\frac{${fmt(T)}}{(${fmt(e.w)} - ${fmt(e.d0)}) \\cdot ${fmt(e.t)}} = ${fmt(T / Anet)} \\le \\frac{${fmt(e.fy)}}{${fmt(n)}} = ${fmt(e.fy / n)}`,
        demand: T / Anet,
        capacity: e.fy / n,
        unit: 'MPa',
        governedBy: f.tension,
        note: 'no stress-concentration factor: adequate for ductile static design; fatigue needs its own check',
      })
      out.push({
        key: 'tear-out',
        title: 'Shear tear-out of the eye end',
        clause: `two shear planes of length a; Ssy = 0.577 Sy (${SHIGLEY}) — common practice`,
        formula: '\\tau = \\frac{T}{2 a t} \\le \\frac{0.577 f_y}{n_s}',
        substituted: `\\tau = \\frac{${fmt(T)}}{2 \\cdot ${fmt(e.a)} \\cdot ${fmt(e.t)}} = ${fmt(T / (2 * e.a * e.t))} \\le \\frac{0.577 \\cdot ${fmt(e.fy)}}{${fmt(n)}} = ${fmt((0.577 * e.fy) / n)}`,
        demand: T / (2 * e.a * e.t),
        capacity: (0.577 * e.fy) / n,
        unit: 'MPa',
        governedBy: f.tension,
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
        formula:
          je.regime === 'Johnson'
            ? 'P_{cr} = A\\left[S_y - \\left(\\frac{S_y}{2\\pi}\\frac{K l}{k}\\right)^2 \\frac{1}{E}\\right], \\quad P \\le \\frac{P_{cr}}{n_s}'
            : 'P_{cr} = \\frac{\\pi^2 E A}{(K l/k)^2}, \\quad P \\le \\frac{P_{cr}}{n_s}',
        substituted: `\\frac{K l}{k} = \\frac{${fmt(l.K)} \\cdot ${fmt(l.length)}}{${fmt(s.rMin)}} = ${fmt(lam)}, \\; \\left(\\frac{l}{k}\\right)_1 = ${fmt(je.limit)}, \\; P_{cr} = ${fmt(Pcr)}, \\; ${fmt(C)} \\le \\frac{${fmt(Pcr)}}{${fmt(n)}} = ${fmt(Pcr / n)}`,
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
        formula: '\\sigma = \\frac{N}{A} + \\frac{M}{W_{el}} \\le \\frac{f_y}{n_s}',
        substituted: `\\sigma = \\frac{${fmt(N)}}{${fmt(s.A)}} + \\frac{${fmt(Mv)}}{${fmt(s.Wel)}} = ${fmt(N / s.A + Mv / s.Wel)} \\le \\frac{${fmt(l.fy)}}{${fmt(n)}} = ${fmt(l.fy / n)}`,
        demand: N / s.A + Mv / s.Wel,
        capacity: l.fy / n,
        unit: 'MPa',
        governedBy: f.moment ?? f.axial,
      })
      return out
    },
  }
}
