/** Which closing sections a package has, numbered from where the template stopped. */
import { BACK_MATTER, type BackMatterSection } from '../components'
import type { ReportContext } from './context'

export function backMatterSections(ctx: ReportContext, start: number): BackMatterSection[] {
  const present: Record<string, boolean> = {
    'further-steps': ctx.otherSections.length > 0,
    references: true,
    cautions: true,
    revisions: ctx.pkg.history.length > 0 || ctx.pkg.remarks.length > 0,
    signatures: true,
  }
  const out: BackMatterSection[] = BACK_MATTER.filter((s) => present[s.id]).map((s, i) => ({ ...s, number: start + i }))
  if (ctx.pkg.attachments.length > 0) out.push({ id: 'appendices', title: 'Appendices', number: start + out.length, continues: true })
  return out
}
