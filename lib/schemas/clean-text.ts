/**
 * Text people type is stored as typed, minus what no one types on purpose: NUL and the other C0/C1
 * control characters (a NUL once turned a title into "null"). Single-line fields (names, titles)
 * also turn tabs and line breaks into spaces; multi-line fields (remarks) keep \n and \t.
 */
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/g
// eslint-disable-next-line no-control-regex
const LINE_BREAKS = /[\t\n\r\u2028\u2029]+/g

export function stripControl(text: string, opts: { multiline?: boolean } = {}): string {
  const kept = text.replace(CONTROL, '')
  return opts.multiline ? kept.replace(/\r\n?/g, '\n') : kept.replace(LINE_BREAKS, ' ').replace(/ {2,}/g, ' ')
}

/** True when `stripControl` would change the text (to refuse rather than strip, where that fits better). */
export function hasControl(text: string): boolean {
  return new RegExp(CONTROL.source).test(text)
}
