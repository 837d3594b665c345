import type { FileStore } from '@/lib/storage'
import type { ReportPackage } from '@/reports/types'

/** The report pipeline, passed in: the app runs it in the worker pool, tests and scripts import it directly. */
export interface ReportRenderer {
  /** The package's body (react-pdf): rendered once per revision and stored. */
  renderBody(pkg: ReportPackage): Promise<Uint8Array>
  /** Stamps a body for the package's state and signatures and appends the sign-off record and appendices. */
  finishPdf(body: Uint8Array, pkg: ReportPackage): Promise<Uint8Array>
}

export interface RevisionDeps {
  renderer: ReportRenderer
  store: FileStore
}

/** Where a revision's body is kept: written once by its render job, read by every signature. */
export const bodyKey = (revisionId: string) => `bodies/${revisionId}.pdf`
