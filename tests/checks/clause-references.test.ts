/**
 * Every check cites a clause, and the citation is exactly the one written out here: a test that fails
 * when any clause reference (section, table, equation number, φ/Ω, the rule in words) changes, or when a
 * check appears without a row in this table. `clause` is what the API and CLI print; `ref` is the
 * reference alone, printed beside the working in the package (the step's `source`).
 *
 * The numbering was checked against the structure of the standards (from memory, not against a copy):
 * - EN 1993-1-8:2005 §3.13.1 "Pin connected members", Table 3.9 (geometry of pin ended members, type A:
 *   given thickness, type B: given geometry); §3.13.2 "Design of pins", Table 3.10 (shear, bearing, bending,
 *   combined, and the serviceability values for a replaceable pin), §3.13.2(3) replaceable pin with
 *   eq. (3.15) σ_h,Ed and (3.16) f_h,Rd; Fig. 3.11 the bending moment in a pin.
 * - EN 1993-1-1:2005 §6.2.1(7) linear interaction, §6.2.3(2) a) N_pl,Rd eq. (6.6) and b) N_u,Rd eq. (6.7),
 *   §6.2.4 compression, §6.2.5 bending, §6.3.1.1–6.3.1.3 flexural buckling with Table 6.1 (α) and Table 6.2
 *   (curve c for solid sections).
 * - AISC 360-16 §D5.1 (a) tensile rupture Eq. D5-1, (b) shear rupture Eq. D5-2, (c) bearing per §J7,
 *   (d) gross yielding per §D2(a) Eq. D2-1; §D5.2 dimensional requirements; §J7(a) Eq. J7-1; §E3 Eq. E3-2
 *   (inelastic, L_c/r ≤ 4.71 √(E/F_y)) and E3-3 (elastic); §F11.1 M_n = F_y Z ≤ 1.6 F_y S_x; §H1.1 Eq. H1-1a
 *   (P_r/P_c ≥ 0.2) and H1-1b; φ/Ω 0.75/2.00 for §D5.1(a)–(c) and §J7, 0.90/1.67 for §D2, §E and §F.
 * - Shigley's Mechanical Engineering Design: distortion energy Ssy = 0.577 Sy (ch. 5), Euler and Johnson
 *   columns (ch. 4) — chapter numbers from memory.
 */
import { describe, expect, it } from 'vitest'
import { checkComponent, checksInputSchema } from '@/lib/checks'
import { HAND_MATERIALS } from './_hand'

const T39 = 'EN 1993-1-8:2005 §3.13.1 Table 3.9'
const T310 = 'EN 1993-1-8:2005 §3.13.2 Table 3.10'
const SER = 'EN 1993-1-8:2005 §3.13.2(3), Table 3.10 (replaceable pin)'
const FIG311 = 'EN 1993-1-8:2005 Fig. 3.11 (fork with middle plate b, outer plates a, gaps c)'
const LAP = 'single shear: couple between the bearing resultants — common practice'
const LAP_REF = 'couple between the bearing resultants (single shear) — common practice'
const SH = "Shigley's Mechanical Engineering Design"

type Row = [clause: string, ref: string]
type Table = Record<string, Row>

const enPin = (fork: boolean): Table => ({
  shear: [`${T310}: F_v,Rd = 0.6 A f_up / γM2 per shear plane`, T310],
  bearing: [`${T310}: F_b,Rd = 1.5 t d f_y / γM0 (f_y the lower of pin and plate)`, T310],
  bending: [`${T310}: M_Rd = 1.5 W_el f_yp / γM0; ${fork ? FIG311 : LAP}`, `${T310}; ${fork ? 'EN 1993-1-8:2005 Fig. 3.11' : LAP_REF}`],
  'shear-bending': [`${T310}: [M_Ed/M_Rd]² + [F_v,Ed/F_v,Rd]² ≤ 1`, T310],
  'bearing-ser': [`${SER}: F_b,Rd,ser = 0.6 t d f_y / γM6,ser`, SER],
  'contact-ser': [`${SER}: σ_h,Ed = 0.591 sqrt(E F_Ed,ser (d0 − d)/(d² t)) ≤ f_h,Rd = 2.5 f_y / γM6,ser`, `${SER}, Eq. (3.15), (3.16)`],
  'bending-ser': [`${SER}: M_Rd,ser = 0.8 W_el f_yp / γM6,ser`, SER],
})

const enLink = (type: 'A' | 'B', moment: boolean, across: boolean): Table => ({
  ...(type === 'A'
    ? {
        'eye-end': [`${T39} type A: a ≥ F_Ed γM0/(2 t f_y) + 2d0/3`, `${T39}, type A`],
        'eye-side': [across ? `${T39} type A: c ≥ F_Ed γM0/(2 t f_y) + 2d0/3 (force across the link)` : `${T39} type A: c ≥ F_Ed γM0/(2 t f_y) + d0/3`, `${T39}, type A`],
      }
    : {
        'eye-thickness': [`${T39} type B: t ≥ 0.7 sqrt(F_Ed γM0 / f_y)`, `${T39}, type B`],
        'eye-hole': [`${T39} type B: d0 ≤ 2.5 t`, `${T39}, type B`],
      }),
  'net-tension': ['EN 1993-1-1:2005 §6.2.3(2)b: N_u,Rd = 0.9 A_net f_u / γM2', 'EN 1993-1-1:2005 §6.2.3(2)b, Eq. (6.7)'],
  ...(moment
    ? { 'axial-bending': ['EN 1993-1-1:2005 §6.2.1(7) linear sum with §6.2.3 N_pl,Rd and §6.2.5 M_c,Rd = W_el f_y/γM0', 'EN 1993-1-1:2005 §6.2.1(7), §6.2.3, §6.2.5'] }
    : { axial: ['EN 1993-1-1:2005 §6.2.3(2)a / §6.2.4: N_pl,Rd = A f_y / γM0', 'EN 1993-1-1:2005 §6.2.3(2)a, §6.2.4'] }),
  buckling: ['EN 1993-1-1:2005 §6.3.1.1–6.3.1.3, curve c (α = 0.49)', 'EN 1993-1-1:2005 §6.3.1.1–6.3.1.3, Table 6.1, curve c'],
})

const aiscPin = (m: 'LRFD' | 'ASD', fork: boolean): Table => {
  const f1 = m === 'LRFD' ? 'φ = 0.75' : 'Ω = 2'
  const f2 = m === 'LRFD' ? 'φ = 0.9' : 'Ω = 1.67'
  return {
    shear: [`not a D5/J7 provision: shear by analogy with §J3.6, F_nv = 0.563 F_u (threads excluded; Commentary J3.6 — from memory), ${f1}`, 'by analogy with AISC 360-16 §J3.6 (Commentary J3.6) — from memory'],
    bearing: [`AISC 360-16 §J7(a), Eq. J7-1, ${f1} (F_y the lower of pin and plate)`, 'AISC 360-16 §J7(a), Eq. J7-1'],
    bending: [
      `AISC 360-16 §F11.1 (solid round: M_n = F_y Z ≤ 1.6 F_y S_x), ${f2}; moment from ${fork ? FIG311 : LAP}`,
      `AISC 360-16 §F11.1; ${fork ? 'EN 1993-1-8:2005 Fig. 3.11' : LAP_REF}`,
    ],
  }
}

const aiscLink = (m: 'LRFD' | 'ASD', eq: 'E3-2' | 'E3-3', h1?: 'H1-1a' | 'H1-1b'): Table => {
  const f1 = m === 'LRFD' ? 'φ = 0.75' : 'Ω = 2'
  const f2 = m === 'LRFD' ? 'φ = 0.9' : 'Ω = 1.67'
  return {
    'tensile-rupture': [`AISC 360-16 §D5.1(a), Eq. D5-1, ${f1}; b_e = 2t + 0.63 in (2t + 16 mm) ≤ actual`, 'AISC 360-16 §D5.1(a), Eq. D5-1'],
    'shear-rupture': [`AISC 360-16 §D5.1(b), Eq. D5-2, ${f1}; A_sf = 2t(a + d/2)`, 'AISC 360-16 §D5.1(b), Eq. D5-2'],
    bearing: [`AISC 360-16 §D5.1(c) with §J7(a), Eq. J7-1, ${f1}`, 'AISC 360-16 §D5.1(c), §J7(a), Eq. J7-1'],
    'gross-yielding': [`AISC 360-16 §D5.1(d) with §D2(a), Eq. D2-1, ${f2}`, 'AISC 360-16 §D5.1(d), §D2(a), Eq. D2-1'],
    'd52-extension': ['AISC 360-16 §D5.2', 'AISC 360-16 §D5.2'],
    'd52-width': ['AISC 360-16 §D5.2', 'AISC 360-16 §D5.2'],
    'd52-hole': ['AISC 360-16 §D5.2 (pin providing relative movement under full load)', 'AISC 360-16 §D5.2'],
    buckling: [`AISC 360-16 §E3, Eq. ${eq}, ${f2}, E = 200 000 MPa`, `AISC 360-16 §E3, Eq. ${eq}`],
    ...(h1
      ? { 'axial-bending': [`AISC 360-16 §H1.1 (Eq. ${h1}) with §F11.1 M_n = F_y Z ≤ 1.6 F_y S_x; lateral-torsional buckling not evaluated`, `AISC 360-16 §H1.1, Eq. ${h1}; §F11.1`] as Row }
      : {}),
  }
}

const allowPin = (fork: boolean): Table => ({
  shear: [`${SH}: τ = F/(n A), Ssy = 0.577 Sy (distortion energy)`, `${SH}, ch. 5 (distortion energy)`],
  bearing: ['plain mechanics: σ = F/(d t) on the projected area', 'plain mechanics (projected area)'],
  bending: [`${fork ? FIG311 : LAP}; σ = M/(πd³/32)`, `${fork ? 'EN 1993-1-8:2005 Fig. 3.11' : LAP_REF}; plain mechanics`],
})

const allowLink = (moment: boolean): Table => ({
  'net-tension': ['plain mechanics: σ = T/((w − d0) t)', 'plain mechanics (net section)'],
  'tear-out': [`two shear planes of length a; Ssy = 0.577 Sy (${SH}) — common practice`, `${SH}, ch. 5 (Ssy = 0.577 Sy); two shear planes — common practice`],
  buckling: [`${SH}: Euler column, Johnson parabola below (l/k)_1 = sqrt(2π²CE/Sy)`, `${SH}, ch. 4 (Euler and Johnson columns)`],
  [moment ? 'axial-bending' : 'axial']: ['plain mechanics: σ = N/A + M/W (largest N and M combined — conservative)', 'plain mechanics (largest N and M combined — conservative)'],
})

const pin = (fork: boolean) => ({ pinDiameter: 20, holeDiameter: 20.5, pinMaterial: 'Pin400', arrangement: fork ? 'double' : 'single', middle: { thickness: 10, material: 'Plate250' }, outer: { thickness: 4 }, gap: 2, replaceable: true })
/** Slender flat link: KL/r = 500/2.887 = 173 > 4.71 √(200 000/300) = 121.6 → E3-3 (elastic). */
const slender = (type: 'A' | 'B') => ({ section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { thickness: 10, width: 60, pinDiameter: 20, holeDiameter: 21, edgeAlong: 12, table39Type: type }, length: 500 })
/** Stocky round link: KL/r = 100/5 = 20 → E3-2 (inelastic). */
const stocky = { section: { shape: 'round', diameter: 20 }, material: 'Bar300', eye: { thickness: 12, width: 50, pinDiameter: 16, holeDiameter: 16.5, edgeAlong: 20 }, length: 100 }

function cited(basis: object, target: { joint?: object; link?: object; forces?: object }): Record<string, Row> {
  const input = checksInputSchema.parse({ basis, materials: HAND_MATERIALS, ...(target.joint ? { joints: { J: target.joint } } : { links: { L: target.link } }) })
  const r = target.joint ? checkComponent(input, 'J', { kind: 'joint', force: 1000 }) : checkComponent(input, 'L', { kind: 'link', ...(target.forces as object) })
  return Object.fromEntries(r.checks.map((c) => [c.stepId.split('.').pop()!, [c.clause, r.steps.find((s) => s.id === c.stepId)!.source ?? ''] as Row]))
}

const EN = { kind: 'en1993', gammaM0: 1.1, gammaM1: 1.15, gammaM2: 1.3, gammaM6ser: 1.05 }
const small = { tension: 1000, compression: 1000, eye: 1200 }

describe('the clause each check cites', () => {
  it('EN 1993: pins (fork and lap, replaceable)', () => {
    expect(cited(EN, { joint: pin(true) })).toEqual(enPin(true))
    expect(cited(EN, { joint: pin(false) })).toEqual(enPin(false))
  })
  it('EN 1993: links, Table 3.9 type A across and along, type B, with and without a moment', () => {
    expect(cited(EN, { link: slender('A'), forces: { ...small, moment: 1000, across: true } })).toEqual(enLink('A', true, true))
    expect(cited(EN, { link: slender('A'), forces: small })).toEqual(enLink('A', false, false))
    expect(cited(EN, { link: slender('B'), forces: { ...small, moment: 1000, across: true } })).toEqual(enLink('B', true, true))
  })
  for (const m of ['LRFD', 'ASD'] as const) {
    const basis = { kind: 'aisc360', method: m }
    it(`AISC 360-16 ${m}: pins`, () => {
      expect(cited(basis, { joint: pin(true) })).toEqual(aiscPin(m, true))
      expect(cited(basis, { joint: pin(false) })).toEqual(aiscPin(m, false))
    })
    it(`AISC 360-16 ${m}: links — E3-3 and H1-1b (slender, small axial force), E3-2 and H1-1a (stocky, large axial force), no H1 without a moment`, () => {
      expect(cited(basis, { link: slender('A'), forces: { ...small, moment: 1000, across: true } })).toEqual(aiscLink(m, 'E3-3', 'H1-1b'))
      expect(cited(basis, { link: stocky, forces: { tension: 60000, compression: 50000, moment: 1000 } })).toEqual(aiscLink(m, 'E3-2', 'H1-1a'))
      expect(cited(basis, { link: slender('B'), forces: small })).toEqual(aiscLink(m, 'E3-3'))
    })
  }
  it('AISC 360-16 §H1.1: at P_r/P_c = 0.2 exactly the clause and the reference both cite H1-1a (P_r/P_c ≥ 0.2)', () => {
    // LRFD, K so small that F_cr = F_y: P_c = min(0.9·300·600, 0.9·300·600) = 162 000 N; N = 32 400 N → 0.2 exactly
    const c = cited({ kind: 'aisc360', method: 'LRFD' }, {
      link: { section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { pinDiameter: 20, holeDiameter: 21, edgeAlong: 25 }, length: 500, effectiveLengthFactor: 1e-9 },
      forces: { tension: 32400, moment: 1093500 },
    })
    expect(c['axial-bending']).toEqual(aiscLink('LRFD', 'E3-2', 'H1-1a')['axial-bending'])
  })
  it('allowable stress: pins and links', () => {
    const basis = { kind: 'allowable', factorOfSafety: 2.4 }
    expect(cited(basis, { joint: pin(true) })).toEqual(allowPin(true))
    expect(cited(basis, { joint: pin(false) })).toEqual(allowPin(false))
    expect(cited(basis, { link: slender('A'), forces: { ...small, moment: 1000 } })).toEqual(allowLink(true))
    expect(cited(basis, { link: stocky, forces: small })).toEqual(allowLink(false))
  })
})
