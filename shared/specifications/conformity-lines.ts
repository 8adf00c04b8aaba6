import { UNVERIFIED_MARK } from '../schemas/specifications'
import type { CaseConformity, MaterialLinkSummary } from './case-conformity'

/** The linked record and band in one line, e.g. "42CrMo4+QT … (EN 10083-3, edition 2006), over 16 up to 40 mm". */
export function describeLink(link: MaterialLinkSummary): string {
  const edition = link.edition ? `edition ${link.edition}` : 'edition not stated'
  const size = link.sectionSizeMm === null ? '' : `; section ${link.sectionSizeMm} mm`
  return `${link.designation} ${link.grade} (${link.standard}, ${edition}), size band ${link.band}${size}`
}

/**
 * The written statement of one judged record (ISO/IEC 17025 7.8.6): what it was judged against,
 * the decision rule with its uncertainty, the caution, and the unverified mark when the limits
 * are starter limits nobody checked. A record not judged says why.
 */
export function conformityLines(judged: CaseConformity): string[] {
  if (!judged.judged) return [judged.reason]
  const lines = [
    `Specification: ${describeLink(judged.link)}.`,
    `Decision rule: ${judged.conformity.rule}.`,
    judged.conformity.caution,
  ]
  if (judged.link.unverified) lines.push(UNVERIFIED_MARK)
  return lines
}
