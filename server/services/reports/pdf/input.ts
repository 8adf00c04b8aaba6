import type { FindingsDocument } from '../../../../shared/findings/document'
import type { LiveBlockSnapshots } from '../../../../shared/findings/live-blocks'

export interface PersonOnReport {
  name: string
  /** e.g. "Investigator (author)", "Reviewer", "Laboratory manager" */
  role: string
}

/**
 * Everything a report's PDF shows, already decided: the renderer reads nothing else. A draft's
 * preview fills it from the case's current data; an issued revision from its frozen copy, so the
 * same revision always prints the same.
 */
export interface ReportPdfInput {
  laboratory: { name: string; addressLines: string[] }
  report: {
    /** e.g. FL-2026-0007-R */
    number: string
    /** e.g. "A"; a draft preview names the revision it would become, or "draft" */
    revision: string
    /** ISO 8601; null for a draft */
    issuedAt: string | null
    /** an amended revision names the one it replaces and why */
    replaces?: { revision: string; reason: string } | null
    /** a preview of a draft: watermarked on every page, never the issued one */
    draft: boolean
  }
  case: {
    number: string
    title: string
    clientName: string
    clientReference: string | null
    component: string
    material: string
  }
  /** ISO dates (yyyy-mm-dd); null where nothing is recorded yet */
  dates: {
    itemsReceived: string | null
    testsFrom: string | null
    testsTo: string | null
    issued: string | null
  }
  /** null while nobody holds the part (a draft has no authoriser yet) */
  people: {
    author: PersonOnReport | null
    reviewer: PersonOnReport | null
    authoriser: PersonOnReport | null
  }
  doc: FindingsDocument
  /** figure id → the figure's PNG (marks and scale bar drawn in) as stored; caption from doc */
  figures: Record<string, { png: Buffer }>
  liveBlocks: LiveBlockSnapshots
  observations: { number: number; text: string; withdrawn: boolean }[]
  /**
   * The conformity statement: specification and edition, decision rule, uncertainty and the
   * indicative-verdict caution, one sentence a line; empty when no conformity was judged.
   */
  conformity: string[]
}
