/** Which closing sections a package has, numbered from where the template stopped. */
import { BACK_MATTER, type BackMatterSection } from '../components'
import type { ReportContext } from './context'

export function backMatterSections(ctx: ReportContext, start: number): BackMatterSection[] {
  const present: Record<string, boolean> = {
    'further-steps': ctx.otherSections.length > 0,
    references: true,
    cautions: true,
    // Always present, so section numbers do not move as a revision collects remarks and signatures.
    revisions: true,
    signatures: true,
  }
  const out: BackMatterSection[] = BACK_MATTER.filter((s) => present[s.id]).map((s, i) => ({ ...s, number: start + i }))
  if (ctx.pkg.attachments.length > 0) out.push({ id: 'appendices', title: 'Appendices', number: start + out.length, continues: true })
  return out
}
