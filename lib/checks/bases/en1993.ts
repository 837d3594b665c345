import { enLinkChecks } from './en1993-link'
import { enPinChecks, type EnFactors } from './en1993-pin'
import type { BasisImpl } from './types'

export function en1993Basis(g: EnFactors): BasisImpl {
  return {
    label: `EN 1993 (γM0 ${g.gammaM0}, γM1 ${g.gammaM1}, γM2 ${g.gammaM2}, γM6,ser ${g.gammaM6ser})`,
    caution:
      'EN 1993: the partial factors γM0, γM1, γM2 and γM6,ser are the recommended values unless changed; the National Annex of the country of use may set others, and local codes may add requirements.',
    pin: (j, f) => enPinChecks(j, f, g),
    link: (l, f) => enLinkChecks(l, f, g),
  }
}
