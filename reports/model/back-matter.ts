/** Which closing sections a package has, numbered from where the template stopped. */
import { BACK_MATTER, type BackMatterSection } from '../components'
import type { ReportContext } from './context'
import type { ReportPackage } from '../types'

export function backMatterSections(ctx: ReportContext, start: number): BackMatterSection[] {
  const present: Record<string, boolean> = {
    'further-steps': ctx.otherSections.length > 0,
    references: true,
    cautions: true,
    // Always present, so section numbers do not move as a revision collects remarks and signatures.
    revisions: true,
    // Fixed when the revision is saved: the calc's revision before it does not change.
    changes: !!ctx.pkg.changes,
    signatures: true,
    working: hasWorkingAppendix(ctx.pkg),
  }
  const out: BackMatterSection[] = BACK_MATTER.filter((s) => present[s.id] && s.id !== 'working').map((s, i) => ({
    ...s,
    title: s.id === 'changes' ? `Changes since rev ${ctx.pkg.changes!.since}` : s.title,
    number: start + i,
  }))
  if (ctx.pkg.attachments.length > 0) out.push({ id: 'appendices', title: 'Attached documents', number: start + out.length, continues: true })
  // The working in full is the package's own appendix: lettered, after everything the body numbers.
  if (present.working) out.push({ id: 'working', title: 'Appendix: working in full', number: 'A', continues: false })
  return out
}

/** The package has its own appendix (supporting steps, sweep tables): attached documents are lettered after it. */
export function hasWorkingAppendix(pkg: ReportPackage): boolean {
  return pkg.result.steps.some((s) => s.appendix) || (pkg.result.tables ?? []).some((t) => t.id.startsWith('tab.sweep'))
}

/** Letter of the i-th attached document. */
export function attachmentLetter(pkg: ReportPackage, i: number): string {
  return String.fromCharCode(65 + i + (hasWorkingAppendix(pkg) ? 1 : 0))
}
