/** The caution every screen footer and every PDF carries. */
export const GENERAL_CAUTION =
  'A calculation here supports but does not replace the judgement of a competent engineer. Local codes, national annexes and licensed practice govern.'
