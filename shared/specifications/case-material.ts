import type { DecisionRule } from '../schemas/case-vocabulary'
import type { Specification } from '../schemas/specifications'
import { NOT_LINKED, type CaseMaterial } from './case-conformity'
import { bandAsSpecificationRecord } from './library-record'
import { describeBand } from './size-bands'

/** What a case is linked to, as stored on the case. */
export interface CaseLink {
  specificationBand: number | null
  sectionSizeMm: number | null
  decisionRule: DecisionRule
}

/** The case's link made ready to judge with; the library record is null when none is linked. */
export function caseMaterialOf(record: Specification | null, link: CaseLink): CaseMaterial {
  const rule = link.decisionRule
  const index = link.specificationBand
  if (record === null || index === null) return { link: null, reason: NOT_LINKED, rule }
  const band = record.bands[index]
  if (band === undefined) {
    const reason = `The linked record ${record.designation} no longer has the chosen size band: conformity not judged.`
    return { link: null, reason, rule }
  }
  const summary = {
    specificationId: record.id,
    designation: record.designation,
    standard: record.standard,
    edition: record.edition,
    grade: record.grade,
    bandIndex: index,
    band: describeBand(band),
    sectionSizeMm: link.sectionSizeMm,
    unverified: record.unverified,
  }
  return { link: { summary, record: bandAsSpecificationRecord(record, band) }, reason: '', rule }
}
