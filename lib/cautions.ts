/** The caution every screen footer, every check result and every PDF carries — one wording. */
export const GENERAL_CAUTION =
  'This calculation supports but does not replace the judgement of a competent engineer; local codes, national annexes and licensed practice govern.'
